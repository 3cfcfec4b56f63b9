package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastReader;

/**
 * farm.yaml's {@code stations:} in a re-plan and the watch, on a copy of the demo farm with two
 * invented thermometers: "mast" (the default, at the forecast point) and "hollow", hanging in
 * hollow-cherry (whose cold-air offset is -1.0 °C). Each block's forecast is corrected by its own
 * station's readings; rows of a station farm.yaml does not declare are counted and not used; a
 * block goes stale when its station does. Readings are the demo forecast plus invented offsets.
 */
class PlanStationsTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  private static final String NOW = "2026-04-14T23:00-07:00";
  private static final String STATIONS = """

      stations:
        - id: mast
          height: 1.5 m
          bud_height: 1.5 m
          default: true
        - id: hollow
          height: 1.5 m
          bud_height: 0.9 m
          blocks: [hollow-cherry]
      """;

  @TempDir Path tmp;
  Path farm;
  Forecast forecast;

  @BeforeEach
  void copyTheDemoFarmWithTwoStations() throws Exception {
    farm = Files.createDirectory(tmp.resolve("farm"));
    Files.copy(Path.of("demo-farm", "forecast.csv"), farm.resolve("forecast.csv"));
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(Path.of("demo-farm", "farm.yaml"))
        + STATIONS);
    forecast = ForecastReader.read(farm.resolve("forecast.csv"), ZONE);
  }

  /** Rows every 10 min from 18:00 to {@code to} for {@code station}, the forecast plus {@code offsetC}. */
  private List<String> rows(String station, String to, double offsetC) {
    List<String> out = new ArrayList<>();
    Instant end = OffsetDateTime.parse(to).toInstant();
    for (Instant t = OffsetDateTime.parse("2026-04-14T18:00-07:00").toInstant(); !t.isAfter(end);
        t = t.plus(Duration.ofMinutes(10))) {
      double air = ForecastCorrection.forecastAirC(forecast, t) + offsetC;
      out.add(OffsetDateTime.ofInstant(t, ZONE) + "," + station + String.format(Locale.ROOT,
          ",%.2f,%.2f", air, Math.min(air, -5.0)));
    }
    return out;
  }

  private Path readings(List<String> rows) throws Exception {
    Path p = farm.resolve("readings.csv");
    Files.writeString(p, "time,station,air_temp_c,dew_point_c\n" + String.join("\n", rows) + "\n");
    return p;
  }

  private Cli.Result plan(Path readings, String... extra) {
    List<String> args = new ArrayList<>(List.of("plan", "--farm", farm.toString(), "--readings",
        readings.toString(), "--now", NOW, "--no-audit"));
    args.addAll(List.of(extra));
    Cli.Result r = Cli.run(Clock.fixed(OffsetDateTime.parse(NOW).toInstant(), ZoneOffset.UTC),
        args.toArray(String[]::new));
    assertThat(r.exitCode()).as(r.toString()).isZero();
    return r;
  }

  private static JsonNode station(JsonNode plan, String id) {
    for (JsonNode s : plan.path("readings").path("stations")) {
      if (id.equals(s.path("id").asText())) {
        return s;
      }
    }
    throw new AssertionError("no station " + id + " in " + plan.path("readings"));
  }

  private static double minAir(JsonNode plan, String block) {
    for (JsonNode b : plan.path("blocks")) {
      if (block.equals(b.path("block").asText())) {
        return b.path("min_air_c").asDouble();
      }
    }
    throw new AssertionError("no block " + block);
  }

  private JsonNode dusk() throws Exception {
    Cli.Result r = Cli.run("plan", "--farm", farm.toString(), "--format", "json", "--no-audit");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    return JSON.readTree(r.out());
  }

  @Test
  void eachBlockIsCorrectedByItsOwnStation() throws Exception {
    // The hollow reads 2.0 °C below what hollow-cherry's forecast (with its -1.0 °C offset)
    // expects; the mast reads the forecast.
    List<String> rows = new ArrayList<>(rows("mast", NOW, 0.0));
    rows.addAll(rows("hollow", NOW, -1.0 - 2.0));
    JsonNode plan = JSON.readTree(plan(readings(rows), "--format", "json").out());
    JsonNode dusk = dusk();

    JsonNode mast = station(plan, "mast");
    assertThat(mast.path("declared").asBoolean()).isTrue();
    assertThat(mast.path("default").asBoolean()).isTrue();
    assertThat(mast.path("height_m").asDouble()).isEqualTo(1.5);
    assertThat(mast.path("bias_c").asDouble()).isCloseTo(0.0, within(0.02));
    assertThat(mast.path("blocks")).hasSize(9);
    assertThat(mast.path("blocks").toString()).doesNotContain("hollow-cherry");
    assertThat(mast.path("last_at").asText()).isEqualTo(NOW);
    JsonNode hollow = station(plan, "hollow");
    assertThat(hollow.path("blocks").toString()).isEqualTo("[\"hollow-cherry\"]");
    // Measured against the forecast at the block it hangs in, not at the forecast point.
    assertThat(hollow.path("bias_c").asDouble()).isCloseTo(-2.0, within(0.02));
    assertThat(hollow.path("bud_height_m").asDouble()).isEqualTo(0.9);
    assertThat(plan.path("readings").path("station").asText()).isEqualTo("mast");

    // The night's coldest air comes before sunrise, where the offset is carried in full.
    assertThat(minAir(plan, "hollow-cherry")).isCloseTo(minAir(dusk, "hollow-cherry") - 2.0,
        within(0.05));
    assertThat(minAir(plan, "upper-golden")).isCloseTo(minAir(dusk, "upper-golden"), within(0.05));
    assertThat(minAir(plan, "creek-rome")).as("keeps its -0.5 °C against the mast")
        .isCloseTo(minAir(dusk, "creek-rome"), within(0.05));

    // The hollow's thermometer hangs 0.6 m above the cherries' lowest buds: cautioned.
    assertThat(plan.path("cautions").toString()).contains("Station hollow's thermometer hangs at"
        + " 1.5 m above the ground and the lowest buds of hollow-cherry at 0.9 m");
    assertThat(plan.path("cautions").toString()).doesNotContain("Station mast");

    String text = plan(readings(rows)).out();
    assertThat(text).startsWith("Re-planned at 23:00 from the stations' readings\n");
    assertThat(text).contains("  Readings (readings.csv), by station:\n"
        + "  - mast (default, thermometer 1.5 m) for upper-golden, creek-rome, terrace-apricot,")
        .contains("knoll-blueberry: last at 23:00, matching the forecast over the last hour\n")
        .contains("  - hollow (thermometer 1.5 m) for hollow-cherry: last at 23:00, 2.0 °C colder than"
            + " forecast over the last hour\n");
    assertThat(text).contains("(forecast corrected by station mast's readings)\n");
  }

  @Test
  void rowsOfAStationFarmYamlDoesNotDeclareAreCountedAndNotUsed() throws Exception {
    List<String> rows = new ArrayList<>(rows("mast", NOW, 0.0));
    rows.addAll(rows("hollow", NOW, -1.0));
    List<String> typo = rows("nroth", NOW, -5.0);
    rows.addAll(typo);
    JsonNode plan = JSON.readTree(plan(readings(rows), "--format", "json").out());
    JsonNode nroth = station(plan, "nroth");
    assertThat(nroth.path("declared").asBoolean()).isFalse();
    assertThat(nroth.path("blocks")).isEmpty();
    assertThat(nroth.path("rows").asInt()).isEqualTo(typo.size());
    assertThat(nroth.path("note").asText()).contains("not used").contains("declare it");
    // Not used: five degrees colder moved nothing.
    assertThat(station(plan, "mast").path("bias_c").asDouble()).isCloseTo(0.0, within(0.02));
    assertThat(minAir(plan, "upper-golden")).isCloseTo(minAir(dusk(), "upper-golden"), within(0.05));
    assertThat(plan(readings(rows)).out()).contains("  Station nroth: " + typo.size()
        + " row(s) not used: farm.yaml's stations do not declare it; declare it (id, height, blocks)"
        + " or correct the logger's station id.\n");
  }

  @Test
  void rowsWithoutAStationAreTheDefaultStationsAndAStationWithoutRowsIsStale() throws Exception {
    Path file = farm.resolve("one-logger.csv");
    StringBuilder s = new StringBuilder("time,air_temp_c,dew_point_c\n");
    for (String r : rows("x", NOW, -1.5)) {
      s.append(r.replace(",x,", ",")).append('\n');
    }
    Files.writeString(file, s.toString());
    JsonNode plan = JSON.readTree(plan(file, "--format", "json").out());
    assertThat(station(plan, "mast").path("bias_c").asDouble()).isCloseTo(-1.5, within(0.02));
    assertThat(station(plan, "mast").path("stale").asBoolean()).isFalse();
    JsonNode hollow = station(plan, "hollow");
    assertThat(hollow.path("stale").asBoolean()).isTrue();
    assertThat(hollow.path("rows").asInt()).isZero();
    assertThat(hollow.path("note").asText()).isEqualTo("no readings in one-logger.csv yet");
    assertThat(plan.path("readings").path("stale").asBoolean()).isTrue();
    // hollow-cherry falls back on its forecast, with its offset, as at dusk.
    assertThat(minAir(plan, "hollow-cherry")).isCloseTo(minAir(dusk(), "hollow-cherry"),
        within(0.05));
  }

  @Test
  void stationOptionPlansEveryBlockByOneStation() throws Exception {
    List<String> rows = new ArrayList<>(rows("mast", NOW, -1.0));
    rows.addAll(rows("hollow", NOW, -4.0));
    JsonNode plan = JSON.readTree(plan(readings(rows), "--format", "json", "--station", "mast")
        .out());
    assertThat(station(plan, "mast").path("blocks")).hasSize(10);
    assertThat(station(plan, "mast").path("note").asText()).contains("--station");
    assertThat(station(plan, "hollow").path("blocks")).isEmpty();
    // hollow-cherry keeps its -1.0 °C against the mast's readings: 1.0 °C colder than at dusk.
    assertThat(minAir(plan, "hollow-cherry")).isCloseTo(minAir(dusk(), "hollow-cherry") - 1.0,
        within(0.05));
  }

  @Test
  void theWatchRaisesAStationsStaleAlarmForItsBlocksAndReadsTheBlocksOwnThermometer()
      throws Exception {
    // The hollow's logger stops at 21:30; the mast goes on.
    List<String> rows = new ArrayList<>(rows("mast", NOW, 0.0));
    rows.addAll(rows("hollow", "2026-04-14T21:30-07:00", -1.0));
    rows.add("2026-04-14T22:00-07:00,nroth,0.0,-5.0");
    readings(rows);
    Cli.Result r = Cli.run(Clock.fixed(OffsetDateTime.parse(NOW).toInstant(), ZoneOffset.UTC),
        "watch", "--farm", farm.toString(), "--once", "--now", NOW, "--no-audit");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.ACTION_NEEDED);
    assertThat(r.out()).containsPattern("23:00  hollow-cherry +stale +station hollow: no reading"
        + " since 21:30 \\(90 min\\)");
    assertThat(r.out()).doesNotContain("all              stale");
    assertThat(r.err()).contains("rimeward: readings.csv: station 'nroth': 1 row(s) not used");
  }

  @Test
  void theCoolestAirLineSaysWhatTheAirIs() throws Exception {
    Cli.Result dusk = Cli.run("plan", "--farm", farm.toString(), "--no-audit");
    assertThat(dusk.out()).containsPattern("coldest -?\\d+\\.\\d °C at \\w+ \\d\\d:\\d\\d"
        + " \\(forecast air\\)\n");
    // A farm with one station: corrected by "readings".
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(Path.of("demo-farm",
        "farm.yaml")));
    Path one = farm.resolve("one.csv");
    StringBuilder s = new StringBuilder("time,air_temp_c,dew_point_c\n");
    rows("x", NOW, -1.5).forEach(x -> s.append(x.replace(",x,", ",")).append('\n'));
    Files.writeString(one, s.toString());
    assertThat(plan(one).out()).containsPattern("coldest -?\\d+\\.\\d °C at \\w+ \\d\\d:\\d\\d"
        + " \\(forecast corrected by readings\\)\n");
    // Readings that all come after now correct nothing yet.
    Files.writeString(one, "time,air_temp_c\n2026-04-15T01:00-07:00,0.0\n");
    assertThat(plan(one).out()).contains("(forecast air: no reading yet)\n");
  }

  /** The README's night with two thermometers, on the demo file made for it. */
  @Test
  void theReadmesTwoThermometers() throws Exception {
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(Path.of("demo-farm",
        "farm.yaml")) + """

        stations:
          - id: mast              # the weather station by the pump house
            height: 1.5 m
            default: true
          - id: hollow            # hung among hollow-cherry's trees, in the cold spot
            height: 1.0 m
            bud_height: 1.0 m
            blocks: [hollow-cherry]
        """);
    Path file = Path.of("demo-farm", "stations-readings.csv");
    Cli.Result at2230 = Cli.run(Clock.fixed(Instant.parse("2026-04-15T05:30:00Z"), ZoneOffset.UTC),
        "plan", "--farm", farm.toString(), "--readings", file.toString(), "--now",
        "2026-04-14T22:30-07:00", "--no-audit", "--format", "json");
    JsonNode plan = JSON.readTree(at2230.out());
    assertThat(plan.path("readings").path("rows_skipped").asInt()).isZero();
    assertThat(station(plan, "mast").path("bias_c").asDouble()).isCloseTo(-1.4, within(0.05));
    assertThat(station(plan, "hollow").path("bias_c").asDouble()).isCloseTo(-1.8, within(0.05));
    assertThat(station(plan, "hollow").path("last_at").asText()).isEqualTo("2026-04-14T22:00-07:00");
    assertThat(plan.path("cautions").toString()).contains("Station mast's thermometer hangs at"
        + " 1.5 m above the ground, and farm.yaml gives no bud_height").doesNotContain(
            "Station hollow");
    Cli.Result at2310 = Cli.run(Clock.fixed(Instant.parse("2026-04-15T06:10:00Z"), ZoneOffset.UTC),
        "plan", "--farm", farm.toString(), "--readings", file.toString(), "--now",
        "2026-04-14T23:10-07:00", "--no-audit", "--format", "json");
    JsonNode later = JSON.readTree(at2310.out());
    assertThat(station(later, "hollow").path("stale").asBoolean()).isTrue();
    assertThat(station(later, "mast").path("stale").asBoolean()).isFalse();
  }

  @Test
  void eachBlocksChartShowsItsOwnStationsReadings() throws Exception {
    // mast reads the forecast exactly; hollow hangs in hollow-cherry and reads 2 °C colder.
    List<String> all = new ArrayList<>(rows("mast", NOW, 0.0));
    all.addAll(rows("hollow", NOW, -2.0));
    JsonNode json = JSON.readTree(plan(readings(all), "--format", "json").out());
    assertThat(station(json, "hollow").get("hangs_in")).hasSize(1);
    assertThat(station(json, "hollow").get("points").size()).isGreaterThan(10);
    assertThat(station(json, "mast").has("hangs_in")).as("mast is listed for no block").isFalse();
    String page = plan(readings(all), "--format", "html").out();
    // A thermometer hanging in the block reads its air: no offset added, and the legend says so;
    // the other blocks' charts show mast's readings plus their own offset.
    String cherry = page.substring(page.indexOf("id=\"block-hollow-cherry\""));
    cherry = cherry.substring(0, cherry.indexOf("</section>"));
    assertThat(cherry).contains("readings at the block");
    String peach = page.substring(page.indexOf("id=\"block-lane-peach\""));
    peach = peach.substring(0, peach.indexOf("</section>"));
    assertThat(peach).contains("readings (station + block offset)")
        .doesNotContain("readings at the block");
  }
}
