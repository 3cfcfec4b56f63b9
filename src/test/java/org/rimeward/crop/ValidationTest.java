package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

/** Each validation failure, with the file, line, field, value and what to do. */
class ValidationTest {
  /** A small apple table for tests (values from the WSU EB0913 rows, three stages). */
  static final String CROP = """
      # test file
      crop: apple
      name: Apple
      exposure: 30 min
      basis: test basis, 30 minutes
      stages:
        - id: first-pink
          name: First pink
          bbch: "57"
          t10: 28F
          t90: 24F
          source: test table
        - id: full-bloom
          name: Full bloom
          bbch: "65"
          t10: 28F
          t90: 25F
          source: test table
        - id: post-bloom
          name: Post bloom
          bbch: "69"
          t10: 28F
          t90: 25F
          source: test table
      """;

  @TempDir Path dir;

  private String problem(String text) throws IOException {
    return problem("apple.yaml", text);
  }

  private String problem(String name, String text) throws IOException {
    Files.writeString(dir.resolve(name), text);
    try {
      CropLibrary.load(dir);
    } catch (BadInputException e) {
      return e.getMessage();
    }
    throw new AssertionError("no problem reported for:\n" + text);
  }

  @Test
  void theTestFileItselfIsValid() throws IOException {
    Files.writeString(dir.resolve("apple.yaml"), CROP);
    assertThat(CropLibrary.load(dir).crops()).hasSize(1);
  }

  @Test
  void unknownKey() throws IOException {
    String m = problem(CROP.replace("    t90: 25F\n    source: test table\n  - id: post-bloom",
        "    t90: 25F\n    sorce: x\n    source: test table\n  - id: post-bloom"));
    assertThat(m).contains("apple.yaml:18: stages[full-bloom].sorce: unknown key; allowed here: id,"
        + " name, bbch, flowering").contains("(check the spelling)");
  }

  @Test
  void unknownTopLevelKey() throws IOException {
    assertThat(problem(CROP.replace("name: Apple\n", "name: Apple\nexposure_min: 30\n")))
        .contains("apple.yaml:4: exposure_min: unknown key; allowed here: crop, name");
  }

  @Test
  void missingUnit() throws IOException {
    String m = problem(CROP.replaceFirst("t10: 28F", "t10: 28"));
    assertThat(m).contains("apple.yaml:10: stages[first-pink].t10: '28' has no unit")
        .contains("-2.2C or 28F, with the unit the source prints");
  }

  @Test
  void unknownUnit() throws IOException {
    assertThat(problem(CROP.replaceFirst("t10: 28F", "t10: 28X")))
        .contains("apple.yaml:10: stages[first-pink].t10: unit 'X' in '28X' is not known");
  }

  @Test
  void stagesOutOfOrder() throws IOException {
    String m = problem(CROP.replace("bbch: \"65\"", "bbch: \"55\""));
    assertThat(m).contains("apple.yaml:15: stages[full-bloom].bbch: '55' is not after the previous"
        + " stage 'first-pink' (bbch 57)").contains("in order of development");
  }

  @Test
  void duplicatedStageId() throws IOException {
    String m = problem(CROP.replace("id: post-bloom", "id: full-bloom").replace("bbch: \"69\"", "bbch: \"69\""));
    assertThat(m).contains("apple.yaml:19: stages[full-bloom].id: 'full-bloom' is used twice (first"
        + " on line 13)");
  }

  @Test
  void t90NotColderThanT10() throws IOException {
    String m = problem(CROP.replaceFirst("t90: 24F", "t90: 29F"));
    assertThat(m).contains("apple.yaml:11: stages[first-pink].t90: '29F' is not colder than t10 '28F'")
        .contains("Check both against the source table");
    assertThat(problem(CROP.replaceFirst("t90: 24F", "t90: 28F"))).contains("is not colder than");
  }

  @Test
  void temperatureOutOfRange() throws IOException {
    // -28 written where -2.8C was meant: -28F is -33 °C.
    String m = problem(CROP.replaceFirst("t90: 24F", "t90: -28F"));
    assertThat(m).contains("apple.yaml:11: stages[first-pink].t90: '-28F' (-33.3 °C) is outside the"
        + " plausible -30.0 to +5.0 °C").contains("check the number and its unit");
    assertThat(problem(CROP.replaceFirst("t10: 28F", "t10: 42F"))).contains("'42F' (5.6 °C) is outside");
  }

  @Test
  void missingValueAndBadBbchAndBadId() throws IOException {
    assertThat(problem(CROP.replaceFirst("    t90: 24F\n", ""))).contains("apple.yaml:7:"
        + " stages[first-pink]: 't90' is required; add the 90% kill temperature");
    assertThat(problem(CROP.replace("\"57\"", "57a"))).contains("apple.yaml:9:"
        + " stages[first-pink].bbch: '57a' is not a two-digit BBCH code");
    assertThat(problem(CROP.replace("id: first-pink", "id: First Pink")))
        .contains("apple.yaml:7: stages item 1.id: 'First Pink' is not a kebab-case id");
  }

  @Test
  void cropIdMustMatchTheFileName() throws IOException {
    assertThat(problem("pear.yaml", CROP)).contains("pear.yaml:2: crop: 'apple' does not match the"
        + " file name 'pear.yaml'");
  }

