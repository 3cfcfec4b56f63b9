package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ProfileCommandTest {
  @TempDir Path dir;
  String folder;

  @BeforeEach
  void copyProfiles() throws IOException {
    try (Stream<Path> s = Files.list(Path.of("crop-profiles"))) {
      for (Path p : s.toList()) {
        Files.copy(p, dir.resolve(p.getFileName()));
      }
    }
    folder = dir.toString();
  }

  @Test
  void listShowsCropsVarietiesStagesAndFiles() {
    Cli.Result r = Cli.run("profile", "list", "--crop-profiles", folder);
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).startsWith("Crop profiles in " + folder + "\n");
    // The varieties in the trade's words: WSU table footnote via Penn State Extension, Golden
    // Delicious and Winesap about 1 °F hardier than Red Delicious, Rome Beauty 2 °F.
    assertThat(r.out()).containsPattern("\napple\\s+9  apple\\.yaml\\s+red-delicious \\(as the"
        + " table\\), golden-delicious \\(0\\.56 °C hardier\\), winesap \\(0\\.56 °C hardier\\),"
        + " rome-beauty \\(1\\.11 °C hardier\\)\n");
    assertThat(r.out()).containsPattern("\npeach\\s+7  peach\\.yaml\\s+-\n");
    assertThat(r.out().lines().count()).isEqualTo(13);
    // Columns line up: the FILE column starts at the same place on every row.
    List<Integer> at = r.out().lines().skip(1).map(l -> l.indexOf(".yaml") < 0 ? l.indexOf("FILE")
        : l.indexOf(l.split("\\s+")[2])).distinct().toList();
    assertThat(at).hasSize(1);
  }

  @Test
  void showPrintsTheEffectiveTableInTheChosenUnitsWithSources() {
    Cli.Result r = Cli.run("--units", "us", "profile", "show", "apple/rome-beauty", "--crop-profiles", folder);
    assertThat(r.exitCode()).as(r.toString()).isZero();
    // WSU EB0913 full bloom 28/25 °F, Rome Beauty 2 °F hardier: 26/23 °F; post bloom unchanged.
    // The variety keeps its crop's flowering flag: open flowers at full bloom, none after petal fall.
    assertThat(r.out()).containsPattern("full-bloom\\s+65\\s+yes\\s+26\\.0 °F\\s+23\\.0 °F\\s+offset");
    assertThat(r.out()).containsPattern("post-bloom\\s+69\\s+no\\s+28\\.0 °F\\s+25\\.0 °F\\s+base");
    assertThat(r.out()).contains("Rome Beauty 2 °F hardier, except after petal fall");
    Cli.Result metric = Cli.run("profile", "show", "apple", "--crop-profiles", folder);
    assertThat(metric.out()).containsPattern("full-bloom\\s+65\\s+yes\\s+-2\\.2 °C\\s+-3\\.9 °C\\s+base");
    Cli.Result after = Cli.run("profile", "show", "apple", "--units", "us", "--crop-profiles", folder);
    assertThat(after.out()).containsPattern("silver-tip\\s+51\\s+no\\s+15\\.0 °F\\s+2\\.0 °F");
  }

  @Test
  void showJsonIsMetricWithTheDocumentedKeys() throws IOException {
    Cli.Result r = Cli.run("--units", "us", "profile", "show", "apple/golden-delicious", "--json",
        "--crop-profiles", folder);
    assertThat(r.exitCode()).as(r.toString()).isZero();
    JsonNode j = new ObjectMapper().readTree(r.out());
    assertThat(j.get("crop").asText()).isEqualTo("apple");
    assertThat(j.get("variety").asText()).isEqualTo("golden-delicious");
    JsonNode first = j.get("stages").get(0);
    List<String> keys = new ArrayList<>();
    first.fieldNames().forEachRemaining(keys::add);
    assertThat(keys).contains("id", "name", "bbch", "flowering", "t10_c", "t90_c", "source");
    assertThat(first.get("flowering").asBoolean(true)).isFalse();
    assertThat(first.get("id").asText()).isEqualTo("silver-tip");
    assertThat(first.get("bbch").asText()).isEqualTo("51");
    // 15 °F − 1 °F = 14 °F = −10.0 °C (WSU EB0913 and its Golden Delicious footnote).
    assertThat(first.get("t10_c").asDouble()).isCloseTo(-10.0, within(1e-9));
    assertThat(first.get("t90_c").asDouble()).isCloseTo((1 - 32) / 1.8, within(1e-9));
    assertThat(j.get("stages")).hasSize(9);
    Cli.Result base = Cli.run("profile", "show", "pear", "--json", "--crop-profiles", folder);
    assertThat(new ObjectMapper().readTree(base.out()).get("variety").isNull()).isTrue();
  }

  @Test
  void showOfAnUnknownCropIsBadInput() {
    Cli.Result r = Cli.run("profile", "show", "banana", "--crop-profiles", folder);
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("unknown crop 'banana'; known crops: apple, apricot");
    Cli.Result v = Cli.run("profile", "show", "apple/", "--crop-profiles", folder);
    assertThat(v.exitCode()).isEqualTo(Main.BAD_INPUT);
  }

  @Test
  void checkPassesOnTheShippedFilesAndFailsWithEveryProblem() throws IOException {
    Cli.Result ok = Cli.run("profile", "check", "--crop-profiles", folder);
    assertThat(ok.exitCode()).as(ok.toString()).isZero();
    assertThat(ok.out()).startsWith("OK: 11 crop files, 87 stages, 11 varieties in " + folder);
    Path pear = dir.resolve("pear.yaml");
    Files.writeString(pear, Files.readString(pear).replace("t10: 26F", "t10: 26").replace("t90: 23F", "t90: 28F"));
    Cli.Result bad = Cli.run("profile", "check", "--crop-profiles", folder);
    assertThat(bad.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(bad.err()).contains("have 2 problems").contains("pear.yaml:62: stages[full-white].t10:"
        + " '26' has no unit").contains("pear.yaml:70: stages[first-bloom].t90: '28F' is not colder");
  }

  @Test
  void checkNamesEachStageWithoutAFloweringFlagAndHowItWasRead() throws IOException {
    Path apple = dir.resolve("apple.yaml");
    String text = Files.readString(apple);
    // Full bloom (BBCH 65) and post bloom (BBCH 69) lose their flags: the BBCH fallback reads the
    // first as flowering, the second (end of flowering, Meier 2001) as not.
    Files.writeString(apple, text.replace("    bbch: \"65\"\n    flowering: true\n", "    bbch: \"65\"\n")
        .replace("    bbch: \"69\"\n    flowering: false\n", "    bbch: \"69\"\n"));
    Cli.Result r = Cli.run("profile", "check", "--crop-profiles", folder);
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).contains("2 stages have no flowering flag:")
        .contains(apple + ":81: stages[full-bloom]: has no flowering flag, so it is read from bbch 65"
            + " as flowering (60 to 65 flower); write flowering: true")
        .contains(apple + ":87: stages[post-bloom]: has no flowering flag, so it is read from bbch 69"
            + " as not flowering");
    assertThat(Cli.run("profile", "check", "--crop-profiles", Path.of("crop-profiles").toString()).out())
        .doesNotContain("flowering flag");
  }

  @Test
  void checkOfAMissingFolderIsBadInput() {
    Cli.Result r = Cli.run("profile", "check", "--crop-profiles", dir.resolve("nope").toString());
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("no such crop-profiles folder");
  }

  @Test
  void newVarietyThenSetPrintBeforeAndAfter() throws IOException {
    Cli.Result nv = Cli.run("profile", "new-variety", "apple/honeycrisp", "--from", "apple/winesap",
        "--note", "copied for block 9", "--by", "tester", "--crop-profiles", folder,
        "--audit", dir.resolve("audit.db").toString());
    assertThat(nv.exitCode()).as(nv.toString()).isZero();
    assertThat(nv.out()).contains("Added variety apple/honeycrisp").contains("hardiness offset 0.56 °C, 1.0 °F")
        .contains("recorded in " + dir.resolve("audit.db") + ": ");
    Cli.Result set = Cli.run("--units", "us", "profile", "set", "apple/honeycrisp", "--stage", "full-bloom",
        "--t10", "26", "--t90", "22F", "--note", "bud cuts 2024-04-12", "--by", "tester",
        "--crop-profiles", folder, "--audit", dir.resolve("audit.db").toString());
    assertThat(set.exitCode()).as(set.toString()).isZero();
    assertThat(set.out()).contains("apple/honeycrisp full-bloom t10: before 27.0 °F, after 26.0 °F")
        .contains("apple/honeycrisp full-bloom t90: before 24.0 °F, after 22.0 °F");
    assertThat(Files.readString(dir.resolve("apple.yaml"))).contains("t10: 26F\n").contains("t90: 22F\n");
    Cli.Result show = Cli.run("profile", "show", "apple/honeycrisp", "--json", "--crop-profiles", folder);
    JsonNode bloom = new ObjectMapper().readTree(show.out()).get("stages").get(7);
    assertThat(bloom.get("id").asText()).isEqualTo("full-bloom");
    assertThat(bloom.get("t10_c").asDouble()).isCloseTo((26 - 32) / 1.8, within(1e-9));
    assertThat(bloom.get("source").asText()).contains("bud cuts 2024-04-12").contains("set by tester");
  }

  @Test
  void editErrorsAreBadInput() throws IOException {
    String before = Files.readString(dir.resolve("apple.yaml"));
    Cli.Result noNote = Cli.run("profile", "set", "apple/winesap", "--stage", "full-bloom", "--t10", "-3",
        "--crop-profiles", folder);
    assertThat(noNote.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(noNote.err()).contains("--note");
    Cli.Result warm = Cli.run("profile", "set", "apple/winesap", "--stage", "full-bloom", "--t90", "0",
        "--note", "n", "--crop-profiles", folder, "--no-audit");
    assertThat(warm.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(warm.err()).contains("the change was not written").contains("is not colder than t10");
    Cli.Result otherCrop = Cli.run("profile", "new-variety", "apple/x", "--from", "pear/bartlett",
        "--note", "n", "--crop-profiles", folder);
    assertThat(otherCrop.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(otherCrop.err()).contains("must be a variety of the same crop");
    Cli.Result noVariety = Cli.run("profile", "new-variety", "apple", "--note", "n", "--crop-profiles", folder);
    assertThat(noVariety.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(Files.readString(dir.resolve("apple.yaml"))).isEqualTo(before);
  }

  @Test
  void profileWithoutASubcommandIsBadInput() {
    Cli.Result r = Cli.run("profile");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("list, show, check, new-variety or set");
  }
}
