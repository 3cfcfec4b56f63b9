package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.time.Instant;
import java.time.LocalDate;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.cli.Cli;

/**
 * The anchor that makes the chain worth having: a head held outside the trail. A trail rebuilt
 * with every hash recomputed passes the chain walk alone, and must fail against the head.
 */
class AuditAnchorTest {
  static final Instant AT = Instant.parse("2026-04-15T18:00:00Z");
  static final LocalDate NIGHT = LocalDate.parse("2026-04-15");

  @TempDir Path dir;
  @TempDir Path elsewhere;
  Path farm;
  Path db;

  @BeforeEach
  void twoRuns() throws Exception {
    farm = Files.createDirectories(dir.resolve("farm"));
    db = farm.resolve("audit.db");
    record(db, AT);
  }

  private static void record(Path file, Instant firstRanAt) {
    try (AuditStore store = AuditStore.open(file)) {
      store.appendRun(AuditSamples.sampleRun("r1", firstRanAt, NIGHT));
      store.appendRun(AuditSamples.sampleRun("r2", AT.plusSeconds(600), NIGHT));
    }
  }

  private String head() {
    Cli.Result h = Cli.run("audit", "head", "--farm", farm.toString());
    assertThat(h.exitCode()).as(h.toString()).isZero();
    return h.out().strip();
  }

  @Test
  void aTrailRebuiltWithADifferentStartTimePassesTheWalkButNotTheHead() throws Exception {
    String held = head();
    assertThat(held).matches("\\d+:[0-9a-f]{64}");
    assertThat(Cli.run("audit", "verify", "--farm", farm.toString(), "--head", held).exitCode())
        .isZero();

    // Rebuilt from scratch: the first run back-dated an hour, every hash computed afresh.
    Files.delete(db);
    record(db, AT.minusSeconds(3600));
    Cli.Result walk = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(walk.exitCode()).as("the chain alone cannot tell").isZero();
    Cli.Result anchored = Cli.run("audit", "verify", "--farm", farm.toString(), "--head", held);
    assertThat(anchored.exitCode()).as(anchored.toString()).isEqualTo(4);
    assertThat(anchored.out()).startsWith("chain broken: the head " + held)
        .contains("was rewritten");
  }

