package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rimeward.io.BadInputException;

/** A stage's {@code flowering} flag: read as written, else from its BBCH code, kept by varieties. */
class FloweringFlagTest {
  @TempDir Path dir;

  /** Three stages of the small test table; {@code FLAG59}/{@code FLAG65}/{@code FLAG69} are replaced. */
  static final String CROP = """
      crop: apple
      name: Apple
      exposure: 30 min
      basis: test basis, 30 minutes
      stages:
        - id: full-pink
          name: Full pink (popcorn to bloom)
          bbch: "59"
          FLAG59
          t10: 28F
          t90: 25F
          source: test table
        - id: full-bloom
          name: Full bloom
          bbch: "65"
          FLAG65
          t10: 28F
          t90: 25F
          source: test table
        - id: post-bloom
          name: Post bloom (petal fall)
          bbch: "69"
          FLAG69
          t10: 28F
          t90: 25F
          source: test table
      varieties:
        - id: hardy
          hardiness_offset: 1F
          offset_except: [post-bloom]
          note: "test variety"
      """;

  private CropLibrary load(String flag59, String flag65, String flag69) throws IOException {
    Files.writeString(dir.resolve("apple.yaml"), CROP.replace("FLAG59", flag59)
        .replace("FLAG65", flag65).replace("FLAG69", flag69));
    return CropLibrary.load(dir);
  }

  private static List<Boolean> flowering(EffectiveProfile p) {
    List<Boolean> out = new ArrayList<>();
    p.stages().forEach(s -> out.add(s.flowering()));
    return out;
  }

  @Test
  void theFlagIsReadAsWrittenAndWinsOverTheBbchCode() throws IOException {
    // A popcorn-to-bloom stage the grower sees open (BBCH 59 alone says closed), and a full bloom
    // flagged false: the flag is what counts.
    CropLibrary lib = load("flowering: true", "flowering: false", "flowering: false");
    assertThat(flowering(lib.effective("apple", null))).containsExactly(true, false, false);
    assertThat(lib.crop("apple").orElseThrow().stages()).extracting(Stage::floweringFlag)
        .containsExactly(true, false, false);
    assertThat(lib.notes()).isEmpty();
  }

  @Test
  void aVarietyKeepsItsCropsFlag() throws IOException {
    CropLibrary lib = load("flowering: false", "flowering: true", "flowering: false");
    EffectiveProfile hardy = lib.effective("apple", "hardy");
    assertThat(hardy.stage("full-bloom").orElseThrow().provenance()).isEqualTo(Provenance.OFFSET);
    assertThat(flowering(hardy)).containsExactly(false, true, false);
  }

  /**
   * Without a flag the BBCH code decides: 60 (first flowers open) to 65 (full flowering) flower,
   * 67 (flowers fading) and 69 (end of flowering) do not. BBCH monograph, Meier 2001, principal
   * stage 6 of the fruit crops; the codes are recalled from the monograph, not re-read.
   */
  @ParameterizedTest
  @CsvSource({"57, false", "59, false", "60, true", "61, true", "63, true", "65, true",
      "67, false", "69, false", "71, false"})
  void withoutAFlagTheBbchCodeDecides(int bbch, boolean flowering) {
    assertThat(Stage.floweringByBbch(bbch)).as("BBCH %d", bbch).isEqualTo(flowering);
  }

  @Test
  void aFileWithoutFlagsFallsBackToBbchAndTheCheckSaysSo() throws IOException {
    CropLibrary lib = load("", "", "");
    assertThat(flowering(lib.effective("apple", null))).containsExactly(false, true, false);
    assertThat(flowering(lib.effective("apple", "hardy"))).containsExactly(false, true, false);
    assertThat(lib.notes()).hasSize(3);
    assertThat(lib.notes().get(1)).isEqualTo(dir.resolve("apple.yaml") + ":13: stages[full-bloom]:"
        + " has no flowering flag, so it is read from bbch 65 as flowering (60 to 65 flower); write"
        + " flowering: true where the stage's flowers are open (first bloom to full bloom), false"
        + " before (buds) and after (petal fall, fruit set)");
    assertThat(lib.notes().get(2)).contains(":20: stages[post-bloom]:")
        .contains("read from bbch 69 as not flowering");
  }

  @Test
  void aBadValueNamesFileLineFieldValueAndWhatToWrite() {
    assertThatThrownBy(() -> load("flowering: false", "flowering: maybe", "flowering: false"))
        .isInstanceOf(BadInputException.class)
        .hasMessage(dir.resolve("apple.yaml") + ":16: stages[full-bloom].flowering: 'maybe' is not"
            + " true or false; write flowering: true where the stage's flowers are open (first"
            + " bloom to full bloom), false before (buds) and after (petal fall, fruit set)");
    // YAML 1.1's yes/no are not taken for true/false: a reader of YAML 1.2 would see text.
    assertThatThrownBy(() -> load("flowering: yes", "flowering: true", "flowering: false"))
        .hasMessageContaining("apple.yaml:9: stages[full-pink].flowering: 'yes' is not true or false");
    assertThatThrownBy(() -> load("flowering:", "flowering: true", "flowering: false"))
        .hasMessageContaining("apple.yaml:9: stages[full-pink].flowering: expected a value");
  }

  /** Every stage of every bundled profile carries its flag; these are the ones with open flowers. */
  @Test
  void everyBundledStageHasAFlag() {
    CropLibrary lib = CropLibrary.load(Path.of("crop-profiles"));
    assertThat(lib.notes()).isEmpty();
    List<String> open = new ArrayList<>();
    for (Crop c : lib.crops()) {
      c.stages().stream().filter(Stage::flowering).forEach(s -> open.add(c.id() + "/" + s.id()));
    }
    assertThat(open).containsExactly("apple/first-bloom", "apple/full-bloom", "apricot/first-bloom",
        "apricot/full-bloom", "cranberry/hook-and-bloom", "european-plum/first-bloom",
        "european-plum/full-bloom", "highbush-blueberry/full-bloom", "peach/first-bloom",
        "peach/full-bloom", "pear/first-bloom", "pear/full-bloom", "strawberry/open-blossom",
        "sweet-cherry/first-bloom", "sweet-cherry/full-bloom", "tart-cherry/first-bloom",
        "tart-cherry/full-bloom");
  }
}
