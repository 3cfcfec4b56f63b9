package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** The nightly run on the command line, in-process, on a copy of the demo farm. */
class PlanRunTest {
  @TempDir Path tmp;
  Path farm;

  @BeforeEach
  void copyDemo() throws IOException {
    farm = tmp.resolve("farm");
    Files.createDirectories(farm);
    Files.copy(Path.of("demo-farm/farm.yaml"), farm.resolve("farm.yaml"));
    Files.copy(Path.of("demo-farm/forecast.csv"), farm.resolve("forecast.csv"));
  }

  Cli.Result plan(String... extra) {
    List<String> args = new java.util.ArrayList<>(List.of("plan", "--farm", farm.toString(),
        "--rules", "rules", "--crop-profiles", "crop-profiles"));
    args.addAll(List.of(extra));
    return Cli.run(args.toArray(String[]::new));
  }

  @Test
  void textPlanShowsTheNightTheBlocksTheWaterAndTheCautions() {
    Cli.Result r = plan();
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("Frost plan for Quillhaven Bench Farm, night of 2026-04-14")
        .contains("sunset", "sunrise", "hollow-cherry", "bench-concord", "nothing needed")
        .contains("Water", "pond", "SHORT", "Cautions")
        .contains("Decision support only", "thermometers at bud height", "water rights");
    assertThat(r.err()).isEmpty();
  }

  @Test
  void explainListsEveryRuleWithItsNumbers() {
    Cli.Result r = plan("--explain");
    assertThat(r.exitCode()).isZero();
    assertThat(r.out()).contains("SPRINKLE-START:", "RISK-SEVERE:", "WATER-SHORT:", "°C");
  }

  @Test
  void usUnitsShowFahrenheitAndInchesPerHour() {
    Cli.Result r = plan("--units", "us");
    assertThat(r.exitCode()).isZero();
    assertThat(r.out()).contains("°F", "in/h", "gpm", "gal").doesNotContain("mm/h");
  }

  @Test
  void jsonHasTheDocumentedKeys() throws IOException {
    Cli.Result r = plan("--format", "json");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    JsonNode root = new ObjectMapper().readTree(r.out());
    assertThat(root.get("night").has("date")).isTrue();
    assertThat(root.get("night").has("sunset")).isTrue();
    assertThat(root.get("night").has("sunrise")).isTrue();
    assertThat(root.get("cautions").size()).isGreaterThanOrEqualTo(4);
    for (JsonNode b : root.get("blocks")) {
      for (String key : List.of("block", "crop", "variety", "stage", "t10_c", "t90_c", "target_c",
          "min_air_c", "min_bud_c", "min_wet_bulb_c", "coldest_at", "risk", "kill_pct_unprotected",
          "status", "actions", "cautions", "rules")) {
        assertThat(b.has(key)).as("block %s has %s", b.get("block"), key).isTrue();
      }
      for (JsonNode rule : b.get("rules")) {
        assertThat(rule.has("id")).isTrue();
        assertThat(rule.get("explanation").asText()).doesNotContain("{");
      }
    }
    for (JsonNode w : root.get("water")) {
      for (String key : List.of("source", "peak_flow_m3_h", "max_flow_m3_h", "volume_m3",
          "available_m3", "short")) {
        assertThat(w.has(key)).isTrue();
      }
    }
    // Times carry the farm's offset: a spring night in Pacific daylight time.
    assertThat(root.at("/night/sunset").asText()).endsWith("-07:00");
  }

  @Test
  void csvHasOneRowPerAction() {
    Cli.Result r = plan("--format", "csv");
    assertThat(r.exitCode()).isZero();
    String[] lines = r.out().split("\n");
    assertThat(lines[0]).startsWith("night,block,crop,variety,stage,risk");
    assertThat(Stream.of(lines).filter(l -> l.contains(",field-berries,")).count()).isEqualTo(2);
  }

  @Test
  void exitCodeOnActionIsThreeWhenABlockNeedsProtection() {
    assertThat(plan("--exit-code-on-action").exitCode()).isEqualTo(3);
  }

  /** Each bad input exits 2 with one message naming where the problem is. */
  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "missing column | forecast.csv | dew_point_c | dewpoint | forecast.csv",
      "malformed number | forecast.csv | T07:00-07:00,-1.5, | T07:00-07:00,minus1.5, | forecast.csv:17",
      "gap in the night | forecast.csv | 2026-04-15T02:00-07:00,-1.5,-6.0,1.2,0,0\\n2026-04-15T03:00-07:00,-2.1,-6.2,0.8,0,0\\n2026-04-15T04:00-07:00,-2.6,-6.3,0.6,0,0\\n | | 240 minutes pass between line",
      "times out of order | forecast.csv | 2026-04-15T03:00 | 2026-04-15T01:30 | forecast.csv:13",
      "duplicate time | forecast.csv | 2026-04-15T03:00 | 2026-04-15T02:00 | forecast.csv:13",
      "fahrenheit in a celsius column | forecast.csv | 06:00-07:00,-3.2, | 06:00-07:00,47.5, | air_temp_f",
      "dew point above air | forecast.csv | 05:00-07:00,-3.0,-6.4 | 05:00-07:00,-3.0,-1.0 | dew point",
      "unknown crop | farm.yaml | crop: sweet-cherry | crop: durian | farm.yaml:",
      "unknown stage | farm.yaml | stage: in-the-shuck | stage: in-the-shuk | in-the-shuk",
      "unknown water source | farm.yaml | source: well | source: lake | lake",
  })
  void badInputExitsTwoWithAClearMessage(String name, String file, String from, String to,
      String expected) throws IOException {
    Path f = farm.resolve(file);
    String text = Files.readString(f);
    String fromText = from.replace("\\n", "\n");
    assertThat(text).as("fixture for %s", name).contains(fromText);
    Files.writeString(f, text.replaceFirst(java.util.regex.Pattern.quote(fromText),
        java.util.regex.Matcher.quoteReplacement(to == null ? "" : to)));
    Cli.Result r = plan();
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(2);
    assertThat(r.err()).contains(expected).startsWith("rimeward: ").doesNotContain("Exception", "\tat ");
    assertThat(r.err().strip().lines().count()).as(r.err()).isLessThanOrEqualTo(2);
  }

  @Test
  void aRuleFileThatDoesNotCompileNamesTheFileAndLine() throws IOException {
    Path rules = tmp.resolve("rules");
    try (Stream<Path> walk = Files.walk(Path.of("rules"))) {
      for (Path p : walk.toList()) {
        Path target = rules.resolve(Path.of("rules").relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    }
    Path start = rules.resolve("sprinkling/start.drl");
    Files.writeString(start, Files.readString(start).replace("$s : StartThreshold($id : blockId)",
        "$s : StartThreshhold($id : blockId)"));
    Cli.Result r = Cli.run("plan", "--farm", farm.toString(), "--rules", rules.toString(),
        "--crop-profiles", "crop-profiles");
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(2);
    assertThat(r.err()).contains("start.drl:").contains("does not compile");
  }
}
