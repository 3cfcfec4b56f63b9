package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Fifty writer programs, each killed with SIGKILL at a random moment while it appends runs to
 * one trail: every run a writer reported committed is there whole, a run killed mid-write leaves
 * no trace, and the chain verifies after every kill. Slow (fifty JVMs), so it runs in
 * {@code mvn verify}, not in every {@code mvn test}.
 */
class AuditCrashIT {
  @TempDir Path dir;

  @Test
  void runsSurviveTheWriterBeingKilledAtRandomMomentsWholeOrNotAtAll() throws Exception {
    Path db = dir.resolve("audit.db");
    Random random = new Random(20260415L);
    int kills = 50;
    List<List<String>> acknowledged = new ArrayList<>();
    for (int k = 0; k < kills; k++) {
      AuditCrashAndConcurrencyTest.Child child =
          AuditCrashAndConcurrencyTest.start(db, random.nextLong(), 0, "kill" + k);
      // Killed at a random moment once it is writing: mostly inside a run's transaction.
      assertThat(child.firstCommit().await(120, TimeUnit.SECONDS)).as("child %d writes", k).isTrue();
      Thread.sleep(random.nextInt(120));
      child.process().destroyForcibly();
      assertThat(child.process().waitFor(30, TimeUnit.SECONDS)).isTrue();
      // Every report the writer printed is read before it is counted: a loaded machine can
      // leave several in the pipe when the writer dies.
      child.reader().join(120_000);
      assertThat(child.reader().isAlive()).as("reports of writer %d read to the end", k).isFalse();
      acknowledged.add(List.copyOf(child.committed()));
      try (AuditStore store = AuditStore.open(db)) {
        assertThat(store.verify().problem()).as("after kill %d", k).isEmpty();
      }
    }
    try (AuditStore store = AuditStore.open(db)) {
      List<RunSummary> runs = store.listRuns(Optional.empty(), Optional.empty());
      Set<String> present = new HashSet<>();
      for (RunSummary s : runs) {
        present.add(s.runId());
        RunRecord run = store.loadRun(s.runId()).orElseThrow();
        assertThat(run.inputs()).hasSize(AuditWriterChild.INPUTS)
            .allSatisfy(in -> assertThat(in.sizeBytes()).isEqualTo(AuditWriterChild.INPUT_BYTES));
        assertThat(run.blocks()).hasSize(AuditWriterChild.BLOCKS)
            .allSatisfy(b -> assertThat(b.rules()).hasSize(AuditWriterChild.RULES_PER_BLOCK));
      }
      int unacknowledged = 0;
      for (int k = 0; k < kills; k++) {
        // A writer numbers its runs kill<k>-0, -1, ... and reports each after its commit. So
        // the trail holds exactly the runs it reported, in order, and at most one more: the run
        // committed in the instant between the commit and the report.
        String tag = "kill" + k + "-";
        List<String> acked = acknowledged.get(k);
        long mine = present.stream().filter(id -> id.startsWith(tag)).count();
        assertThat(mine).as("runs of writer %d (reported %d)", k, acked.size())
            .isBetween((long) acked.size(), acked.size() + 1L);
        for (int i = 0; i < mine; i++) {
          assertThat(present).as("writer %d's runs form an unbroken series", k).contains(tag + i);
        }
        unacknowledged += (int) (mine - acked.size());
      }
      int reported = acknowledged.stream().mapToInt(List::size).sum();
      System.out.printf("%d kills: %d runs reported, %d present (%d committed but killed before"
          + " reporting), %d records%n", kills, reported, present.size(), unacknowledged,
          store.verify().recordCount());
      assertThat(reported).as("runs reported").isGreaterThanOrEqualTo(kills);
      // The trail's first record is the schema step that created it.
      assertThat(store.verify().recordCount())
          .isEqualTo(AuditSamples.SCHEMA_STEP_RECORDS + runs.size() * (1L + AuditWriterChild.INPUTS + AuditWriterChild.BLOCKS
              * (1L + AuditWriterChild.RULES_PER_BLOCK)));
    }
  }
}
