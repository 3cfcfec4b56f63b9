package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * 'rimeward action' on a copy of the demo farm: what the crew did is recorded in the chain,
 * contradictions of the plan are warned about but recorded, and the audit commands show it beside
 * the advice. The demo plan sprinkles field-berries 02:22 → 08:32 and keeps its covers on to 08:32.
 */
class ActionCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  /** 09:00 local the morning after the demo night. */
  private static final Clock MORNING = Clock.fixed(Instant.parse("2026-04-15T16:00:00Z"), ZoneOffset.UTC);

  @TempDir Path tmp;
  Path farm;

  @BeforeEach
  void planTheDemoNight() throws Exception {
    farm = Files.createDirectory(tmp.resolve("farm"));
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    Cli.Result plan = Cli.run(Clock.fixed(Instant.parse("2026-04-15T01:00:00Z"), ZoneOffset.UTC),
        "plan", "--farm", farm.toString());
    assertThat(plan.exitCode()).as(plan.toString()).isZero();
  }

  private Cli.Result action(String... args) {
    String[] all = new String[args.length + 3];
    all[0] = "action";
    System.arraycopy(args, 0, all, 1, args.length);
    all[args.length + 1] = "--farm";
    all[args.length + 2] = farm.toString();
    return Cli.run(MORNING, all);
  }

  @Test
  void recordsAndWarnsWhenTheActionContradictsThePlanButNeverRefuses() {
    Cli.Result late = action("field-berries", "sprinkling-on", "--at", "2026-04-15T02:30",
        "--by", "ana", "--note", "pump 2 slow to prime");
    assertThat(late.exitCode()).as(late.toString()).isZero();
    assertThat(late.out()).contains("recorded: field-berries sprinkling-on at 02:30 (night of"
        + " 2026-04-14) by ana; plan run ");
    assertThat(late.err()).contains("warning: sprinklers on at 02:30, after the start the plan gives (02:22)");

    Cli.Result early = action("field-berries", "sprinkling-off", "--at", "05:10", "--by", "ana");
    assertThat(early.exitCode()).isZero();
    assertThat(early.err()).contains("sprinklers off at 05:10, before the stop condition is met"
        + " (the plan gives 08:32)");

    Cli.Result uncovered = action("field-berries", "covers-off", "--at", "06:00", "--by", "ben");
    assertThat(uncovered.exitCode()).isZero();
    assertThat(uncovered.err()).contains("covers off at 06:00 with the air still below the target");

    // Near miss: off after the planned stop contradicts nothing.
    Cli.Result onTime = action("field-berries", "sprinkling-off", "--at", "08:40", "--by", "ana");
    assertThat(onTime.exitCode()).isZero();
    assertThat(onTime.err()).isEmpty();

    Cli.Result verify = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(verify.exitCode()).as(verify.toString()).isZero();
  }

  @Test
  void sprinklingABlockThePlanGaveNoWaterOrAdvisedAgainstIsWarnedAbout() {
    // The demo plan shows west-pear's run with its times but advises against it (wind), and
    // grants creek-rome no water: neither is advice to sprinkle.
    Cli.Result windy = action("west-pear", "sprinkling-on", "--at", "00:30", "--by", "ana");
    assertThat(windy.exitCode()).as(windy.toString()).isZero();
    assertThat(windy.err()).contains("warning: the plan advised no sprinkling on west-pear tonight");
    Cli.Result dry = action("creek-rome", "sprinkling-on", "--at", "00:30", "--by", "ana");
    assertThat(dry.exitCode()).as(dry.toString()).isZero();
    assertThat(dry.err()).contains("warning: the plan advised no sprinkling on creek-rome tonight");
    // Near miss: a block whose run is advised and granted, turned on before its start.
    Cli.Result early = action("lane-peach", "sprinkling-on", "--at", "00:30", "--by", "ana");
    assertThat(early.err()).isEmpty();

    Cli.Result why = Cli.run("audit", "why", "creek-rome", "--farm", farm.toString());
    assertThat(why.out()).contains("advised: no sprinkling (no water granted from")
        .doesNotContain("advised: sprinkle ?");
    assertThat(Cli.run("audit", "why", "west-pear", "--farm", farm.toString()).out())
        .contains("advised: no sprinkling (not advised tonight)");
  }

  @Test
  void auditWhyShowAndExportPutWhatWasDoneBesideWhatWasAdvised() throws Exception {
    action("field-berries", "sprinkling-on", "--at", "02:20", "--by", "ana", "--note", "pump 2");
    action("field-berries", "sprinkling-off", "--at", "08:40", "--by", "ana");

    Cli.Result why = Cli.run("audit", "why", "field-berries", "--farm", farm.toString());
    assertThat(why.exitCode()).as(why.toString()).isZero();
    assertThat(why.out()).contains("Advised and done (night of 2026-04-14)")
        .contains("advised: sprinkle 02:22 → 08:32")
        .contains("done:    02:20 sprinkling-on by ana (pump 2)")
        .contains("done:    08:40 sprinkling-off by ana");

    JsonNode whyJson = JSON.readTree(Cli.run("audit", "why", "field-berries", "--json", "--farm",
        farm.toString()).out());
    assertThat(whyJson.get("done")).hasSize(2);
    assertThat(whyJson.get("done").get(0).get("at").asText()).isEqualTo("2026-04-15T02:20-07:00");

    String runId = JSON.readTree(Cli.run("audit", "why", "field-berries", "--json", "--farm",
        farm.toString()).out()).get("run").asText();
    JsonNode show = JSON.readTree(Cli.run("audit", "show", runId, "--json", "--farm",
        farm.toString()).out());
    assertThat(show.get("crew_actions")).hasSize(2);
    assertThat(Cli.run("audit", "show", runId, "--farm", farm.toString()).out())
        .contains("done:    02:20 sprinkling-on by ana");

    String csv = Cli.run("audit", "export", runId, "--format", "csv", "--farm", farm.toString()).out();
    List<CSVRecord> rows = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get()
        .parse(new StringReader(csv)).getRecords();
    CSVRecord sprinkle = rows.stream().filter(r -> r.get("block").equals("field-berries")
        && r.get("method").equals("sprinkle")).findFirst().orElseThrow();
    assertThat(sprinkle.get("start")).isEqualTo("2026-04-15T02:22-07:00");
    assertThat(sprinkle.get("done_start")).isEqualTo("2026-04-15T02:20-07:00");
    assertThat(sprinkle.get("done_stop")).isEqualTo("2026-04-15T08:40-07:00");
    CSVRecord cover = rows.stream().filter(r -> r.get("block").equals("field-berries")
        && r.get("method").equals("cover")).findFirst().orElseThrow();
    assertThat(cover.get("done_start")).as("covers: nothing recorded").isEmpty();
  }

  @Test
  void aRecordedActionCannotBeChangedUnnoticed() throws Exception {
    action("field-berries", "covers-on", "--at", "2026-04-14T18:30", "--by", "ben");
    try (java.sql.Connection c = java.sql.DriverManager.getConnection("jdbc:sqlite:"
        + farm.resolve("audit.db"));
        java.sql.Statement st = c.createStatement()) {
      org.assertj.core.api.Assertions.assertThatThrownBy(() ->
          st.executeUpdate("UPDATE crew_actions SET at = '2026-04-14T17:00:00.000000000Z'"))
          .hasMessageContaining("append-only");
      st.execute("DROP TRIGGER crew_actions_no_update");
      st.executeUpdate("UPDATE crew_actions SET done_by = 'someone else'");
    }
    Cli.Result verify = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(verify.exitCode()).isEqualTo(AuditCommand.CHAIN_BROKEN);
    assertThat(verify.out() + verify.err()).contains("crew action covers-on on field-berries");
  }

  @Test
  void badKindsBlocksAndTimesAreExitTwoWithTheOptionNamed() {
    Cli.Result kind = action("field-berries", "pumps-on");
    assertThat(kind.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(kind.err()).contains("KIND: 'pumps-on' is not an action").contains("covers-off");
    Cli.Result block = action("no-such-block", "covers-on");
    assertThat(block.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(block.err()).contains("BLOCK: 'no-such-block'").contains("field-berries");
    Cli.Result future = action("field-berries", "covers-on", "--at", "2026-04-15T10:00-07:00");
    assertThat(future.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(future.err()).contains("--at").contains("in the future");
    Cli.Result garbled = action("field-berries", "covers-on", "--at", "half past ten");
    assertThat(garbled.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(garbled.err()).contains("--at: 'half past ten' is not a time");
  }
}
