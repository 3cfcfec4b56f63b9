package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.ChainHead;
import org.rimeward.audit.RunReport;
import org.rimeward.audit.RunSummary;
import org.rimeward.plan.PlanDocument;

/**
 * The pages and the season on the command line, in-process, on a copy of the demo farm (invented
 * data) recorded over several nights: the demo forecast, and the same forecast moved six days on.
 */
class ReportCommandTest {
  @TempDir Path tmp;
  Path farm;
  Path later;

  @BeforeEach
  void copyDemo() throws IOException {
    farm = tmp.resolve("farm");
    Files.createDirectories(farm);
    Files.copy(Path.of("demo-farm/farm.yaml"), farm.resolve("farm.yaml"));
    Files.copy(Path.of("demo-farm/forecast.csv"), farm.resolve("forecast.csv"));
    later = farm.resolve("later.csv");
    Files.writeString(later, Files.readString(farm.resolve("forecast.csv"))
        .replace("2026-04-15", "2026-04-21").replace("2026-04-14", "2026-04-20"));
  }

  Cli.Result plan(String at, String... extra) {
    List<String> args = new java.util.ArrayList<>(List.of("plan", "--farm", farm.toString(),
        "--rules", "rules", "--crop-profiles", "crop-profiles"));
    args.addAll(List.of(extra));
    return Cli.run(Clock.fixed(Instant.parse(at), ZoneOffset.UTC), args.toArray(String[]::new));
  }

  @Test
  void planWritesItsPageToAFile() throws IOException {
    Path page = tmp.resolve("night.html");
    Cli.Result r = plan("2026-04-15T02:00:00Z", "--format", "html", "--output", page.toString(),
        "--no-audit");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("wrote the plan to " + page);
    String html = Files.readString(page);
    assertThat(html).startsWith("<!DOCTYPE html>").contains("Quillhaven Bench Farm", "<svg",
        "Start sprinkling 22:42");
  }

  @Test
  void anOutputInAMissingFolderIsRefusedBeforePlanning() {
    Cli.Result r = plan("2026-04-15T02:00:00Z", "--format", "html", "--output",
        tmp.resolve("nowhere/night.html").toString());
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("--output", "does not exist");
    assertThat(farm.resolve("audit.db")).doesNotExist();
  }

