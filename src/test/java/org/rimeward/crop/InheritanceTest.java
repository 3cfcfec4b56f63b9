package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

class InheritanceTest {
  private static final double EPS = 1e-9;
  private static final double ONE_F = 1 / 1.8;

  final CropLibrary lib = CropLibrary.load(Path.of("crop-profiles"));

  /** WSU table footnote (via Penn State Extension): Golden Delicious about 1 °F hardier. */
  @Test
  void goldenDeliciousIsOneFahrenheitHardierAtEveryStage() {
    EffectiveProfile base = lib.effective("apple", null);
    EffectiveProfile gd = lib.effective("apple", "golden-delicious");
    assertThat(gd.stages()).hasSameSizeAs(base.stages());
    for (EffectiveStage b : base.stages()) {
      EffectiveStage s = gd.stage(b.id()).orElseThrow();
      assertThat(s.t10C()).as(b.id()).isCloseTo(b.t10C() - ONE_F, within(EPS));
      assertThat(s.t90C()).as(b.id()).isCloseTo(b.t90C() - ONE_F, within(EPS));
      assertThat(s.provenance()).isEqualTo(Provenance.OFFSET);
      assertThat(s.source()).contains("EB0913").contains("golden-delicious hardiness offset")
          .contains("1 °F hardier");
    }
    // Silver tip: 15 °F − 1 °F = 14 °F, 2 °F − 1 °F = 1 °F.
    assertThat(gd.stage("silver-tip").orElseThrow().t10C()).isCloseTo((14 - 32) / 1.8, within(EPS));
    assertThat(gd.stage("silver-tip").orElseThrow().t90C()).isCloseTo((1 - 32) / 1.8, within(EPS));
    assertThat(lib.effective("apple", "winesap").stages()).isEqualTo(
        gd.stages().stream().map(s -> new EffectiveStage(s.id(), s.name(), s.bbch(), s.flowering(), s.t10C(),
            s.t90C(), s.source().replace("golden-delicious", "winesap"), s.provenance())).toList());
  }

  /** Same footnote: Rome Beauty 2 °F hardier, except after petal fall. */
  @Test
  void romeBeautyIsTwoFahrenheitHardierExceptAfterPetalFall() {
    EffectiveProfile base = lib.effective("apple", null);
    EffectiveProfile rb = lib.effective("apple", "rome-beauty");
    for (EffectiveStage b : base.stages()) {
      EffectiveStage s = rb.stage(b.id()).orElseThrow();
      double shift = b.id().equals("post-bloom") ? 0 : 2 * ONE_F;
      assertThat(s.t10C()).as(b.id()).isCloseTo(b.t10C() - shift, within(EPS));
      assertThat(s.t90C()).as(b.id()).isCloseTo(b.t90C() - shift, within(EPS));
      assertThat(s.provenance()).isEqualTo(shift == 0 ? Provenance.BASE : Provenance.OFFSET);
    }
    // Full bloom: 28/25 °F becomes 26/23 °F.
    assertThat(rb.stage("full-bloom").orElseThrow().t10C()).isCloseTo((26 - 32) / 1.8, within(EPS));
    assertThat(rb.stage("post-bloom").orElseThrow().t10C()).isCloseTo((28 - 32) / 1.8, within(EPS));
  }

  @Test
  void referenceVarietyIsTheBaseTable() {
    EffectiveProfile base = lib.effective("apple", null);
    EffectiveProfile red = lib.effective("apple", "red-delicious");
    assertThat(red.variety()).isEqualTo("red-delicious");
    assertThat(red.stages()).isEqualTo(base.stages());
    assertThat(lib.effective("apple/red-delicious").stages()).isEqualTo(base.stages());
  }

  @Test
  void overrideReplacesOnlyTheValuesItGivesAndOffsetStillShiftsTheRest(@TempDir Path dir)
      throws IOException {
    Files.writeString(dir.resolve("apple.yaml"), ValidationTest.CROP + """
        varieties:
          - id: gala
            hardiness_offset: 1C
            note: "example for a test"
            overrides:
              - stage: full-bloom
                t10: -3.0C
                note: "bud cuts 2024-04-12, block 4"
        """);
    EffectiveProfile p = CropLibrary.load(dir).effective("apple", "gala");
    EffectiveStage pink = p.stage("first-pink").orElseThrow();
    assertThat(pink.t10C()).isCloseTo((28 - 32) / 1.8 - 1, within(EPS));
    assertThat(pink.provenance()).isEqualTo(Provenance.OFFSET);
    EffectiveStage bloom = p.stage("full-bloom").orElseThrow();
    assertThat(bloom.t10C()).isCloseTo(-3.0, within(EPS));
    assertThat(bloom.t90C()).isCloseTo((25 - 32) / 1.8 - 1, within(EPS));
    assertThat(bloom.provenance()).isEqualTo(Provenance.OVERRIDE);
    assertThat(bloom.source()).startsWith("t10: override for gala (note: bud cuts 2024-04-12, block 4)")
        .contains("| t90: test table; shifted 1.00 °C (1.8 °F) colder by the gala hardiness offset");
  }

  @Test
  void unknownCropOrVarietyNamesTheKnownOnes() {
    assertThatThrownBy(() -> lib.effective("banana", null)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("unknown crop 'banana'").hasMessageContaining("apple, apricot, cranberry");
    assertThatThrownBy(() -> lib.effective("apple", "honeycrisp")).isInstanceOf(BadInputException.class)
        .hasMessageContaining("unknown variety 'honeycrisp' of crop 'apple'")
        .hasMessageContaining("red-delicious, golden-delicious, winesap, rome-beauty");
    assertThatThrownBy(() -> lib.effective("peach", "redhaven"))
        .hasMessageContaining("unknown variety 'redhaven' of crop 'peach'").hasMessageContaining("(none");
  }
}
