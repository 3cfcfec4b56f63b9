package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.units.UnitSystem;

/**
 * The same night from every forecast format, and from coarser steps. The forecasts are the demo
 * night's invented values, written as each service structures its response.
 */
class ForecastFormatsPlanTest {
  static final Path RESPONSES = Path.of("src/test/resources/forecasts");

  @TempDir Path tmp;

  static Plan plan(Path farm, Path forecast) {
    return new NightPlanner().plan(new PlanRequest(farm, forecast, TestFarms.CROPS, TestFarms.RULES, null));
  }

  @Test
  void theSameNightFromCsvOpenMeteoNwsAndMetNorwayStartsAndStopsWithinTwoMinutes() {
    Plan csv = plan(TestFarms.DEMO, null);
    assertThat(csv.blocks()).anyMatch(b -> b.sprinkle().isPresent());
    for (String name : List.of("open-meteo", "nws-gridpoint", "met-norway")) {
      Plan other = plan(TestFarms.DEMO, RESPONSES.resolve("demo-night-" + name + ".json"));
      assertThat(other.inputs().forecast().format()).isEqualTo(name.replace("-gridpoint", ""));
      for (BlockPlan a : csv.blocks()) {
        BlockPlan b = other.blocks().stream().filter(x -> x.blockId().equals(a.blockId())).findFirst().orElseThrow();
        assertThat(b.status()).as("%s %s", name, a.blockId()).isEqualTo(a.status());
        assertThat(b.sprinkle().isPresent()).isEqualTo(a.sprinkle().isPresent());
        if (a.sprinkle().isPresent()) {
          assertWithin(a.sprinkle().get().start(), b.sprinkle().get().start(), Duration.ofMinutes(2), name + " start " + a.blockId());
          assertWithin(a.sprinkle().get().stop(), b.sprinkle().get().stop(), Duration.ofMinutes(2), name + " stop " + a.blockId());
        }
        if (a.cover().isPresent()) {
          assertWithin(a.cover().get().deployStart(), b.cover().get().deployStart(), Duration.ofMinutes(2), name + " cover " + a.blockId());
        }
      }
    }
  }

  @Test
  void aThreeHourlyForecastPlansWithinHalfAnHourOfTheHourlyOneAndSaysSo() throws IOException {
    List<String> lines = Files.readAllLines(TestFarms.DEMO.resolve("forecast.csv"));
    List<String> coarse = new ArrayList<>();
    coarse.add(lines.get(0));
    for (int i = 1; i < lines.size(); i++) {
      // 16:00, 19:00, 22:00, 01:00, 04:00, 07:00, 10:00 and the last row, 12:00.
      if ((i - 1) % 3 == 0 || i == lines.size() - 1) {
        coarse.add(lines.get(i));
      }
    }
    Path farm = TestFarms.copyDemo(tmp);
    Files.write(farm.resolve("forecast.csv"), coarse);
    Plan hourly = plan(TestFarms.DEMO, null);
    Plan threeHourly = plan(farm, null);
    int compared = 0;
    for (BlockPlan a : hourly.blocks()) {
      BlockPlan b = threeHourly.blocks().stream().filter(x -> x.blockId().equals(a.blockId())).findFirst().orElseThrow();
      // Every third hour of the demo misses its 06:00 minimum, so the coldest bud comes out up to
      // about 0.6 °C warmer; the risk may then fall to the next band only when the hourly
      // coldest bud lies that close to the band's edge.
      assertThat(b.minBudC()).as("coldest bud " + a.blockId()).isCloseTo(a.minBudC(), within(0.7));
      if (b.risk() != a.risk()) {
        // Band edges: the watch band above the target (default 1.5 °C, rules/policy/thresholds.drl),
        // T10 and T90.
        double nearest = Math.min(Math.abs(a.minBudC() - (a.targetC() + 1.5)),
            Math.min(Math.abs(a.minBudC() - a.t10C()), Math.abs(a.minBudC() - a.t90C())));
        assertThat(nearest).as("risk %s vs %s on %s, near a band's edge", a.risk(), b.risk(),
            a.blockId()).isLessThan(0.7);
      }
      if (a.sprinkle().isPresent() && b.sprinkle().isPresent()) {
        // Linear between 3-hourly values: the demo night cools fastest in the evening, so a
        // threshold is crossed up to half an hour away from the hourly forecast's crossing.
        assertWithin(a.sprinkle().get().start(), b.sprinkle().get().start(), Duration.ofMinutes(30), "start " + a.blockId());
        assertWithin(a.sprinkle().get().stop(), b.sprinkle().get().stop(), Duration.ofMinutes(30), "stop " + a.blockId());
        compared++;
      }
    }
    assertThat(compared).isGreaterThanOrEqualTo(4);
    assertThat(threeHourly.inputs().forecast().notes())
        .anyMatch(n -> n.contains("steps of up to 3 h were interpolated to hourly"));
    assertThat(PlanText.render(threeHourly, UnitSystem.METRIC, false))
        .contains("Forecast: forecast steps of up to 3 h were interpolated to hourly");
    assertThat(PlanJson.toText(threeHourly)).contains("interpolated to hourly");
    assertThat(hourly.inputs().forecast().notes()).isEmpty();
  }

