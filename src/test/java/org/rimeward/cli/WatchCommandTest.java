package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastReader;

/**
 * 'rimeward watch' on a copy of the demo farm with invented readings made from the demo forecast:
 * the grower's command gets the block and the alarm's kind, each alarm comes once per block per
 * night unless it escalates, stale readings raise an alarm, a failing or hanging command is
 * reported and never stops the watch, and the trail keeps alarms and re-plans with inputs stored
 * once. (The demo plan starts hollow-cherry at 22:42, the orchard blocks at 00:37.)
 */
class WatchCommandTest {
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  @TempDir Path tmp;
  Path farm;
  Forecast forecast;

  @BeforeEach
  void copyTheDemoFarm() throws Exception {
    farm = Files.createDirectory(tmp.resolve("farm"));
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    forecast = ForecastReader.read(farm.resolve("forecast.csv"), ZONE);
  }

  private Path readings(String from, String to, double offsetC) throws Exception {
    StringBuilder s = new StringBuilder("time,air_temp_c,dew_point_c,wind_ms\n");
    for (Instant t = OffsetDateTime.parse(from).toInstant(); !t.isAfter(OffsetDateTime.parse(to)
        .toInstant()); t = t.plus(Duration.ofMinutes(10))) {
      double air = ForecastCorrection.forecastAirC(forecast, t) + offsetC;
      s.append(OffsetDateTime.ofInstant(t, ZONE)).append(String.format(Locale.ROOT,
          ",%.2f,%.2f,1.0%n", air, Math.min(air, -5.0)));
    }
    Path p = farm.resolve("readings.csv");
    Files.writeString(p, s.toString());
    return p;
  }

  private Cli.Result once(String now, String... extra) {
    List<String> args = new java.util.ArrayList<>(List.of("watch", "--farm", farm.toString(),
        "--once", "--now", now));
    args.addAll(List.of(extra));
    return Cli.run(Clock.fixed(OffsetDateTime.parse(now).toInstant(), ZoneOffset.UTC),
        args.toArray(String[]::new));
  }

  @Test
  void onceCallsTheGrowersCommandWithBlockAndKindAndIsQuietTheSecondTime() throws Exception {
    readings("2026-04-14T18:00-07:00", "2026-04-15T00:20-07:00", -1.5);
    Path log = tmp.resolve("alarms.txt");
    String cmd = "echo \"$RIMEWARD_BLOCK $RIMEWARD_ALARM $RIMEWARD_AT $RIMEWARD_MESSAGE\" >> " + log;
    Cli.Result first = once("2026-04-15T00:20-07:00", "--on-alarm", cmd);
    assertThat(first.exitCode()).as(first.toString()).isEqualTo(Main.ACTION_NEEDED);
    assertThat(first.out()).contains("\u0007").contains("colder-than-forecast");
    List<String> lines = Files.readAllLines(log);
    assertThat(lines).anyMatch(l -> l.startsWith("all colder-than-forecast 2026-04-15T00:20-07:00"
        + " readings 1.5 °C colder"));
    assertThat(lines).allMatch(l -> l.contains(" 2026-04-15T00:20-07:00 "));
    // At least one block's own alarm, named by block and kind, beside the farm-wide one.
    assertThat(lines).anyMatch(l -> l.matches("[a-z][a-z-]* (start-due|alarm-temperature) .*")
        && !l.startsWith("all "));
    Cli.Result second = once("2026-04-15T00:25-07:00", "--on-alarm", cmd);
    assertThat(second.exitCode()).as(second.toString()).isZero();
    assertThat(Files.readAllLines(log)).hasSameSizeAs(lines);
  }

  @Test
  void anAlarmEscalatesOnceWhenTheStartBecomesOverdue() throws Exception {
    readings("2026-04-14T18:00-07:00", "2026-04-15T01:10-07:00", 0.0);
    Cli.Result due = once("2026-04-14T22:20-07:00");
    assertThat(due.exitCode()).isEqualTo(Main.ACTION_NEEDED);
    java.util.regex.Matcher m = java.util.regex.Pattern.compile(
        "hollow-cherry +start-due +start sprinkling at (\\d\\d:\\d\\d) \\(in \\d+ min\\)")
        .matcher(due.out());
    assertThat(m.find()).as(due.out()).isTrue();
    Cli.Result overdue = once("2026-04-14T23:10-07:00");
    assertThat(overdue.exitCode()).isEqualTo(Main.ACTION_NEEDED);
    // Readings replacing the forecast may move the start by a few minutes; it is past either way.
    assertThat(overdue.out()).containsPattern("hollow-cherry +start-due +start overdue since 2[0-3]:\\d\\d");
    Cli.Result again = once("2026-04-14T23:15-07:00");
    assertThat(again.out()).doesNotContain("hollow-cherry    start-due");
    // Recorded as running: the overdue alarm is not raised for a block the crew started.
    Cli.Result action = Cli.run(Clock.fixed(Instant.parse("2026-04-15T09:00:00Z"), ZoneOffset.UTC),
        "action", "lane-peach", "sprinkling-on", "--at", "2026-04-15T00:10", "--farm", farm.toString());
    assertThat(action.exitCode()).isZero();
    Cli.Result later = once("2026-04-15T01:10-07:00");
    assertThat(later.out()).doesNotContain("lane-peach       start-due");
  }

