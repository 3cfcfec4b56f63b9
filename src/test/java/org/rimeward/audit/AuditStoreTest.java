package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;
import org.sqlite.SQLiteConfig;

class AuditStoreTest {
  static final LocalDate NIGHT = LocalDate.of(2026, 4, 15);
  static final Instant AT = Instant.parse("2026-04-15T18:15:03.123456789Z");

  @TempDir Path dir;

  Path db() {
    return dir.resolve("audit.db");
  }

  @Test
  void aRunIsLoadedBackEqualToWhatWasRecorded() {
    RunRecord run = AuditSamples.sampleRun("2026-04-15T181503.123Z-0000abcd", AT, NIGHT);
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.appendRun(run)).isEqualTo(run.runId());
    }
    try (AuditStore store = AuditStore.open(db())) {
      RunRecord back = store.loadRun(run.runId()).orElseThrow();
      assertThat(back).isEqualTo(run);
      assertThat(back.ranAt()).isEqualTo(AT);
      assertThat(back.inputs().get(3).content()).containsExactly(0, 1, 2, 0xff);
      assertThat(back.inputs().get(4).content()).isEmpty();
      assertThat(back.blocks()).extracting(RecordedBlock::blockId)
          .containsExactly("north-gala", "south-bartlett", "east-row-covers");
      assertThat(back.blocks().get(0).rules()).extracting(RecordedRule::seq).containsExactly(1, 4);
      assertThat(back.planJson()).isEqualTo(AuditSamples.PLAN_JSON);
      assertThat(store.verify().intact()).isTrue();
      // The schema steps that created the file, then the run, its 5 inputs, 3 blocks and 4 rules.
      assertThat(store.verify().recordCount())
          .isEqualTo(AuditSamples.SCHEMA_STEP_RECORDS + 1 + 5 + 3 + 4);
    }
  }

  @Test
  void runsAreListedNewestFirstAndFoundByPrefixBlockAndNight() {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("2026-04-14T180000.000Z-00000001",
          Instant.parse("2026-04-14T18:00:00Z"), NIGHT.minusDays(1)));
      store.appendRun(AuditSamples.sampleRun("2026-04-15T180000.000Z-00000002",
          Instant.parse("2026-04-15T18:00:00Z"), NIGHT));
      store.appendRun(AuditSamples.sampleRun("2026-04-15T200000.000Z-00000003",
          Instant.parse("2026-04-15T20:00:00Z"), NIGHT));
      List<RunSummary> all = store.listRuns(Optional.empty(), Optional.empty());
      assertThat(all).extracting(RunSummary::runId).containsExactly(
          "2026-04-15T200000.000Z-00000003", "2026-04-15T180000.000Z-00000002",
          "2026-04-14T180000.000Z-00000001");
      assertThat(all.get(0).protectionNeededCount()).isEqualTo(2);
      assertThat(all.get(0).blockCount()).isEqualTo(3);
      assertThat(store.listRuns(Optional.of(NIGHT), Optional.empty())).hasSize(2);
      assertThat(store.listRuns(Optional.empty(), Optional.of("north-gala"))).hasSize(3);
      assertThat(store.listRuns(Optional.empty(), Optional.of("no-such-block"))).isEmpty();

      assertThat(store.loadRun("2026-04-14").orElseThrow().night()).isEqualTo(NIGHT.minusDays(1));
      assertThatThrownBy(() -> store.loadRun("2026-04-15"))
          .isInstanceOf(BadInputException.class).hasMessageContaining("matches 2 runs");
      assertThat(store.loadRun("2027")).isEmpty();
      assertThat(store.latestRunFor("north-gala", NIGHT).orElseThrow().runId())
          .isEqualTo("2026-04-15T200000.000Z-00000003");
      assertThat(store.latestRunFor("north-gala", NIGHT.plusDays(1))).isEmpty();
    }
  }

  @Test
  void aDuplicateRunIdIsRefusedAndLeavesTheChainAsItWas() {
    RunRecord run = AuditSamples.sampleRun("dup-1", AT, NIGHT);
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(run);
      long before = store.verify().recordCount();
      assertThatThrownBy(() -> store.appendRun(run)).isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("already recorded");
      assertThat(store.verify().recordCount()).isEqualTo(before);
      assertThat(store.verify().intact()).isTrue();
    }
  }

  @Test
  void profileEditsAreRecordedInOrderAndChained() {
    ProfileEdit a = new ProfileEdit(Instant.parse("2026-04-10T07:00:00Z"), "agronomist",
        "crop-profiles/apple.yaml", "apple", "Gala", "tight cluster", "t10", -2.8, -3.1,
        "buds cut 9 April at first light: hardier than the table");
    ProfileEdit b = new ProfileEdit(Instant.parse("2026-04-11T07:00:00Z"), "manager",
        "crop-profiles/apple.yaml", "apple", "Honeycrisp", null, "variety", null, null,
        "new variety planted in west block");
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
      store.appendProfileEdit(a);
      store.appendProfileEdit(b);
      assertThat(store.listProfileEdits()).containsExactly(a, b);
      assertThat(store.verify().intact()).isTrue();
    }
  }

  @Test
  void changingOneByteOfARecordedRuleIsNamedByVerify() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
      store.appendRun(AuditSamples.sampleRun("r2", AT.plusSeconds(60), NIGHT));
    }
    long seq;
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.execute("DROP TRIGGER run_rules_no_update");
      var rs = st.executeQuery("SELECT seq FROM run_rules WHERE run_id = 'r1'"
          + " AND rule_id = 'protect.sprinkle'");
      seq = rs.getLong(1);
      rs.close();
      // "3.8" becomes "3.9" inside the facts the rule used: one byte.
      st.executeUpdate("UPDATE run_rules SET facts_json = replace(facts_json, '3.8', '3.9')"
          + " WHERE seq = " + seq);
    }
    try (AuditStore store = AuditStore.open(db())) {
      VerifyResult v = store.verify();
      assertThat(v.intact()).isFalse();
      assertThat(v.brokenSeq()).contains(seq);
      assertThat(v.problem().orElseThrow()).isEqualTo("record " + seq
          + " (run_rules, run r1 block north-gala rule #4 protect.sprinkle) hash does not match"
          + " its content");
      assertThatThrownBy(() -> store.loadRun("r1")).isInstanceOf(AuditIntegrityException.class)
          .hasMessageContaining("record " + seq);
      assertThat(store.loadRun("r2")).isPresent();
    }
  }

  @Test
  void theTriggersRefuseUpdatesAndDeletes() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      assertThatThrownBy(() -> st.executeUpdate("UPDATE runs SET farm_name = 'x'"))
          .hasMessageContaining("append-only");
      assertThatThrownBy(() -> st.executeUpdate("DELETE FROM records"))
          .hasMessageContaining("append-only");
    }
  }

  @Test
  void aDeletedRowIsReportedMissing() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
      store.appendRun(AuditSamples.sampleRun("r2", AT.plusSeconds(60), NIGHT));
    }
    long seq;
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.execute("DROP TRIGGER run_blocks_no_delete");
      var rs = st.executeQuery("SELECT seq FROM run_blocks WHERE run_id = 'r1'"
          + " AND block_id = 'south-bartlett'");
      seq = rs.getLong(1);
      rs.close();
      st.executeUpdate("DELETE FROM run_blocks WHERE seq = " + seq);
    }
    try (AuditStore store = AuditStore.open(db())) {
      VerifyResult v = store.verify();
      assertThat(v.problem().orElseThrow())
          .isEqualTo("record " + seq + " (run_blocks) is missing: its row in run_blocks was deleted");
    }
  }

  @Test
  void aDeletedChainRecordAndItsRowAreReportedAsAGap() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.execute("DROP TRIGGER records_no_delete");
      st.execute("DROP TRIGGER run_inputs_no_delete");
      st.executeUpdate("DELETE FROM run_inputs WHERE seq = 3");
      st.executeUpdate("DELETE FROM records WHERE seq = 3");
    }
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.verify().problem().orElseThrow())
          .isEqualTo("record 3 is missing: the chain goes from record 2 to record 4");
    }
  }

  @Test
  void theNewestRecordsOfARunCutOffAreSeenFromTheRunsOwnCounts() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.execute("DROP TRIGGER records_no_delete");
      st.execute("DROP TRIGGER run_rules_no_delete");
      st.executeUpdate("DELETE FROM run_rules WHERE seq = (SELECT max(seq) FROM records)");
      st.executeUpdate("DELETE FROM records WHERE seq = (SELECT max(seq) FROM records)");
    }
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.verify().problem().orElseThrow())
          .isEqualTo("record " + (AuditSamples.SCHEMA_STEP_RECORDS + 1) + " (runs, run r1) lists 4 rules but 3 are recorded: the run's newest"
              + " records are missing");
    }
  }

  @Test
  void aRowSlippedInOutsideTheChainIsFound() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendProfileEdit(new ProfileEdit(AT, "a", "f.yaml", "apple", null, null, "t10",
          -2.8, -3.0, "cut buds"));
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.executeUpdate("INSERT INTO profile_edits VALUES (7, 'x', 'y', 'f.yaml', 'apple', null,"
          + " null, 't90', -6.1, -9.0, 'forged')");
    }
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.verify().problem().orElseThrow()).contains("a row of profile_edits")
          .contains("seq 7").contains("not in the chain");
    }
  }

  @Test
  void flippingOneByteOfTheDatabaseFileIsDetected() throws Exception {
    byte[] marker = AuditSamples.utf8("MARKER-for-the-byte-flip-test");
    RunRecord base = AuditSamples.sampleRun("r1", AT, NIGHT);
    List<RecordedInput> inputs = new java.util.ArrayList<>(base.inputs());
    inputs.add(RecordedInput.of(InputKind.FORECAST, "forecast/marked.csv", marker));
    RunRecord run = new RunRecord("r1", AT, "0.1.0", "Hillside Orchard", NIGHT, "Europe/Berlin",
        "{}", inputs, base.blocks(), base.cautions(), base.planJson());
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(run);
    }
    // The last connection closed checkpoints the WAL into the main file.
    assertThat(Files.exists(dir.resolve("audit.db-wal"))).isFalse();
    byte[] file = Files.readAllBytes(db());
    int at = indexOf(file, marker);
    assertThat(at).isPositive();
    file[at + 7] ^= 0x20; // 'f' becomes 'F'
    Files.write(db(), file);
    try (AuditStore store = AuditStore.openReadOnly(db())) {
      assertThat(store.verify().problem().orElseThrow()).contains("run_inputs")
          .contains("input forecast/marked.csv").contains("hash does not match its content");
    }
  }

  @Test
  void aReadOnlyDatabaseRefusesARunWithAClearMessageAndKeepsNothing() {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    try (AuditStore ro = AuditStore.openReadOnly(db())) {
      assertThatThrownBy(() -> ro.appendRun(AuditSamples.sampleRun("r2", AT, NIGHT)))
          .isInstanceOf(AuditUnavailableException.class)
          .hasMessageContaining(db().toString())
          .hasMessageContaining("read-only")
          .hasMessageContaining("Nothing of it was recorded")
          .hasMessageContaining("What to do");
      assertThat(ro.listRuns(Optional.empty(), Optional.empty())).hasSize(1);
    }
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.loadRun("r2")).isEmpty();
      assertThat(store.verify().intact()).isTrue();
    }
  }

  @Test
  void aWriterLockedOutTooLongGetsAClearMessageAndKeepsNothing() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    SQLiteConfig cfg = new SQLiteConfig();
    try (Connection holder = cfg.createConnection("jdbc:sqlite:" + db());
        Statement st = holder.createStatement();
        AuditStore store = AuditStore.open(db(), Duration.ofMillis(300))) {
      st.execute("BEGIN IMMEDIATE");
      assertThatThrownBy(() -> store.appendRun(AuditSamples.sampleRun("r2", AT, NIGHT)))
          .isInstanceOf(AuditUnavailableException.class)
          .hasMessageContaining("locked").hasMessageContaining("wait for the other");
      st.execute("ROLLBACK");
      assertThat(store.loadRun("r2")).isEmpty();
      store.appendRun(AuditSamples.sampleRun("r2", AT, NIGHT));
      assertThat(store.verify().intact()).isTrue();
    }
  }

  @Test
  void aFileThatIsNotADatabaseIsUnavailableNotAnInternalError() throws Exception {
    Files.writeString(db(), "name: Hillside\n".repeat(100));
    assertThatThrownBy(() -> AuditStore.open(db())).isInstanceOf(AuditUnavailableException.class)
        .hasMessageContaining("not a rimeward audit database");
    assertThatThrownBy(() -> AuditStore.openReadOnly(dir.resolve("none.db")))
        .isInstanceOf(AuditUnavailableException.class).hasMessageContaining("does not exist");
  }

  @Test
  void theSchemaIsVersionedAndReopeningDoesNotMigrateTwice() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.schemaVersion()).isEqualTo(Schema.latestVersion());
    }
    try (AuditStore store = AuditStore.open(db())) {
      assertThat(store.schemaVersion()).isEqualTo(Schema.latestVersion());
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      var rs = st.executeQuery("SELECT count(*) FROM schema_version");
      assertThat(rs.getInt(1)).isEqualTo(Schema.MIGRATIONS.size());
      rs.close();
      rs = st.executeQuery("PRAGMA journal_mode");
      assertThat(rs.getString(1)).isEqualTo("wal");
      rs.close();
    }
  }

  @Test
  void aSchemaVersionRowAddedByHandIsTamperingNotANewerRimeward() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.executeUpdate("INSERT INTO schema_version VALUES (99, 'later', 'from the future')");
    }
    assertThatThrownBy(() -> AuditStore.open(db())).isInstanceOf(AuditIntegrityException.class)
        .hasMessageContaining("schema version row 99").hasMessageContaining("added outside rimeward");
    assertThatThrownBy(() -> AuditStore.openReadOnly(db()))
        .isInstanceOf(AuditIntegrityException.class).hasMessageContaining("schema version row 99");
  }

  @Test
  void aTrailWrittenByANewerRimewardAsksForThatVersion() throws Exception {
    try (AuditStore store = AuditStore.open(db())) {
      store.appendRun(AuditSamples.sampleRun("r1", AT, NIGHT));
    }
    // What a later rimeward does on migrating: the version row and its step in the chain.
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db());
        Statement st = c.createStatement()) {
      st.execute("BEGIN IMMEDIATE");
      st.executeUpdate("INSERT INTO schema_version VALUES (99, 'later', 'from the future')");
      try (ChainWriter w = new ChainWriter(c)) {
        w.append(Schema.Table.SCHEMA_STEPS, 99L, "later", "from the future");
      }
      st.execute("COMMIT");
    }
    assertThatThrownBy(() -> AuditStore.open(db())).isInstanceOf(AuditUnavailableException.class)
        .hasMessageContaining("schema version 99").hasMessageContaining("newer");
  }

  @Test
  void recordsRejectInconsistentInput() {
    assertThatThrownBy(() -> new RecordedInput(InputKind.FARM, "farm.yaml", "0".repeat(64),
        new byte[] {1})).hasMessageContaining("does not match its content");
    assertThatThrownBy(() -> new RecordedBlock("b", "protected", "high", true, "{}", List.of(
        new RecordedRule(2, "a", "x", "{}"), new RecordedRule(1, "b", "y", "{}"))))
        .hasMessageContaining("firing order");
    assertThat(RunRecord.newRunId(Instant.parse("2026-04-15T18:15:03.123Z")))
        .matches("2026-04-15T181503\\.123Z-[0-9a-f]{8}");
    byte[] content = {1, 2, 3};
    RecordedInput in = RecordedInput.of(InputKind.RULE, "r.drl", content);
    content[0] = 9;
    in.content()[1] = 9;
    assertThat(in.content()).containsExactly(1, 2, 3);
  }

  private static int indexOf(byte[] hay, byte[] needle) {
    outer:
    for (int i = 0; i + needle.length <= hay.length; i++) {
      for (int j = 0; j < needle.length; j++) {
        if (hay[i + j] != needle[j]) {
          continue outer;
        }
      }
      return i;
    }
    return -1;
  }
}