  @Test
  void aTrailCutShortOrEmptiedFailsTheHead() throws Exception {
    String held = head();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
        Statement st = c.createStatement()) {
      for (String t : new String[] {"records", "runs", "run_inputs", "run_blocks", "run_rules",
          "profile_edits", "crew_actions", "file_changes", "schema_steps", "watch_alarms"}) {
        st.execute("DROP TRIGGER " + t + "_no_delete");
        st.executeUpdate("DELETE FROM " + t);
      }
    }
    // The schema step in the chain went with the rest, so the version row now stands alone.
    Cli.Result walk = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(walk.exitCode()).as(walk.toString()).isEqualTo(4);
    assertThat(walk.err()).contains("schema version row 3").contains("added outside rimeward");
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
        Statement st = c.createStatement()) {
      // One forged step record for each chained schema step (versions 3 on), linked as the tool
      // would link them.
      String prev = "0".repeat(64);
      long seq = 1;
      for (long version = 3; version < 3 + AuditSamples.SCHEMA_STEP_RECORDS; version++, seq++) {
        String hash = ChainHash.of("schema_steps", seq, prev, java.util.List.of(version, "x", "y"));
        st.executeUpdate("INSERT INTO records VALUES (" + seq + ", 'schema_steps', '" + prev
            + "', '" + hash + "')");
        st.executeUpdate("INSERT INTO schema_steps VALUES (" + seq + ", " + version + ", 'x', 'y')");
        prev = hash;
      }
    }
    assertThat(Cli.run("audit", "verify", "--farm", farm.toString()).exitCode())
        .as("with the schema step forged too, the walk alone passes").isZero();
    Cli.Result anchored = Cli.run("audit", "verify", "--farm", farm.toString(), "--head", held);
    assertThat(anchored.exitCode()).isEqualTo(4);
    assertThat(anchored.out()).contains("has no record " + held.split(":")[0]);
  }

  @Test
  void aBadHeadIsBadInput() {
    Cli.Result r = Cli.run("audit", "verify", "--farm", farm.toString(), "--head", "12:abc");
    assertThat(r.exitCode()).isEqualTo(2);
    assertThat(r.err()).contains("--head").contains("SEQ:HASH");
  }

  @Test
  void aSealSignsTheHeadAndVerifyChecksIt() throws Exception {
    Path key = elsewhere.resolve("farm-seal.key");
    Cli.Result seal = Cli.run("audit", "seal", "--farm", farm.toString(), "--new-key",
        key.toString());
    assertThat(seal.exitCode()).as(seal.toString()).isZero();
    assertThat(seal.out()).contains("sealed " + head());
    assertThat(Seals.fileFor(db)).exists();
    assertThat(Files.getPosixFilePermissions(key)).hasSize(2);

    Cli.Result ok = Cli.run("audit", "verify", "--farm", farm.toString(), "--public-key",
        Seals.publicKeyFile(key).toString());
    assertThat(ok.exitCode()).as(ok.toString()).isZero();
    assertThat(ok.out()).contains("1 seal(s) check out");

    // The trail rebuilt (the seals moved aside meanwhile and put back): the seal no longer
    // matches what the file holds.
    Path aside = elsewhere.resolve("seals");
    Files.move(Seals.fileFor(db), aside);
    Files.delete(db);
    record(db, AT.minusSeconds(3600));
    Files.move(aside, Seals.fileFor(db));
    Cli.Result rebuilt = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(rebuilt.exitCode()).as(rebuilt.toString()).isEqualTo(4);
    assertThat(rebuilt.out()).contains("seal on line 1").contains("was rewritten");

    // A seal made with another key does not pass for the farm's.
    Path other = elsewhere.resolve("other.key");
    Seals.newKey(other);
    Cli.Result foreign = Cli.run("audit", "verify", "--farm", farm.toString(), "--public-key",
        Seals.publicKeyFile(other).toString());
    assertThat(foreign.exitCode()).isEqualTo(4);
  }

  @Test
  void aForgedSealLineIsCaught() throws Exception {
    Path key = elsewhere.resolve("k");
    assertThat(Cli.run("audit", "seal", "--farm", farm.toString(), "--new-key", key.toString())
        .exitCode()).isZero();
    String line = Files.readString(Seals.fileFor(db));
    String[] p = line.strip().split(" ");
    p[1] = "1:" + "ab".repeat(32);
    Files.writeString(Seals.fileFor(db), String.join(" ", p) + "\n");
    Cli.Result r = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(r.exitCode()).isEqualTo(4);
    assertThat(r.out()).contains("signature that does not match");
  }

  @Test
  void theSigningKeyMayNotLiveInTheFarmFolder() {
    Cli.Result r = Cli.run("audit", "seal", "--farm", farm.toString(), "--new-key",
        farm.resolve("seal.key").toString());
    assertThat(r.exitCode()).isEqualTo(2);
    assertThat(r.err()).contains("inside the farm folder");
    assertThat(Seals.fileFor(db)).doesNotExist();
  }

  @Test
  void aMissingTrailWhoseSealsRemainIsNotStartedAgainSilently() throws Exception {
    assertThat(Cli.run("audit", "seal", "--farm", farm.toString(), "--new-key",
        elsewhere.resolve("k").toString()).exitCode()).isZero();
    Files.delete(db);
    Files.deleteIfExists(farm.resolve("audit.db-wal"));
    Files.deleteIfExists(farm.resolve("audit.db-shm"));
    assertThatThrownBy(() -> AuditStore.open(db)).isInstanceOf(AuditUnavailableException.class)
        .hasMessageContaining("is missing").hasMessageContaining("audit.db.seals")
        .hasMessageContaining("not started silently");
    assertThat(db).doesNotExist();
  }

  @Test
  void exportsCarryTheHeadTheyWereMadeAtAndVerifyChecksIt() throws Exception {
    String held = head();
    com.fasterxml.jackson.databind.ObjectMapper json = new com.fasterxml.jackson.databind.ObjectMapper();
    for (String[] args : new String[][] {{"audit", "show", "r1", "--json"},
        {"audit", "export", "r1", "--format", "json"}}) {
      String[] all = java.util.stream.Stream.concat(java.util.Arrays.stream(args),
          java.util.stream.Stream.of("--farm", farm.toString())).toArray(String[]::new);
      Cli.Result r = Cli.run(all);
      assertThat(r.exitCode()).as(r.toString()).isZero();
      var head = json.readTree(r.out()).path("chain_head");
      assertThat(head.path("seq").asLong() + ":" + head.path("hash").asText()).isEqualTo(held);
    }
    Cli.Result filed = Cli.run("audit", "export", "r1", "--format", "json", "--farm",
        farm.toString());
    var h = json.readTree(filed.out()).path("chain_head");
    try (AuditStore store = AuditStore.open(db)) {
      store.appendRun(AuditSamples.sampleRun("r3", AT.plusSeconds(1200), NIGHT));
    }
    assertThat(Cli.run("audit", "verify", "--farm", farm.toString(), "--head",
        h.path("seq").asLong() + ":" + h.path("hash").asText()).exitCode())
        .as("later runs do not disturb an earlier head").isZero();
  }
}
