package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.function.UnaryOperator;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledOnOs;
import org.junit.jupiter.api.condition.OS;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Issue 14's bad inputs through the command line: each exits 2 with one or two short lines that
 * name the file and line, or the option, with no Java class name and no stack trace; and the
 * inputs people reasonably expect to work do work, giving the very plan the demo gives.
 */
class BadInputTest {
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
    List<String> args = new ArrayList<>(List.of("plan", "--no-audit", "--farm", farm.toString(),
        "--rules", "rules", "--crop-profiles", "crop-profiles"));
    args.addAll(List.of(extra));
    return Cli.run(args.toArray(String[]::new));
  }

  static void assertRefused(Cli.Result r, String... words) {
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(2);
    assertThat(r.err()).as(r.toString()).startsWith("rimeward: ").contains(words)
        .doesNotContain("Exception", "\tat ", "java.", "\u001b");
    assertThat(r.err().strip().lines().count()).as(r.err()).isLessThanOrEqualTo(2);
    assertThat(r.err().length()).as("short").isLessThan(400);
  }

  void edit(String file, UnaryOperator<String> change) throws IOException {
    Path f = farm.resolve(file);
    String before = Files.readString(f);
    String after = change.apply(before);
    assertThat(after).as("fixture edit of " + file).isNotEqualTo(before);
    Files.writeString(f, after);
  }

  /** Farm-file and forecast edits that must be refused: file, from, to, words the message has. */
  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "RH as a fraction | forecast.csv | dew_point_c,wind_ms,cloud_pct,solar_wm2\\n2026-04-14T16:00-07:00,9.0,-2.0, | rh_pct,wind_ms,cloud_pct,solar_wm2\\n2026-04-14T16:00-07:00,9.0,0.7, | forecast.csv:2: column rh_pct, value '0.7', percent, 0–100",
      "unbalanced quote | forecast.csv | 2026-04-14T18:00 | \"2026-04-14T18:00 | forecast.csv:4: a quote (\") opens here and never closes",
      "decimal comma in a comma CSV | forecast.csv | 18:00-07:00,6.5, | 18:00-07:00,6,5, | forecast.csv:4:, use a decimal point",
      "tab indentation | farm.yaml | '  latitude: 46.28' | '\tlatitude: 46.28' | farm.yaml:5: indented with a tab",
      "block area typo | farm.yaml | area: 4.5 ha | area: 4500 ha | farm.yaml:30: blocks[upper-golden].area, likely a typo, decimal point",
      "infinite area | farm.yaml | area: 4.5 ha | area: 1e999 ha | farm.yaml:30:, not a finite number",
      "absurd flow | farm.yaml | max_flow: 450 m3/h | max_flow: 450000000 m3/h | farm.yaml:19: water_sources[pond].max_flow",
      "absurd volume | farm.yaml | volume: 3400 m3 | volume: 3.4e12 m3 | farm.yaml:20: water_sources[pond].volume",
      "decimal comma quantity | farm.yaml | cold_air_offset: -0.5C | cold_air_offset: -2,5C | farm.yaml:41:, use a decimal point",
      "Kelvin below absolute zero | farm.yaml | rate: 5.5 mm/h | rate: 5.5 mm/h\\n      water_temp: -5K | farm.yaml:, below absolute zero",
      "elevation the physics refuses | farm.yaml | elevation: 240 m | elevation: 4600 m | farm.yaml:7: farm.elevation, outside -420 to 4500 m",
  })
  void badFileInputIsRefusedWithFileAndLine(String name, String file, String from, String to,
      String words) throws IOException {
    edit(file, t -> t.replaceFirst(java.util.regex.Pattern.quote(from.replace("\\n", "\n")),
        java.util.regex.Matcher.quoteReplacement(to.replace("\\n", "\n"))));
    assertRefused(plan(), words.split(", "));
  }

  @Test
  void multiMegabyteCellIsQuotedShort() throws IOException {
    edit("forecast.csv", t -> t.replace("9.0,-2.0,", "9" + "0".repeat(3_000_000) + "x,-2.0,"));
    assertRefused(plan(), "forecast.csv:2: column air_temp_c", "(3000002 characters)");
  }

  @Test
  void forecastPathThatIsAFolderOrADevice() throws IOException {
    // A folder is where 'forecast fetch' saves; one with no fetched forecast says so.
    Path empty = Files.createDirectories(tmp.resolve("no-forecasts"));
    assertRefused(plan("--forecast", empty.toString()), empty + ": no fetched forecast in this folder",
        "rimeward forecast fetch");
  }

  @Test
  @EnabledOnOs(OS.LINUX)
  void endlessForecastStopsPastTheStatedSize() throws Exception {
    assertTimeoutPreemptively(Duration.ofSeconds(120), () -> {
      assertRefused(plan("--forecast", "/dev/zero"), "/dev/zero: is larger than 16 MB");
      Path fifo = tmp.resolve("endless.csv");
      Process mk = new ProcessBuilder("mkfifo", fifo.toString()).start();
      assertThat(mk.waitFor()).isZero();
      Thread writer = new Thread(() -> {
        byte[] row = "2026-04-14T16:00-07:00,9.0,-2.0,6.5,40,420\n".getBytes(StandardCharsets.UTF_8);
        try (OutputStream out = Files.newOutputStream(fifo)) {
          out.write("time,air_temp_c,dew_point_c,wind_ms,cloud_pct,solar_wm2\n".getBytes(StandardCharsets.UTF_8));
          while (true) {
            out.write(row);
          }
        } catch (IOException closedByTheReader) {
          // the reader stopped past its limit and closed the pipe
        }
      });
      writer.setDaemon(true);
      writer.start();
      assertRefused(plan("--forecast", fifo.toString()), fifo + ": is larger than 16 MB");
    });
  }

  @ParameterizedTest(name = "--night {0}")
  @CsvSource(delimiter = '|', value = {
      "2026-02-30 | '2026-02-30' does not exist: February 2026 has 28 days",
      "2026-13-01 | has no month 13",
      "14/04/2026 | '14/04/2026' is not a date; write the date as YYYY-MM-DD",
      "tonight | is not a date",
  })
  void impossibleOrMisformattedNight(String night, String words) {
    assertRefused(plan("--night", night), "--night", words);
  }

  @Test
  void ruleFileThatIsNotUtf8OrIsAFolder() throws IOException {
    Path rules = copyTree(Path.of("rules"), tmp.resolve("rules"));
    Path drl = rules.resolve("cautions/extra.drl");
    Files.write(drl, "package cautions;\n// caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
    assertRefused(Cli.run("plan", "--no-audit", "--farm", farm.toString(), "--rules",
        rules.toString(), "--crop-profiles", "crop-profiles"), drl + ":2: not UTF-8");
    Files.delete(drl);
    Path folder = Files.createDirectories(rules.resolve("x.drl"));
    assertRefused(Cli.run("plan", "--no-audit", "--farm", farm.toString(), "--rules",
        rules.toString(), "--crop-profiles", "crop-profiles"), folder + ": is a folder, not a rule file");
  }

  @Test
  void cropFileThatIsNotUtf8() throws IOException {
    Path crops = copyTree(Path.of("crop-profiles"), tmp.resolve("crops"));
    Path apple = crops.resolve("apple.yaml");
    String text = Files.readString(apple);
    Files.write(apple, "# caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1),
        java.nio.file.StandardOpenOption.APPEND);
    int line = (int) text.lines().count() + 1;
    assertRefused(Cli.run("plan", "--no-audit", "--farm", farm.toString(), "--rules", "rules",
        "--crop-profiles", crops.toString()), apple + ":" + line + ": not UTF-8");
    assertRefused(Cli.run("profile", "check", "--crop-profiles", crops.toString()),
        apple + ":" + line + ": not UTF-8");
  }

  @Test
  void controlCharactersInANameNeverReachTheTerminal() throws IOException {
    edit("farm.yaml", t -> t.replace("name: Quillhaven Bench Farm", "name: \"Quill\\e[2J\\e[31mhaven\""));
    assertRefused(plan(), "farm.yaml:4: farm.name: contains the control character U+001B");
  }

  // Inputs that must work: the demo plan, whatever the spelling of the same numbers.
  @Test
  void europeanTabAndCommentedExportsAndTypographicMinusGiveTheSamePlan() throws IOException {
    String expected = plan().out();
    assertThat(expected).contains("Frost plan for Quillhaven Bench Farm");
    String csv = Files.readString(farm.resolve("forecast.csv"));
    StringBuilder european = new StringBuilder("# from the station's spreadsheet\n");
    for (String line : csv.split("\n")) {
      List<String> cells = new ArrayList<>();
      for (String cell : line.split(",")) {
        // Numbers as a European spreadsheet writes them: decimal comma, typographic minus.
        cells.add(cell.matches("-?[0-9.]+") ? cell.replace('.', ',').replace('-', '\u2212') : cell);
      }
      european.append(String.join(";", cells)).append('\n');
    }
    Files.writeString(farm.resolve("forecast.csv"), european.toString());
    Cli.Result semi = plan();
    assertThat(semi.exitCode()).as(semi.toString()).isZero();
    assertThat(semi.out()).isEqualTo(expected);
    Files.writeString(farm.resolve("forecast.csv"), "# exported\n" + csv.replace(",", "\t"));
    Cli.Result tabs = plan();
    assertThat(tabs.exitCode()).as(tabs.toString()).isZero();
    assertThat(tabs.out()).isEqualTo(expected);
  }

  @Test
  void yamlMergeKeysAndTypographicMinusInTheFarmFileGiveTheSamePlan() throws IOException {
    String expected = plan().out();
    edit("farm.yaml", t -> t.replaceFirst("""
            sprinklers:
              rate: 3.8 mm/h
              source: pond
        """, """
            sprinklers: &pond-set
              rate: 3.8 mm/h
              source: pond
        """).replaceFirst("""
            sprinklers:
              rate: 0.15 in/h
              source: pond
        """, """
            sprinklers:
              <<: *pond-set
              rate: 0.15 in/h
        """).replace("longitude: -119.45", "longitude: \u2212119.45"));
    Cli.Result r = plan();
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).isEqualTo(expected);
  }

  static Path copyTree(Path from, Path to) throws IOException {
    try (Stream<Path> walk = Files.walk(from)) {
      for (Path p : walk.toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    }
    return to;
  }
}
