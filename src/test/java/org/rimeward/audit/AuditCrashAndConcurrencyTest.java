package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two writer programs and two threads writing one trail at once. The fifty kills are in
 * {@link AuditCrashIT}, run by {@code mvn verify}.
 */
class AuditCrashAndConcurrencyTest {
  @TempDir Path dir;

  /** A started writer program and the runs it reported committed. */
  record Child(Process process, List<String> committed, CountDownLatch ready,
      CountDownLatch firstCommit, Thread reader) {}

  static Child start(Path db, long seed, int maxRuns, String tag) throws Exception {
    String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
    // Quick-starting flags: fifty of these programs are started and killed.
    ProcessBuilder pb = new ProcessBuilder(java, "-XX:TieredStopAtLevel=1", "-XX:+UseSerialGC",
        "-XX:-UsePerfData", "-cp", System.getProperty("java.class.path"), AuditWriterChild.class.getName(),
        db.toString(), Long.toString(seed), Integer.toString(maxRuns), tag);
    pb.redirectError(ProcessBuilder.Redirect.INHERIT);
    Process p = pb.start();
    List<String> committed = new CopyOnWriteArrayList<>();
    CountDownLatch ready = new CountDownLatch(1);
    CountDownLatch firstCommit = new CountDownLatch(1);
    Thread reader = new Thread(() -> {
      try (BufferedReader r = new BufferedReader(
          new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
        for (String line; (line = r.readLine()) != null; ) {
          if (line.equals("ready")) {
            ready.countDown();
          } else if (line.startsWith("ok ")) {
            committed.add(line.substring(3));
            firstCommit.countDown();
          }
        }
      } catch (java.io.IOException e) {
        // The pipe closes when the child is killed.
      }
    });
    reader.start();
    return new Child(p, committed, ready, firstCommit, reader);
  }

  @Test
  void twoWriterProgramsAtOnceBothLandInOneChain() throws Exception {
    Path db = dir.resolve("audit.db");
    int n = 15;
    Child a = start(db, 1, n, "a");
    Child b = start(db, 2, n, "b");
    assertThat(a.process().waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(b.process().waitFor(120, TimeUnit.SECONDS)).isTrue();
    a.reader().join(10_000);
    b.reader().join(10_000);
    assertThat(a.process().exitValue()).isZero();
    assertThat(b.process().exitValue()).isZero();
    assertThat(a.committed()).hasSize(n);
    assertThat(b.committed()).hasSize(n);
    try (AuditStore store = AuditStore.open(db)) {
      assertThat(store.listRuns(Optional.empty(), Optional.empty())).hasSize(2 * n);
      VerifyResult v = store.verify();
      assertThat(v.problem()).isEmpty();
      assertThat(v.recordCount()).isEqualTo(AuditSamples.SCHEMA_STEP_RECORDS + 2L * n * (1 + AuditWriterChild.INPUTS
          + AuditWriterChild.BLOCKS * (1 + AuditWriterChild.RULES_PER_BLOCK)));
    }
  }

  @Test
  void twoThreadsWithTheirOwnConnectionsInterleaveIntoOneChain() throws Exception {
    Path db = dir.resolve("audit.db");
    AuditStore.open(db).close();
    int n = 40;
    CountDownLatch go = new CountDownLatch(1);
    List<Throwable> failures = new CopyOnWriteArrayList<>();
    List<Thread> threads = new ArrayList<>();
    for (String tag : List.of("left", "right")) {
      Thread t = new Thread(() -> {
        try (AuditStore store = AuditStore.open(db)) {
          go.await();
          for (int i = 0; i < n; i++) {
            store.appendRun(AuditSamples.sampleRun(tag + "-" + i,
                Instant.parse("2026-04-15T18:00:00Z").plusSeconds(i), LocalDate.of(2026, 4, 15)));
            if (i % 2 == 0) {
              store.appendProfileEdit(new org.rimeward.crop.ProfileEdit(Instant.now(), tag,
                  "crop-profiles/apple.yaml", "apple", "Gala", "tight cluster", "t10", -2.8, -3.0,
                  "edit " + i));
            }
          }
        } catch (Throwable e) {
          failures.add(e);
        }
      });
      threads.add(t);
      t.start();
    }
    go.countDown();
    for (Thread t : threads) {
      t.join(120_000);
    }
    assertThat(failures).isEmpty();
    try (AuditStore store = AuditStore.open(db)) {
      assertThat(store.listRuns(Optional.empty(), Optional.empty())).hasSize(2 * n);
      assertThat(store.listProfileEdits()).hasSize(n);
      VerifyResult v = store.verify();
      assertThat(v.problem()).isEmpty();
      assertThat(v.recordCount()).isEqualTo(AuditSamples.SCHEMA_STEP_RECORDS + 2L * n * 13 + n);
    }
  }
}
