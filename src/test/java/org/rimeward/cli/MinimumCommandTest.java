package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.minimum.HistoryFixtures;

/** 'minimum fit' and 'minimum predict' end to end on an invented farm and an invented history. */
class MinimumCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  @TempDir Path tmp;

  private Path farmWithHistory(int radiationNights, int cloudyNights) throws Exception {
    Path farm = tmp.resolve("farm");
    Files.createDirectories(farm);
    Files.writeString(farm.resolve("farm.yaml"), HistoryFixtures.farmYaml());
    Files.writeString(farm.resolve("history.csv"), HistoryFixtures.history(21, 0.7, 0.3, -4.5,
        LocalDate.of(2026, 3, 25), radiationNights, cloudyNights, Duration.ofMinutes(15)));
    return farm;
  }

  @Test
  void fitWritesTheModelWithTheHistorysHashAndPredictUsesIt() throws Exception {
    Path farm = farmWithHistory(20, 5);
    Cli.Result fit = Cli.run("minimum", "fit", "--farm", farm.toString(), "--history",
        farm.resolve("history.csv").toString(), "--json");
    assertThat(fit.exitCode()).as(fit.toString()).isZero();
    JsonNode f = JSON.readTree(fit.out());
    // The invented law the history was made with: a = 0.7, b = 0.3, c = -4.5 °C.
    assertThat(f.get("a").asDouble()).isCloseTo(0.7, within(0.02));
    assertThat(f.get("b").asDouble()).isCloseTo(0.3, within(0.02));
    assertThat(f.get("c").asDouble()).isCloseTo(-4.5, within(0.1));
    assertThat(f.get("nights").asInt()).isEqualTo(20);
    assertThat(f.get("nights_excluded").get("cloudy").asInt()).isEqualTo(5);
    String yaml = Files.readString(farm.resolve("site-minimum.yaml"));
    String sha = java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
        .digest(Files.readAllBytes(farm.resolve("history.csv"))));
    assertThat(yaml).contains("sha256: " + sha).contains("from: 2026-03-25").contains("nights: 20");
    assertThat(f.get("history_sha256").asText()).isEqualTo(sha);

    Cli.Result p = Cli.run("minimum", "predict", "--farm", farm.toString(), "--temp", "6",
        "--dew-point", "0", "--json");
    assertThat(p.exitCode()).as(p.toString()).isZero();
    JsonNode j = JSON.readTree(p.out());
    assertThat(j.get("min_air_c").asDouble()).isCloseTo(0.7 * 6 + 0.3 * 0 - 4.5, within(0.1));
    assertThat(j.get("interval_low_c").asDouble()).isLessThan(j.get("min_air_c").asDouble());
    assertThat(j.get("interval_high_c").asDouble()).isGreaterThan(j.get("min_air_c").asDouble());
    assertThat(j.get("interval_level").asDouble()).isEqualTo(0.95);

    Cli.Result text = Cli.run("--units", "us", "minimum", "predict", "--farm", farm.toString(),
        "--temp", "42.8F", "--dew-point", "32F");
    assertThat(text.exitCode()).as(text.toString()).isZero();
    assertThat(text.out()).contains("°F").contains("95 % interval").contains("clear calm nights only");
  }

  @Test
  void theRadiationNightCriteriaAreTheRuleFilesTheFarmPlansBy() throws Exception {
    // The farm's own rules folder, as the plan would read it, with "no clouds" widened to 100 %
    // cloud: the five overcast nights (90 % cloud) now count. The bundled rules (25 %, a Rimeward
    // choice) leave them out, as fitWritesTheModelWithTheHistorysHashAndPredictUsesIt shows.
    Path farm = farmWithHistory(20, 5);
    org.rimeward.rules.RuleFolders.withThresholds(farm.resolve("rules"), """
        new Thresholds(1.5, 2.2, 4.5, 30.0, 0.0, 1.0, 0.5, 70.0, 0.5,
              30, 1.0, 60,
              2.0, 100.0, 2.0, 1.0, 90)""");
    Cli.Result own = Cli.run("minimum", "fit", "--farm", farm.toString(), "--history",
        farm.resolve("history.csv").toString(), "--json");
    assertThat(own.exitCode()).as(own.toString()).isZero();
    JsonNode f = JSON.readTree(own.out());
    assertThat(f.get("nights").asInt()).isEqualTo(25);
    assertThat(f.get("criteria").asText()).contains("mean cloud ≤ 100 %");
    Cli.Result bundled = Cli.run("minimum", "fit", "--farm", farm.toString(), "--history",
        farm.resolve("history.csv").toString(), "--rules", "rules", "--json");
    assertThat(bundled.exitCode()).as(bundled.toString()).isZero();
    assertThat(JSON.readTree(bundled.out()).get("nights").asInt()).isEqualTo(20);
  }

  @Test
  void tooFewNightsIsExitTwoWithTheReasonAndNothingWritten() throws Exception {
    Path farm = farmWithHistory(4, 8);
    Cli.Result fit = Cli.run("minimum", "fit", "--farm", farm.toString(), "--history",
        farm.resolve("history.csv").toString());
    assertThat(fit.exitCode()).as(fit.toString()).isEqualTo(Main.BAD_INPUT);
    assertThat(fit.err()).contains("only 4 radiation night(s) qualify out of 12").contains("8 cloudy");
    assertThat(farm.resolve("site-minimum.yaml")).doesNotExist();
  }

  @Test
  void predictWithoutAModelSaysHowToMakeOne() throws Exception {
    Path farm = farmWithHistory(1, 0);
    Cli.Result p = Cli.run("minimum", "predict", "--farm", farm.toString(), "--temp", "5",
        "--dew-point", "0");
    assertThat(p.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(p.err()).contains("site-minimum.yaml").contains("rimeward minimum fit");
    Cli.Result swapped = Cli.run("minimum", "predict", "--farm", farm.toString(), "--temp", "0",
        "--dew-point", "5");
    assertThat(swapped.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(swapped.err()).contains("--dew-point");
  }
}
