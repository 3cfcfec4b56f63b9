package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.crop.CropLibrary;
import org.rimeward.crop.PendingChange;

/**
 * Profile edits against real processes: two programs editing one crop file at once, and a program
 * killed (SIGKILL) at random moments while it edits. The figures these print are the ones the
 * README's reliability section quotes.
 */
class ProfileEditFaultTest {
  @TempDir Path dir;

  static String java() {
    return Path.of(System.getProperty("java.home"), "bin", "java").toString();
  }

  static ProcessBuilder child(String mainClass, String... args) {
    List<String> cmd = new ArrayList<>(List.of(java(), "-XX:TieredStopAtLevel=1",
        "-XX:+UseSerialGC", "-XX:-UsePerfData", "-cp", System.getProperty("java.class.path"),
        mainClass));
    cmd.addAll(List.of(args));
    return new ProcessBuilder(cmd).redirectErrorStream(true);
  }

  private Path profiles() throws Exception {
    Path p = Files.createDirectories(dir.resolve("crop-profiles"));
    Files.copy(Path.of("crop-profiles", "apple.yaml"), p.resolve("apple.yaml"));
    return p;
  }

  /**
   * Two programs set values of two varieties in one crop file at the same moments, each a value
   * per stage. Every value lands in a place of its own, so any edit lost to the other program's
   * rename shows at the end.
   */
  @Test
  void twoProgramsEditingOneCropFileAtOnceBothLandAndBothAreRecorded() throws Exception {
    Path profiles = profiles();
    Path db = dir.resolve("audit.db");
    List<String> stages = CropLibrary.load(profiles).crop("apple").orElseThrow().stages().stream()
        .map(org.rimeward.crop.Stage::id).toList();
    List<String> a = new ArrayList<>(List.of("rome-beauty", "-3.0", profiles.toString(),
        db.toString()));
    a.addAll(stages);
    List<String> b = new ArrayList<>(List.of("winesap", "-4.0", profiles.toString(),
        db.toString()));
    b.addAll(stages);
    Process pa = child(ProfileSetLoopChild.class.getName(), a.toArray(String[]::new)).start();
    Process pb = child(ProfileSetLoopChild.class.getName(), b.toArray(String[]::new)).start();
    String outA = new String(pa.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    String outB = new String(pb.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
    assertThat(pa.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(pb.waitFor(120, TimeUnit.SECONDS)).isTrue();
    assertThat(outA.lines().filter(l -> l.equals("exit 0"))).as(outA).hasSize(stages.size());
    assertThat(outB.lines().filter(l -> l.equals("exit 0"))).as(outB).hasSize(stages.size());
    int kept = 0;
    for (int i = 0; i < stages.size(); i++) {
      for (String[] v : new String[][] {{"rome-beauty", "-3.0"}, {"winesap", "-4.0"}}) {
        double want = Double.parseDouble(v[1]) - i * 0.1;
        double got = CropLibrary.load(profiles).effective("apple", v[0]).stage(stages.get(i))
            .orElseThrow().t10C();
        if (Math.abs(got - want) < 1e-9) {
          kept++;
        }
      }
    }
    System.out.printf(Locale.ROOT, "concurrent edits: 2 programs, %d edits, %d kept in the"
        + " file%n", 2 * stages.size(), kept);
    assertThat(kept).as("every edit of both programs is in the file").isEqualTo(2 * stages.size());
    try (AuditStore store = AuditStore.openReadOnly(db)) {
      // A T10 and a T90 per edit.
      assertThat(store.listProfileEdits()).hasSize(4 * stages.size());
      assertThat(store.verify().intact()).isTrue();
      assertThat(store.unsettledChanges()).isEmpty();
    }
  }

  @Test
  void anEditKilledAtAnyMomentIsNeverInTheFileWithoutBeingInTheTrail() throws Exception {
    Path profiles = profiles();
    Path file = profiles.resolve("apple.yaml");
    Path db = dir.resolve("audit.db");
    Random random = new Random(20260416L);
    String initial = PendingChange.sha256(Files.readAllBytes(file));
    int kills = 16;
    Map<String, Integer> outcomes = new TreeMap<>();
    Map<String, Integer> lastLine = new TreeMap<>();
    for (int k = 0; k < kills; k++) {
      Process p = child(ProfileEditChild.class.getName(), db.toString(), profiles.toString(),
          Long.toString(random.nextLong())).start();
      List<String> lines = new CopyOnWriteArrayList<>();
      Thread reader = new Thread(() -> {
        try (BufferedReader r = new BufferedReader(
            new InputStreamReader(p.getInputStream(), StandardCharsets.UTF_8))) {
          for (String l; (l = r.readLine()) != null; ) {
            lines.add(l);
          }
        } catch (java.io.IOException e) {
          // The pipe closes when the child is killed.
        }
      });
      reader.start();
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
      while (lines.stream().noneMatch(l -> l.startsWith("pending"))) {
        assertThat(System.nanoTime()).as("child %d starts editing: %s", k, lines)
            .isLessThan(deadline);
        Thread.sleep(5);
      }
      Thread.sleep(random.nextInt(120));
      p.destroyForcibly();
      assertThat(p.waitFor(30, TimeUnit.SECONDS)).isTrue();
      reader.join(10_000);
      String last = lines.isEmpty() ? "none" : lines.get(lines.size() - 1).split(" ")[0];
      lastLine.merge(last, 1, Integer::sum);

      List<String> settled;
      try (AuditStore store = AuditStore.open(db)) {
        settled = store.settlePendingChanges();
        assertThat(store.verify().intact()).isTrue();
        assertThat(store.unsettledChanges()).as("after kill %d", k).isEmpty();
      }
      String outcome = settled.isEmpty() ? "nothing to settle"
          : settled.get(0).replaceAll(".*\\): ([a-z-]+):.*", "$1");
      outcomes.merge(outcome, 1, Integer::sum);
      assertThat(settled).as("after kill %d", k).hasSizeLessThanOrEqualTo(1)
          .noneMatch(l -> l.contains("found-changed"));
      assertThat(Files.readString(file)).as("the file is whole").contains("rome-beauty");
      String now = PendingChange.sha256(Files.readAllBytes(file));
      String applied = lastAppliedSha(db);
      assertThat(applied == null ? initial : applied).as("after kill %d the file holds what the trail says was"
          + " last written", k).isEqualTo(now);
    }
    System.out.printf(Locale.ROOT, "profile edit kills: %d; last step seen %s; settled as %s;"
        + " edits in the file but not in the trail: 0%n", kills, lastLine, outcomes);
  }

  /** The after-hash of the newest change the trail says reached the file. */
  private static String lastAppliedSha(Path db) throws Exception {
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
        Statement st = c.createStatement();
        ResultSet rs = st.executeQuery("SELECT sha256_after FROM file_changes WHERE state IN"
            + " ('written', 'found-written') ORDER BY settles_seq DESC LIMIT 1")) {
      return rs.next() ? rs.getString(1) : null;
    }
  }
}
