package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class CalcCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  private static JsonNode json(String... args) throws Exception {
    Cli.Result r = Cli.run(args);
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    assertThat(r.err()).isEmpty();
    assertThat(r.out().strip().lines().count()).as("one line").isEqualTo(1);
    return JSON.readTree(r.out());
  }

  private static List<String> keys(JsonNode n) {
    List<String> k = new ArrayList<>();
    n.fieldNames().forEachRemaining(k::add);
    return k;
  }

  @Test
  void airJsonHasExactlyTheDocumentedKeys() throws Exception {
    // Knox et al. (2017) one-third rule example: 32 °F, Td 23 °F -> wet bulb about 29 °F (-1.7 °C).
    JsonNode n = json("calc", "air", "--temp", "0C", "--dew-point", "23F", "--json");
    assertThat(keys(n)).containsExactly("air_temp_c", "dew_point_c", "frost_point_c", "rh_pct",
        "vapour_pressure_kpa", "pressure_kpa", "wet_bulb_c", "ice_bulb_c");
    assertThat(n.get("wet_bulb_c").asDouble()).isCloseTo(-1.67, within(0.3));
    assertThat(n.get("pressure_kpa").asDouble()).isCloseTo(101.3, within(0.01));
    assertThat(n.get("ice_bulb_c").isNumber()).isTrue();
  }

  @Test
  void airWithRhAndElevationAndNoIceBulb() throws Exception {
    // FAO-56 Example 2: 1800 m -> 81.8 kPa. Reference 5.2: 5 °C, 60 % -> Td -2.13 °C.
    JsonNode n = json("calc", "air", "--temp", "5", "--rh", "60%", "--elevation", "1800 m", "--json");
    assertThat(n.get("pressure_kpa").asDouble()).isCloseTo(81.8, within(0.05));
    assertThat(n.get("dew_point_c").asDouble()).isCloseTo(-2.13, within(0.01));
    assertThat(n.get("ice_bulb_c").isNull()).as("bulb above 0 °C").isTrue();
  }

  @Test
  void bareTemperaturesFollowUsUnitsAndTheLineShowsFahrenheit() {
    Cli.Result r = Cli.run("calc", "air", "--temp", "32", "--dew-point", "23", "--units", "us");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    assertThat(r.out()).contains("air 32.0 °F").contains("dew point 23.0 °F").contains("wet bulb 28.8 °F");
    Cli.Result before = Cli.run("--units", "us", "calc", "air", "--temp", "32", "--dew-point", "23", "--json");
    assertThat(before.out()).contains("\"air_temp_c\":0.0");
  }

  @Test
  void sunJsonAcrossDaylightSavingAndPolarDay() throws Exception {
    JsonNode n = json("calc", "sun", "--lat", "34.05", "--lon", "-118.25", "--date", "2024-03-10",
        "--zone", "America/Los_Angeles", "--json");
    assertThat(keys(n)).containsExactly("sunrise", "sunset", "civil_dawn", "civil_dusk", "polar");
    assertThat(n.get("sunrise").asText()).startsWith("2024-03-10T07:").endsWith("-07:00");
    assertThat(n.get("polar").isNull()).isTrue();
    JsonNode polar = json("calc", "sun", "--lat", "69.65", "--lon", "18.96", "--date", "2024-06-21",
        "--zone", "Europe/Oslo", "--json");
    assertThat(polar.get("polar").asText()).isEqualTo("day");
    assertThat(polar.get("sunrise").isNull()).isTrue();
    JsonNode night = json("calc", "sun", "--lat", "69.65", "--lon", "18.96", "--date", "2024-12-21",
        "--zone", "Europe/Oslo", "--json");
    assertThat(night.get("polar").asText()).isEqualTo("night");
    assertThat(night.get("civil_dawn").asText()).startsWith("2024-12-21T").endsWith("+01:00");
  }

  @Test
  void sunLine() {
    Cli.Result r = Cli.run("calc", "sun", "--lat", "47.4235", "--lon", "-120.3103", "--date", "2024-04-15",
        "--zone", "America/Los_Angeles");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    // Reference 6.3 (COMPUTED by the NOAA method): 06:11.5 / 19:51.6 PDT.
    assertThat(r.out()).contains("sunrise 06:11 -07:00").contains("sunset 19:51 -07:00");
  }

  @Test
  void budJsonAndLine() throws Exception {
    // Leuning & Cremer (1988): 1-3 °C below air on a clear calm night.
    JsonNode n = json("calc", "bud", "--temp", "0C", "--dew-point", "-5C", "--wind", "0 m/s", "--cloud", "0", "--json");
    assertThat(keys(n)).containsExactly("bud_temp_c", "depression_c");
    assertThat(n.get("depression_c").asDouble()).isBetween(1.0, 3.0);
    assertThat(n.get("bud_temp_c").asDouble()).isCloseTo(-n.get("depression_c").asDouble(), within(0.011));
    Cli.Result r = Cli.run("calc", "bud", "--temp", "28", "--dew-point", "20", "--wind", "9 mph", "--cloud", "0%",
        "--units", "us");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    assertThat(r.out()).startsWith("bud about ").contains("°F below the air at 28.0 °F").contains("9.0 mph at 2 m");
  }

  @Test
  void rateJsonBothWays() throws Exception {
    // UF/IFAS Circ. 287 as printed by MSU Extension: 0.16 in/h (4.06 mm/h) at 22 °F, wind 0-1 mph.
    JsonNode need = json("calc", "rate", "--temp", "22F", "--dew-point", "-8.6C", "--wind", "0.5 mph", "--json");
    assertThat(keys(need)).containsExactly("required_rate_mm_h", "wind_10m_ms", "wind_2m_ms", "advised", "reason");
    assertThat(need.get("required_rate_mm_h").asDouble()).isCloseTo(4.06, within(0.3 * 4.06));
    assertThat(need.get("wind_2m_ms").asDouble()).as("FAO-56 Eq. 47 from 10 m").isCloseTo(0.167, within(0.01));
    JsonNode to = json("calc", "rate", "--rate", "0.16 in/h", "--dew-point", "-8.6C", "--wind", "0.5 mph", "--json");
    assertThat(keys(to)).containsExactly("protects_to_c", "limited_by", "wind_10m_ms", "wind_2m_ms", "advised", "reason");
    assertThat(to.get("protects_to_c").asDouble()).isCloseTo(-5.6, within(1.7));
    assertThat(to.get("limited_by").asText()).isEqualTo("air-temperature");
    Cli.Result r = Cli.run("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "2 m/s",
        "--wind-height", "2 m", "--water-temp", "10", "--elevation", "300 m");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    assertThat(r.out()).startsWith("required over-plant rate ").contains("mm/h").contains("water 10.0 °C")
        .contains("wind 2.0 m/s at 2 m, 2.0 m/s at 2 m");
  }

  @Test
  void rateAnswersInAnyWindAndSaysWhetherItIsAdvised() throws Exception {
    // The need keeps rising with wind; whether to sprinkle in it is the rule files' wind limit.
    JsonNode at4 = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "4 m/s", "--json");
    JsonNode at8 = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "8 m/s", "--json");
    JsonNode at12 = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "12 m/s", "--json");
    assertThat(at8.get("required_rate_mm_h").asDouble()).isGreaterThan(at4.get("required_rate_mm_h").asDouble());
    assertThat(at12.get("required_rate_mm_h").asDouble()).isGreaterThan(at8.get("required_rate_mm_h").asDouble())
        .isLessThan(100);
    assertThat(at4.get("advised").asBoolean()).as(at4.toString()).isTrue();
    assertThat(at4.get("reason").asText()).contains("4.0 m/s at 10 m").contains("needs more water");
    for (JsonNode windy : List.of(at8, at12)) {
      assertThat(windy.get("advised").asBoolean()).as(windy.toString()).isFalse();
      assertThat(windy.get("reason").asText()).startsWith("The wind, ")
          .contains("at 10 m").contains("the rule files' limit");
    }
    Cli.Result text = Cli.run("calc", "rate", "--temp", "24F", "--dew-point", "18F", "--wind", "12 m/s",
        "--units", "us");
    assertThat(text.out().lines().toList()).hasSize(2);
    assertThat(text.out().lines().toList().get(1)).startsWith("Not advised. The wind, 26.8 mph at 33 ft (20.1 mph at 7 ft)");
  }

  @Test
  void theWindLimitIsTheOneTheRuleFilesSet(@org.junit.jupiter.api.io.TempDir java.nio.file.Path tmp)
      throws Exception {
    // Near miss either side of the bundled limit, then the same wind under a rule folder whose
    // THRESHOLDS rule allows more: calc follows the rule files, not a number of its own.
    JsonNode under = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "4.4 m/s", "--json");
    JsonNode over = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "4.6 m/s", "--json");
    assertThat(under.get("advised").asBoolean()).isTrue();
    assertThat(over.get("advised").asBoolean()).isFalse();
    java.nio.file.Path rules = tmp.resolve("rules");
    try (var files = java.nio.file.Files.walk(java.nio.file.Path.of("rules"))) {
      for (java.nio.file.Path f : files.toList()) {
        java.nio.file.Path to = rules.resolve(java.nio.file.Path.of("rules").relativize(f).toString());
        if (java.nio.file.Files.isDirectory(f)) {
          java.nio.file.Files.createDirectories(to);
        } else {
          java.nio.file.Files.copy(f, to);
        }
      }
    }
    java.nio.file.Path thresholds = rules.resolve("policy/thresholds.drl");
    String text = java.nio.file.Files.readString(thresholds);
    assertThat(text).contains("new Thresholds(1.5, 2.2, 4.5,");
    java.nio.file.Files.writeString(thresholds, text.replace("new Thresholds(1.5, 2.2, 4.5,", "new Thresholds(1.5, 2.2, 6.0,"));
    JsonNode relaxed = json("calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "4.6 m/s",
        "--rules", rules.toString(), "--json");
    assertThat(relaxed.get("advised").asBoolean()).as(relaxed.toString()).isTrue();
  }

  @Test
  void windAboveFreezingIsNoWindBorneFreeze() throws Exception {
    JsonNode n = json("calc", "rate", "--temp", "2", "--dew-point", "-6", "--wind", "10 m/s", "--json");
    assertThat(n.get("advised").asBoolean()).isTrue();
    assertThat(n.get("reason").asText()).contains("not below freezing");
    assertThat(n.get("required_rate_mm_h").asDouble()).isGreaterThan(0);
  }

  @Test
  void rateThatHoldsToTheDewPointSaysSoPlainly() throws Exception {
    JsonNode n = json("calc", "rate", "--rate", "0.6 in/h", "--dew-point", "26F", "--wind", "1 mph", "--json");
    assertThat(n.get("protects_to_c").isNull()).isTrue();
    assertThat(n.get("limited_by").asText()).isEqualTo("dew-point");
    Cli.Result r = Cli.run("calc", "rate", "--rate", "0.6 in/h", "--dew-point", "26F", "--wind", "1 mph",
        "--units", "us");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.OK);
    assertThat(r.out()).contains("even with the air down at its dew point, 26.0 °F")
        .contains("depends on a dew point the night does not reach here").contains("--dew-point");
    Cli.Result shortRate = Cli.run("calc", "rate", "--rate", "0.5 mm/h", "--dew-point", "-10", "--wind", "20 mph");
    assertThat(shortRate.exitCode()).as(shortRate.toString()).isEqualTo(Main.OK);
    assertThat(shortRate.out()).contains("is short even with the air at 0 °C")
        .contains("Not advised. 0.5 mm/h falls short");
  }

  @Test
  void killJsonAndLine() throws Exception {
    // Penn State / WSU: apple full bloom 10 % at 28 °F, 90 % at 25 °F; the midpoint is 50 %.
    JsonNode n = json("calc", "kill", "--t10", "28F", "--t90", "25F", "--temp", "26.5F", "--json");
    assertThat(keys(n)).containsExactly("kill_pct");
    assertThat(n.get("kill_pct").asDouble()).isCloseTo(50.0, within(0.05));
    Cli.Result r = Cli.run("calc", "kill", "--t10", "-2.2", "--t90", "-3.9", "--temp", "-2.2");
    assertThat(r.out()).startsWith("about 10 % of buds killed at -2.2 °C");
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "unknown unit | calc air --temp 3Q --dew-point -2 | unit 'Q'",
      "RH above 100 | calc air --temp 3 --rh 120 | relative humidity",
      "dew point above air | calc air --temp 0 --dew-point 2 | dew point 2 °C is above the air temperature 0 °C",
      "bud dew point above air | calc bud --temp 0 --dew-point 1 --wind 1m/s --cloud 0 | above the air temperature",
      "latitude out of range | calc sun --lat 95 --lon 0 --date 2024-04-01 --zone UTC | latitude",
      "unknown zone | calc sun --lat 45 --lon 0 --date 2024-04-01 --zone Mars/Olympus | --zone: 'Mars/Olympus'",
      "bad date | calc sun --lat 45 --lon 0 --date 2024-02-30 --zone UTC | --date: '2024-02-30'",
      "wind without unit | calc bud --temp 0 --dew-point -4 --wind 3 --cloud 0 | --wind: '3' has no unit",
      "wind height too low | calc rate --temp -4 --dew-point -7 --wind 8m/s --wind-height 0.1m | --wind/--wind-height: measurement height 0.1 m",
      "t90 not below t10 | calc kill --t10 -4 --t90 -3 --temp -3 | must be below",
      "both temp and rate | calc rate --temp -4 --rate 3mm/h --dew-point -7 --wind 1m/s | mutually exclusive",
      "missing humidity | calc air --temp 3 | --dew-point"})
  void badInputExitsTwoWithOneLineSayingWhatToFix(String label, String args, String expected) {
    Cli.Result r = Cli.run(args.trim().split(" +"));
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains(expected).doesNotContain("Exception").doesNotContain("\tat ");
    assertThat(r.err().lines().filter(l -> l.startsWith("rimeward:")).count()).isEqualTo(1);
    assertThat(r.out()).isEmpty();
  }

  @ParameterizedTest
  @ValueSource(strings = {"air", "sun", "bud", "rate", "kill"})
  void helpSaysDecisionSupportAndShowsUnits(String sub) {
    Cli.Result r = Cli.run("calc", sub, "--help");
    assertThat(r.exitCode()).isEqualTo(Main.OK);
    assertThat(r.out()).contains("Decision support").doesNotContain("TODO");
    if (!sub.equals("sun")) {
      assertThat(r.out()).containsAnyOf("-2.2C or 28F", "m/s");
    } else {
      assertThat(r.out()).contains("YYYY-MM-DD").contains("AREA/CITY");
    }
    assertThat(r.err()).isEmpty();
  }

  @Test
  void calcAloneAsksForASubcommand() {
    Cli.Result r = Cli.run("calc");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("air, sun, bud, rate or kill");
  }
}