  @Test
  void aRecordedRunsPageNamesTheRunItsInputsAndTheChainHead() throws IOException {
    assertThat(plan("2026-04-15T02:00:00Z").exitCode()).isZero();
    String runId;
    ChainHead head;
    try (AuditStore store = AuditStore.openReadOnly(farm.resolve("audit.db"))) {
      runId = store.listRuns(Optional.empty(), Optional.empty()).get(0).runId();
      head = store.head();
    }
    Cli.Result r = Cli.run("audit", "show", runId, "--format", "html", "--farm", farm.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("Recorded run <code>" + runId + "</code>",
        "record " + head.seq() + ", hash <code>" + head.hash() + "</code>", "farm.yaml",
        "forecast.csv", "<svg", "Start sprinkling 22:42");
    // The same page as the plan made that night, but for its footer.
    Path page = tmp.resolve("night.html");
    plan("2026-04-15T02:00:00Z", "--format", "html", "--output", page.toString(), "--no-audit");
    String tonight = Files.readString(page);
    assertThat(body(r.out())).isEqualTo(body(tonight));
  }

  /**
   * A recorded run's page in US units reads as the US page that night: its explanations are put
   * in US units again from the run's own rule files, not left as recorded (metric).
   */
  @Test
  void aRecordedRunsPageInUsUnitsIsInUsUnitsThroughout() throws IOException {
    assertThat(plan("2026-04-15T02:00:00Z").exitCode()).isZero();
    String runId;
    try (AuditStore store = AuditStore.openReadOnly(farm.resolve("audit.db"))) {
      runId = store.listRuns(Optional.empty(), Optional.empty()).get(0).runId();
    }
    Cli.Result r = Cli.run("audit", "show", runId, "--format", "html", "--units", "us", "--farm",
        farm.toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).doesNotContain("°C", "m3/h", "mm/h", "m/s", "per m³")
        .contains("°F", "in/h", "gpm", "Target for hollow-cherry is 28.0 °F");
    Path page = tmp.resolve("night-us.html");
    plan("2026-04-15T02:00:00Z", "--format", "html", "--units", "us", "--output", page.toString(),
        "--no-audit");
    assertThat(body(r.out())).isEqualTo(body(Files.readString(page)));
    Cli.Result text = Cli.run("audit", "show", runId, "--units", "us", "--farm", farm.toString());
    assertThat(text.exitCode()).as(text.toString()).isZero();
    assertThat(text.out()).doesNotContain("°C", "m3/h", "mm/h", "m/s", "per m³").contains("°F");
  }

  @Test
  void theSeasonCountsEachNightOnceAndEveryBlock() throws IOException {
    assertThat(plan("2026-04-14T20:00:00Z").exitCode()).isZero();
    assertThat(plan("2026-04-15T02:00:00Z").exitCode()).isZero();
    assertThat(plan("2026-04-21T02:00:00Z", "--forecast", later.toString()).exitCode()).isZero();
    double pondM3 = 0;
    try (AuditStore store = AuditStore.openReadOnly(farm.resolve("audit.db"))) {
      List<RunSummary> runs = store.listRuns(Optional.empty(), Optional.empty());
      assertThat(runs).hasSize(3);
      for (String id : List.of(latest(runs, "2026-04-14"), latest(runs, "2026-04-20"))) {
        PlanDocument p = RunReport.plan(store.loadRun(id).orElseThrow());
        pondM3 += p.water().stream().filter(w -> w.source().equals("pond")).findFirst()
            .orElseThrow().volumeM3();
      }
    }
    Cli.Result csv = Cli.run("audit", "season", "--farm", farm.toString(), "--format", "csv");
    assertThat(csv.exitCode()).as(csv.toString()).isZero();
    try (CSVParser p = CSVParser.parse(csv.out(), CSVFormat.DEFAULT.builder().setHeader().get())) {
      assertThat(p.getHeaderNames()).contains("water_m3", "hours_sprinkled", "nights_at_risk");
      List<CSVRecord> rows = p.getRecords();
      long blocks = Files.readString(farm.resolve("farm.yaml")).lines()
          .filter(l -> l.startsWith("  - id: ")).count() - 2;
      assertThat(rows.stream().filter(r -> r.get("scope").equals("block")).count())
          .isEqualTo(blocks);
      CSVRecord pond = rows.stream().filter(r -> r.get("scope").equals("source")
          && r.get("id").equals("pond")).findFirst().orElseThrow();
      assertThat(pond.get("nights_planned")).isEqualTo("2");
      assertThat(Double.parseDouble(pond.get("water_m3"))).isCloseTo(pondM3,
          org.assertj.core.data.Offset.offset(0.11));
      CSVRecord cherry = rows.stream().filter(r -> r.get("id").equals("hollow-cherry"))
          .findFirst().orElseThrow();
      assertThat(cherry.get("nights_planned")).isEqualTo("2");
    }
    Cli.Result us = Cli.run("--units", "us", "audit", "season", "--farm", farm.toString(),
        "--format", "csv");
    assertThat(us.out().lines().findFirst().orElseThrow()).contains("water_gal");
    Cli.Result html = Cli.run("audit", "season", "--farm", farm.toString(), "--format", "html",
        "--from", "2026-04-01", "--to", "2026-04-30");
    assertThat(html.exitCode()).as(html.toString()).isZero();
    assertThat(html.out()).contains("data-date=\"2026-04-14\"", "data-date=\"2026-04-20\"",
        "no plan recorded", "hollow-cherry");
    Cli.Result text = Cli.run("audit", "season", "--farm", farm.toString());
    assertThat(text.out()).contains("2 nights recorded", "pond");
    Cli.Result json = Cli.run("audit", "season", "--farm", farm.toString(), "--format", "json");
    assertThat(json.out()).contains("\"water_m3\"", "\"nights_at_risk\"");
  }

  @Test
  void aSeasonBackwardsIsBadInput() {
    Cli.Result r = Cli.run("audit", "season", "--farm", farm.toString(), "--from", "2026-05-01",
        "--to", "2026-04-01");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("--to");
  }

  private static String latest(List<RunSummary> runs, String night) {
    return runs.stream().filter(r -> r.night().toString().equals(night))
        .max(java.util.Comparator.comparing(RunSummary::ranAt)).orElseThrow().runId();
  }

  /** The page without its footer and without the charts' generated clip-path ids. */
  private static String body(String html) {
    return html.substring(0, html.indexOf("<footer>")).replaceAll("_\\d+clip-\\d+", "clip");
  }
}