  @Test
  void stepsOfMoreThanThreeHoursAreRefusedWithTheReason() throws IOException {
    List<String> lines = Files.readAllLines(TestFarms.DEMO.resolve("forecast.csv"));
    List<String> coarse = new ArrayList<>();
    coarse.add(lines.get(0));
    for (int i = 1; i < lines.size(); i++) {
      if ((i - 1) % 4 == 0 || i == lines.size() - 1) {
        coarse.add(lines.get(i));
      }
    }
    Path farm = TestFarms.copyDemo(tmp);
    Files.write(farm.resolve("forecast.csv"), coarse);
    assertThatThrownBy(() -> plan(farm, null)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("forecast.csv:3: 240 minutes pass between line 2 and this line")
        .hasMessageContaining("up to 3 h").hasMessageContaining("cannot be told");
  }

  @Test
  void nwsPropertiesCoarserThanHourlyAreNamedInThePlan() {
    Plan p = plan(TestFarms.DEMO, RESPONSES.resolve("demo-night-nws-gridpoint.json"));
    assertThat(p.inputs().forecast().notes()).anyMatch(n -> n.startsWith("coarser than hourly tonight")
        && n.contains("skyCover (up to 6 h)") && n.contains("windSpeed (up to 2 h)"));
    assertThat(PlanText.render(p, UnitSystem.METRIC, false)).contains("skyCover (up to 6 h)");
  }

  @Test
  void aServiceResponseForAnotherDayIsRefused() {
    Path om = RESPONSES.resolve("demo-night-open-meteo.json");
    assertThatThrownBy(() -> new NightPlanner().plan(new PlanRequest(TestFarms.DEMO, om,
        TestFarms.CROPS, TestFarms.RULES, java.time.LocalDate.parse("2026-04-16"))))
        .isInstanceOf(BadInputException.class).hasMessageContaining("demo-night-open-meteo.json")
        .hasMessageContaining("the forecast ends at");
    assertThatThrownBy(() -> new NightPlanner().plan(new PlanRequest(TestFarms.DEMO, om,
        TestFarms.CROPS, TestFarms.RULES, java.time.LocalDate.parse("2026-04-12"))))
        .isInstanceOf(BadInputException.class).hasMessageContaining("demo-night-open-meteo.json")
        .hasMessageContaining("after sunrise on 2026-04-13");
  }

  @Test
  void anOpenMeteoResponseAcrossTheSpringClockChangePlansAsTheCsvWithOffsetsDoes() throws IOException {
    // US clocks go forward at 02:00 on 2026-03-08. Asked on the 7th, Open-Meteo writes every hour
    // at that day's offset, -08:00, so its "2026-03-08T04:00" is 05:00 PDT. The CSV writes each
    // hour with its real offset. Same instants, same values: the same plan.
    var json = new com.fasterxml.jackson.databind.ObjectMapper();
    var om = (com.fasterxml.jackson.databind.node.ObjectNode) json.readTree(
        RESPONSES.resolve("demo-night-open-meteo.json").toFile());
    om.put("utc_offset_seconds", -28800).put("timezone_abbreviation", "PST");
    var times = (com.fasterxml.jackson.databind.node.ArrayNode) om.path("hourly").path("time");
    List<String> csv = new ArrayList<>(List.of("time,air_temp_c,dew_point_c,wind_ms,cloud_pct,solar_wm2"));
    Instant first = Instant.parse("2026-03-08T00:00:00Z");
    java.time.ZoneId la = java.time.ZoneId.of("America/Los_Angeles");
    for (int i = 0; i < times.size(); i++) {
      Instant t = first.plus(Duration.ofHours(i));
      times.set(i, t.atOffset(java.time.ZoneOffset.ofHours(-8)).toLocalDateTime().toString());
      var h = om.path("hourly");
      csv.add(String.format(java.util.Locale.ROOT, "%s,%s,%s,%.6f,%s,%s",
          t.atZone(la).toOffsetDateTime(), h.path("temperature_2m").get(i).asText(),
          h.path("dew_point_2m").get(i).asText(), h.path("wind_speed_10m").get(i).asDouble() / 3.6,
          h.path("cloud_cover").get(i).asText(), h.path("shortwave_radiation").get(i).asText()));
    }
    Path jsonFile = tmp.resolve("dst-open-meteo.json");
    Files.writeString(jsonFile, json.writeValueAsString(om));
    Path csvFile = tmp.resolve("dst.csv");
    Files.write(csvFile, csv);
    java.time.LocalDate night = java.time.LocalDate.parse("2026-03-07");
    Plan a = new NightPlanner().plan(new PlanRequest(TestFarms.DEMO, csvFile, TestFarms.CROPS, TestFarms.RULES, night));
    Plan b = new NightPlanner().plan(new PlanRequest(TestFarms.DEMO, jsonFile, TestFarms.CROPS, TestFarms.RULES, night));
    assertThat(PlanJson.time(b.night().sunrise(), la)).endsWith("-07:00");
    int sprinkled = 0;
    for (BlockPlan x : a.blocks()) {
      BlockPlan y = b.blocks().stream().filter(z -> z.blockId().equals(x.blockId())).findFirst().orElseThrow();
      assertThat(y.status()).isEqualTo(x.status());
      if (x.sprinkle().isPresent()) {
        assertWithin(x.sprinkle().get().start(), y.sprinkle().orElseThrow().start(), Duration.ofMinutes(1), "start " + x.blockId());
        assertWithin(x.sprinkle().get().stop(), y.sprinkle().orElseThrow().stop(), Duration.ofMinutes(1), "stop " + x.blockId());
        sprinkled++;
      }
    }
    assertThat(sprinkled).isPositive();
  }

  static void assertWithin(Instant a, Instant b, Duration tolerance, String what) {
    assertThat(Duration.between(a, b).abs()).as("%s: %s vs %s", what, a, b).isLessThanOrEqualTo(tolerance);
  }
}