  @Test
  void ymlFilesAreNamed() throws IOException {
    Files.writeString(dir.resolve("apple.yaml"), CROP);
    assertThat(problem("pear.yml", "crop: pear\n")).contains("pear.yml: crop files end in .yaml;"
        + " rename it to pear.yaml");
  }

  @Test
  void invalidYamlNamesTheLine() throws IOException {
    assertThat(problem(CROP.replace("  - id: full-bloom", "  - id: [full-bloom")))
        .contains("apple.yaml:").contains("not valid YAML");
  }

  @Test
  void duplicateKeyNamesBothLines() throws IOException {
    assertThat(problem(CROP.replace("name: Apple\n", "name: Apple\nname: Apple 2\n")))
        .contains("apple.yaml:4: 'name' is given twice in the same mapping (first on line 3)");
  }

  @Test
  void varietyOfAnUnknownCrop(@TempDir Path other) throws IOException {
    Files.writeString(dir.resolve("apple.yaml"), CROP);
    CropLibrary lib = CropLibrary.load(dir);
    assertThatThrownBy(() -> lib.effective("banana/cavendish"))
        .hasMessage("unknown crop 'banana'; known crops: apple");
    assertThatThrownBy(() -> new ProfileEditor(dir, java.time.Clock.systemUTC())
        .newVariety("banana", "cavendish", null, null, null, null, "a note", "tester"))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("unknown crop 'banana'").hasMessageContaining("known crops: apple");
  }

  @Test
  void overrideOfAnUnknownStage() throws IOException {
    String m = problem(CROP + """
        varieties:
          - id: gala
            note: "test"
            overrides:
              - stage: ful-bloom
                t10: -3C
                note: "x"
        """);
    assertThat(m).contains("apple.yaml:29: varieties[gala].overrides[ful-bloom].stage: 'ful-bloom' is"
        + " not a stage of this crop; known stages: first-pink, full-bloom, post-bloom");
  }

  @Test
  void varietyAndOverrideNeedASourceOrNote() throws IOException {
    assertThat(problem(CROP + "varieties:\n  - id: gala\n    hardiness_offset: 1F\n"))
        .contains("apple.yaml:26: varieties[gala]: needs a 'source'");
    assertThat(problem(CROP + "varieties:\n  - id: gala\n    note: n\n    overrides:\n"
        + "      - stage: full-bloom\n        t10: -3C\n"))
        .contains("apple.yaml:29: varieties[gala].overrides[full-bloom]: needs a 'source' or a 'note'");
  }

  @Test
  void offsetLargerThanTheLimit() throws IOException {
    String m = problem(CROP + "varieties:\n  - id: gala\n    hardiness_offset: 6F\n    note: n\n");
    assertThat(m).contains("apple.yaml:27: varieties[gala].hardiness_offset: '6F' is more than 3.0 °C");
  }

  @Test
  void offsetThatPushesAStageOutOfRange() throws IOException {
    String cold = CROP.replaceFirst("t90: 24F", "t90: -20F"); // -28.9 °C
    String m = problem(cold + "varieties:\n  - id: hardy\n    hardiness_offset: 2C\n    note: n\n");
    assertThat(m).contains("apple.yaml:26: apple/hardy stage 'first-pink': t90 comes to -30.9 °C"
        + " (-23.6 °F), outside the plausible");
  }

  @Test
  void overrideThatMakesT90WarmerThanT10() throws IOException {
    String m = problem(CROP + "varieties:\n  - id: gala\n    note: n\n    overrides:\n"
        + "      - stage: full-bloom\n        t90: -1C\n        note: x\n");
    assertThat(m).contains("apple.yaml:29: apple/gala stage 'full-bloom': t90 -1.0 °C (30.2 °F) is"
        + " not colder than t10 -2.2 °C (28.0 °F)");
  }

  @Test
  void offsetExceptNamesAKnownStage() throws IOException {
    assertThat(problem(CROP + "varieties:\n  - id: rome\n    hardiness_offset: 2F\n"
        + "    offset_except: [petal-fall]\n    note: n\n"))
        .contains("apple.yaml:28: varieties[rome].offset_except: 'petal-fall' is not a stage");
  }

  @Test
  void toleranceStagesNeedTheMarginAndTheNote() throws IOException {
    String tol = """
        crop: apple
        name: Apple
        exposure: 30 min
        basis: b
        stages:
          - id: full-bloom
            name: Full bloom
            bbch: "65"
            tolerance: 28F
            source: s
            note: single stage tolerance
        """;
    assertThat(problem(tol)).contains("apple.yaml:9: stages[full-bloom].tolerance: uses a single"
        + " 'tolerance', so the file needs 'tolerance_t90_margin'");
    assertThat(problem(tol.replace("note: single stage tolerance", "note: x")
        .replace("basis: b", "basis: b\ntolerance_t90_margin: 3F")))
        .contains("needs a note saying it is a single stage tolerance");
    assertThat(problem(tol.replace("tolerance: 28F", "tolerance: 28F\n    t10: 28F")
        .replace("basis: b", "basis: b\ntolerance_t90_margin: 3F")))
        .contains("give either a single 'tolerance' or 't10' and 't90', not both");
  }

  @Test
  void everyProblemIsListedNotJustTheFirst() throws IOException {
    String m = problem(CROP.replaceFirst("t10: 28F", "t10: 28").replace("bbch: \"69\"", "bbch: \"60\""));
    assertThat(m.split("\\R")).hasSize(2);
  }
}