  @Test
  void staleReadingsRaiseAnAlarm() throws Exception {
    readings("2026-04-14T18:00-07:00", "2026-04-14T20:00-07:00", 0.0);
    Path log = tmp.resolve("alarms.txt");
    Cli.Result r = once("2026-04-14T22:30-07:00", "--on-alarm",
        "echo \"$RIMEWARD_BLOCK $RIMEWARD_ALARM\" >> " + log);
    assertThat(r.exitCode()).isEqualTo(Main.ACTION_NEEDED);
    assertThat(r.out()).contains("stale").contains("no reading since 20:00 (150 min)");
    assertThat(Files.readAllLines(log)).contains("all stale");
  }

  @Test
  void aFailingOrHangingCommandIsReportedAndStoppedAndTheWatchGoesOn() throws Exception {
    readings("2026-04-14T18:00-07:00", "2026-04-14T20:00-07:00", 0.0);
    Cli.Result failing = once("2026-04-14T22:30-07:00", "--on-alarm", "exit 7", "--no-audit");
    assertThat(failing.exitCode()).isEqualTo(Main.ACTION_NEEDED);
    assertThat(failing.err()).contains("--on-alarm command for stale on all: exit 7; the watch goes on");
    long t0 = System.nanoTime();
    Cli.Result hanging = once("2026-04-14T22:30-07:00", "--on-alarm", "sleep 60",
        "--command-timeout", "1s", "--no-audit");
    assertThat(hanging.exitCode()).isEqualTo(Main.ACTION_NEEDED);
    assertThat(hanging.err()).contains("timed out after 1 s and was stopped");
    assertThat(Duration.ofNanos(System.nanoTime() - t0)).isLessThan(Duration.ofSeconds(60));
  }

  @Test
  void alarmsAndChangedReplansAreInTheTrailWithInputsStoredOnce() throws Exception {
    readings("2026-04-14T18:00-07:00", "2026-04-15T00:20-07:00", -1.5);
    once("2026-04-15T00:20-07:00");
    readings("2026-04-14T18:00-07:00", "2026-04-15T01:20-07:00", -2.5);
    once("2026-04-15T01:20-07:00");
    Cli.Result verify = Cli.run("audit", "verify", "--farm", farm.toString());
    assertThat(verify.exitCode()).as(verify.toString()).isZero();
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + farm.resolve("audit.db"));
        Statement st = c.createStatement()) {
      ResultSet alarms = st.executeQuery("SELECT count(*) FROM watch_alarms");
      assertThat(alarms.getInt(1)).isGreaterThanOrEqualTo(3);
      ResultSet runs = st.executeQuery("SELECT count(*) FROM runs");
      assertThat(runs.getInt(1)).isEqualTo(2);
      ResultSet farmFiles = st.executeQuery("SELECT length(content) FROM run_inputs WHERE name ="
          + " 'farm.yaml' ORDER BY seq");
      assertThat(farmFiles.next()).isTrue();
      assertThat(farmFiles.getInt(1)).as("first run keeps the bytes").isPositive();
      assertThat(farmFiles.next()).isTrue();
      assertThat(farmFiles.getInt(1)).as("second run refers to them by hash").isZero();
    }
    Cli.Result list = Cli.run("audit", "list", "--farm", farm.toString());
    String runId = list.out().lines().skip(1).findFirst().orElseThrow().split("\\s+")[0];
    Cli.Result show = Cli.run("audit", "show", runId, "--farm", farm.toString());
    assertThat(show.exitCode()).as(show.toString()).isZero();
    assertThat(show.out()).contains("farm.yaml");
  }

  @Test
  void theWatchEndsAfterTheMorningsLastStop() throws Exception {
    readings("2026-04-15T08:00-07:00", "2026-04-15T09:30-07:00", 0.0);
    Cli.Result r = Cli.run(Clock.fixed(Instant.parse("2026-04-15T16:30:00Z"), ZoneOffset.UTC), "watch",
        "--farm", farm.toString(), "--now", "2026-04-15T09:30-07:00", "--every", "5s", "--no-audit");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("watch ends: the morning's last stop").contains("watch stopped");
  }

  @Test
  void theLeadAndTheStaleLimitAreTheRuleFilesAndTheOptionsOverrideThem() throws Exception {
    // The bundled rules raise start-due 30 min ahead: hollow-cherry's start (22:42) is due at
    // 22:20 (anAlarmEscalatesOnceWhenTheStartBecomesOverdue). A copy of the rules with a 10 min
    // lead and a 180 min stale limit keeps quiet then, and --lead 30m brings the alarm back.
    readings("2026-04-14T18:00-07:00", "2026-04-14T20:00-07:00", 0.0);
    Path rules = org.rimeward.rules.RuleFolders.withThresholds(tmp.resolve("rules"), """
        new Thresholds(1.5, 2.2, 4.5, 30.0, 0.0, 1.0, 0.5, 70.0, 0.5,
              10, 1.0, 180,
              2.0, 25.0, 2.0, 1.0, 90)""");
    Cli.Result bundled = once("2026-04-14T22:20-07:00", "--no-audit");
    assertThat(bundled.out()).containsPattern("hollow-cherry +start-due").contains("stale");
    Cli.Result own = once("2026-04-14T22:20-07:00", "--no-audit", "--rules", rules.toString());
    assertThat(own.out()).as(own.toString()).doesNotContainPattern("hollow-cherry +start-due")
        .doesNotContain("stale");
    Cli.Result given = once("2026-04-14T22:20-07:00", "--no-audit", "--rules", rules.toString(),
        "--lead", "30m", "--stale-after", "60m");
    assertThat(given.out()).as(given.toString()).containsPattern("hollow-cherry +start-due")
        .contains("stale");
  }

  @Test
  void badIntervalsAreExitTwo() {
    Cli.Result r = Cli.run("watch", "--farm", farm.toString(), "--every", "soon", "--once");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("--every: 'soon' is not an interval");
  }
}
