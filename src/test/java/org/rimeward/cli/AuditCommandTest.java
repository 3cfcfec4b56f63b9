package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.time.Instant;
import java.time.LocalDate;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditSamples;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RunRecord;

class AuditCommandTest {
  static final String OLD = "2026-04-14T180000.000Z-0000aaaa";
  static final String NEW = "2026-04-15T181503.123Z-0000bbbb";
  static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path farm;
  Path db;
  RunRecord newest;

  @BeforeEach
  void record() {
    db = farm.resolve("audit.db");
    newest = AuditSamples.sampleRun(NEW, Instant.parse("2026-04-15T18:15:03.123Z"),
        LocalDate.of(2026, 4, 15));
    try (AuditStore store = AuditStore.open(db)) {
      store.appendRun(AuditSamples.sampleRun(OLD, Instant.parse("2026-04-14T18:00:00Z"),
          LocalDate.of(2026, 4, 14)));
      store.appendRun(newest);
    }
  }

  @Test
  void listShowsRunsNewestFirstWithTheBlocksThatNeededProtection() throws Exception {
    Cli.Result r = Cli.run("audit", "list", "--farm", farm.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    String[] lines = r.out().split("\n");
    assertThat(lines).hasSize(3);
    assertThat(lines[0]).startsWith("RUN").contains("RECORDED").contains("NIGHT");
    // Recorded 18:15 UTC: shown in the farm's own zone, as show and why do.
    assertThat(lines[1]).startsWith(NEW).contains("2026-04-15 20:15 CEST").contains("2026-04-15")
        .endsWith("2 of 3 blocks");
    assertThat(lines[2]).startsWith(OLD);

    Cli.Result since = Cli.run("audit", "list", "--audit", db.toString(), "--since", "2026-04-15",
        "--json");
    assertThat(since.exitCode()).isZero();
    JsonNode arr = JSON.readTree(since.out());
    assertThat(arr).hasSize(1);
    assertThat(arr.get(0).get("run_id").asText()).isEqualTo(NEW);
    assertThat(arr.get(0).get("blocks_needing_protection").asInt()).isEqualTo(2);

    Cli.Result none = Cli.run("audit", "list", "--audit", db.toString(), "--block", "west-fuji");
    assertThat(none.exitCode()).isZero();
    assertThat(none.out()).contains("no runs recorded").contains("match the filter");
  }

  @Test
  void showPrintsTheNightBlocksActionsRulesCautionsAndInputHashes() {
    Cli.Result r = Cli.run("audit", "show", "2026-04-15", "--farm", farm.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out())
        .contains("Run " + NEW)
        .contains("Recorded 2026-04-15 20:15:03 Europe/Berlin by rimeward 0.1.0, farm Hillside")
        .contains("Night of 2026-04-15: sunset 19:58, sunrise 06:21")
        .contains("north-gala (apple Gala, tight cluster): protected, risk high")
        .contains("T10 -2.8 °C, T90 -6.1 °C, target -2.2 °C")
        .contains("sprinkle 01:10 to 07:05: 3.2 mm/h needed, 3.8 mm/h installed, 412 m3 from pond")
        .contains("cover: deploy from 17:30, on by 19:30, remove at 09:00")
        .contains("south-bartlett (pear Bartlett, first bloom): not-needed, risk low\n")
        .contains("  no action")
        .contains("    1. risk.below-t10: bud temperature -3.9 °C is below T10 -2.8 °C")
        .contains("    4. protect.sprinkle:")
        .contains("pond: 412 m3 needed of 1800 m3 available; peak flow 72 m3/h of 90 m3/h")
        .contains("  - Decision support only")
        .contains(newest.inputs().get(0).sha256() + "  farm.yaml");
    // -2.8 °C = 26.96 °F (exact conversion F = C * 9/5 + 32).
    Cli.Result us = Cli.run("--units", "us", "audit", "show", NEW, "--audit", db.toString());
    assertThat(us.out()).contains("T10 27.0 °F");
  }

  @Test
  void showJsonCarriesThePlanAsRecordedWithMetadataAndInputHashes() throws Exception {
    Cli.Result r = Cli.run("audit", "show", NEW, "--json", "--audit", db.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    JsonNode n = JSON.readTree(r.out());
    assertThat(n.get("run_id").asText()).isEqualTo(NEW);
    assertThat(n.get("night").asText()).isEqualTo("2026-04-15");
    assertThat(n.get("plan")).isEqualTo(JSON.readTree(AuditSamples.PLAN_JSON));
    assertThat(n.get("inputs").get(2).get("kind").asText()).isEqualTo("crop-profile");
    assertThat(n.get("inputs").get(2).get("sha256").asText())
        .isEqualTo(newest.inputs().get(2).sha256());
    assertThat(n.get("policy").get("margin_c").asDouble()).isEqualTo(0.6);
  }

  @Test
  void unknownOrAmbiguousRunsAreBadInput() {
    Cli.Result unknown = Cli.run("audit", "show", "2025", "--audit", db.toString());
    assertThat(unknown.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(unknown.err()).contains("no run '2025'").contains("rimeward audit list");
    Cli.Result ambiguous = Cli.run("audit", "show", "2026-04-1", "--audit", db.toString());
    assertThat(ambiguous.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(ambiguous.err()).contains("matches 2 runs");
    Cli.Result missing = Cli.run("audit", "list", "--farm", farm.resolve("nowhere").toString());
    assertThat(missing.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(missing.err()).contains("--farm: no audit database at");
  }

  @Test
  void exportCsvWritesOneRowPerBlockActionAtomically() throws Exception {
    Path out = farm.resolve("insurer.csv");
    Files.writeString(out, "old content");
    Cli.Result r = Cli.run("audit", "export", NEW, "--format", "csv", "--output", out.toString(),
        "--audit", db.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("exported run " + NEW + " as csv to");
    try (CSVParser p = CSVParser.parse(Files.readString(out),
        CSVFormat.DEFAULT.builder().setHeader().get())) {
      // The plan's own CSV schema, with the run id in front.
      assertThat(p.getHeaderNames()).containsExactly("run_id", "chain_head", "night", "block", "crop", "variety",
          "stage", "risk", "kill_pct_unprotected", "status", "method", "start", "stop",
          "required_rate_mm_h", "installed_rate_mm_h", "water_m3", "source", "water_granted",
          "area_ha", "flow_m3_h", "grant", "decision_rules", "done_start", "done_stop");
      var rows = p.getRecords();
      assertThat(rows).hasSize(3);
      CSVRecord gala = rows.get(0);
      assertThat(gala.get("block")).isEqualTo("north-gala");
      assertThat(gala.get("method")).isEqualTo("sprinkle");
      assertThat(gala.get("run_id")).isEqualTo(NEW);
      // The head as 'audit head' gives it, on every row, and one 'audit verify --head' accepts.
      String head = Cli.run("audit", "head", "--audit", db.toString()).out().strip();
      assertThat(rows).allSatisfy(row -> assertThat(row.get("chain_head")).isEqualTo(head));
      assertThat(Cli.run("audit", "verify", "--head", head, "--audit", db.toString()).exitCode())
          .isZero();
      assertThat(gala.get("start")).isEqualTo("2026-04-16T01:10+02:00");
      assertThat(gala.get("stop")).isEqualTo("2026-04-16T07:05+02:00");
      assertThat(gala.get("water_m3")).isEqualTo("412.0");
      assertThat(gala.get("source")).isEqualTo("pond");
      // The decisions behind the row, not merely the first rule that fired for the block.
      assertThat(gala.get("decision_rules")).isEqualTo("protect.sprinkle");
      assertThat(rows.get(1).get("method")).isEqualTo("none");
      assertThat(rows.get(1).get("status")).isEqualTo("not-needed");
      assertThat(rows.get(2).get("method")).isEqualTo("cover");
      assertThat(rows.get(2).get("stop")).isEqualTo("2026-04-16T09:00+02:00");
    }
    try (var files = Files.list(farm)) {
      assertThat(files.map(f -> f.getFileName().toString())).noneMatch(f -> f.endsWith(".tmp"));
    }
  }

  @Test
  void exportJsonMatchesShowJsonAndAMissingFolderIsBadInput() {
    Cli.Result show = Cli.run("audit", "show", NEW, "--json", "--audit", db.toString());
    Cli.Result export = Cli.run("audit", "export", NEW, "--audit", db.toString());
    assertThat(export.exitCode()).isZero();
    assertThat(export.out()).isEqualTo(show.out());
    Cli.Result bad = Cli.run("audit", "export", NEW, "--output",
        farm.resolve("no/such/x.json").toString(), "--audit", db.toString());
    assertThat(bad.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(bad.err()).contains("--output:").contains("does not exist");
    Cli.Result fmt = Cli.run("audit", "export", NEW, "--format", "xml", "--audit", db.toString());
    assertThat(fmt.exitCode()).isEqualTo(Main.BAD_INPUT);
  }

  @Test
  void verifySaysIntactOrNamesTheBrokenRecordWithExitCode4() throws Exception {
    Cli.Result ok = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(ok.exitCode()).as(ok.toString()).isZero();
    // The two sample runs' 26 records after the chained schema steps the trail starts with.
    long records = 26 + org.rimeward.audit.AuditSamples.SCHEMA_STEP_RECORDS;
    assertThat(ok.out()).startsWith("chain intact: " + records + " records\n")
        .contains("head: " + records + ":");

    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
        Statement st = c.createStatement()) {
      st.execute("DROP TRIGGER runs_no_update");
      st.executeUpdate("UPDATE runs SET farm_name = 'Hillside Orchard.' WHERE run_id = '" + NEW + "'");
    }
    Cli.Result broken = Cli.run("audit", "verify", "--audit", db.toString());
    assertThat(broken.exitCode()).isEqualTo(4);
    // The second run's row: after the schema steps and the first run's 13 records.
    long second = org.rimeward.audit.AuditSamples.SCHEMA_STEP_RECORDS + 13 + 1;
    assertThat(broken.out()).startsWith("chain broken: record " + second + " (runs, run " + NEW
        + ") hash does not match its content")
        .contains((second - 1) + " records before it check out");
    Cli.Result show = Cli.run("audit", "show", NEW, "--audit", db.toString());
    assertThat(show.exitCode()).isEqualTo(4);
    assertThat(show.err()).contains("does not match its chain hash");
  }

  @Test
  void aFileThatIsNotAnAuditDatabaseGetsOneClearLine() throws Exception {
    Path junk = farm.resolve("junk.db");
    Files.writeString(junk, "not a database at all\n".repeat(200));
    Cli.Result r = Cli.run("audit", "verify", "--audit", junk.toString());
    assertThat(r.exitCode()).isEqualTo(Main.INTERNAL_ERROR);
    assertThat(r.err()).startsWith("rimeward: audit database " + junk)
        .contains("not a rimeward audit database").doesNotContain("internal error");
  }

  @Test
  void auditWithoutASubcommandIsBadInput() {
    Cli.Result r = Cli.run("audit");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("list, show, why, replay, export or verify");
  }
}
