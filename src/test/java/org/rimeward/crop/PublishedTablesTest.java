package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every shipped stage value against the published table, transcribed here as the source prints it
 * (°F for the WSU/MSU tables, °C for FAO). The expectations are typed in independently of the
 * crop files, so a wrong digit in a file fails here.
 */
class PublishedTablesTest {
  private static final double EPS = 1e-9;
  /** The T10−T90 gap Rimeward uses for one-tolerance stages (documented in the crop files). */
  private static final double MARGIN_F = 3;

  static CropLibrary lib;

  @BeforeAll
  static void load() {
    lib = CropLibrary.load(Path.of("crop-profiles"));
  }

  record Row(String stage, double t10, double t90) {}

  static Row f(String stage, double t10F, double t90F) {
    return new Row(stage, c(t10F), c(t90F));
  }

  static Row celsius(String stage, double t10C, double t90C) {
    return new Row(stage, t10C, t90C);
  }

  /** A single published tolerance in °F: T10 = tolerance, T90 = tolerance − 3 °F. */
  static Row tol(String stage, double toleranceF) {
    return new Row(stage, c(toleranceF), c(toleranceF - MARGIN_F));
  }

  static double c(double fahrenheit) {
    return (fahrenheit - 32) / 1.8;
  }

  static Stream<Arguments> tables() {
    return Stream.of(
        // WSU EB0913, Red Delicious (Penn State Extension table; MSU picture table), °F.
        Arguments.of("apple", List.of(
            f("silver-tip", 15, 2), f("green-tip", 18, 10), f("half-inch-green", 23, 15),
            f("tight-cluster", 27, 21), f("first-pink", 28, 24), f("full-pink", 28, 25),
            f("first-bloom", 28, 25), f("full-bloom", 28, 25), f("post-bloom", 28, 25))),
        // WSU EB0978, Bartlett, °F.
        Arguments.of("pear", List.of(
            f("scales-separating", 15, 0), f("blossom-buds-exposed", 20, 6),
            f("tight-cluster", 24, 15), f("first-white", 25, 19), f("full-white", 26, 22),
            f("first-bloom", 27, 23), f("full-bloom", 28, 24), f("post-bloom", 28, 24))),
        // WSU EB1128, °F.
        Arguments.of("sweet-cherry", List.of(
            f("first-swelling", 17, 5), f("side-green", 22, 9), f("green-tip", 25, 14),
            f("tight-cluster", 26, 17), f("open-cluster", 27, 21), f("first-white", 27, 24),
            f("first-bloom", 28, 25), f("full-bloom", 28, 25), f("post-bloom", 28, 25))),
        // MSU Research Report 220, Montmorency, °F; petal fall as printed by Utah State Extension.
        // Full bloom T90: MSU 24 °F is kept (Utah State prints 25 °F).
        Arguments.of("tart-cherry", List.of(
            f("bud-swell", 15, 0), f("side-green", 24, 10), f("green-tip", 26, 22),
            f("tight-cluster", 26, 24), f("open-cluster", 28, 24), f("first-white", 28, 24),
            f("first-bloom", 28, 24), f("full-bloom", 28, 24), f("petal-fall", 28, 25))),
        // WSU EB0914, °F.
        Arguments.of("peach", List.of(
            f("first-swelling", 18, 1), f("calyx-green", 21, 5), f("calyx-red", 23, 9),
            f("first-pink", 25, 15), f("first-bloom", 26, 21), f("full-bloom", 27, 24),
            f("post-bloom", 28, 25))),
        // WSU EB1240 (MSU Extension table), °F. First swelling has no published T90: left out.
        Arguments.of("apricot", List.of(
            f("tip-separates", 20, 0), f("red-calyx", 22, 9), f("first-white", 24, 14),
            f("first-bloom", 25, 19), f("full-bloom", 27, 22), f("in-the-shuck", 27, 24),
            f("green-fruit", 28, 25))),
        // MSU Extension table, European plum, °F.
        Arguments.of("european-plum", List.of(
            f("first-swelling", 14, 0), f("side-white", 17, 3), f("tip-green", 20, 7),
            f("tight-cluster", 24, 16), f("first-white", 26, 22), f("first-bloom", 27, 23),
            f("full-bloom", 28, 23), f("post-bloom", 28, 23))),
        // FAO 2005 (Snyder & de Melo-Abreu) Table 4.8 after Proebsting, Concord, printed in °C.
        Arguments.of("grapevine", List.of(
            celsius("first-swell", -10.6, -19.4), celsius("late-swell", -6.1, -12.2),
            celsius("bud-burst", -3.9, -8.9), celsius("first-leaf", -2.8, -6.1),
            celsius("second-leaf", -2.2, -5.6), celsius("third-leaf", -2.2, -3.3),
            celsius("fourth-leaf", -2.2, -2.8))),
        // MSU Extension Blueberries, "Critical Spring Temperatures", °F; ranges printed 10-15,
        // 20-23, 23-25, 24-27 use their warmer end.
        Arguments.of("highbush-blueberry", List.of(
            tol("bud-swell", 15), tol("tight-cluster", 23), tol("early-pink-bud", 25),
            tol("late-pink-bud", 27), tol("full-bloom", 28), tol("petal-fall", 32))),
        // Perry & Poling 1985 (NC State), Penn State (Demchak) Table 1, °F.
        Arguments.of("strawberry", List.of(
            tol("bud-emergence", 10), tol("tight-bud", 22), tol("popcorn", 26),
            tol("open-blossom", 30), tol("green-fruit", 28))),
        // UMass Cranberry Station (DeMoranville 1997, rev. 2019): spring column Early Black &
        // Howes (29.5-30 uses 30), fall fruit table with Early Black's maroon value, °F.
        Arguments.of("cranberry", List.of(
            tol("spring-dormant", 18), tol("white-bud", 20), tol("bud-swell", 22),
            tol("bud-break", 25), tol("bud-elongation", 27), tol("roughneck-to-hook", 30),
            tol("hook-and-bloom", 30), tol("deep-blush-exposed", 27), tol("deep-blush", 26),
            tol("red", 25), tol("deep-red", 23), tol("maroon", 23))));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("tables")
  void baseTableMatchesThePublishedTable(String crop, List<Row> expected) {
    EffectiveProfile p = lib.effective(crop, null);
    assertThat(p.stages()).extracting(EffectiveStage::id)
        .containsExactlyElementsOf(expected.stream().map(Row::stage).toList());
    for (Row r : expected) {
      EffectiveStage s = p.stage(r.stage()).orElseThrow();
      assertThat(s.t10C()).as(crop + " " + r.stage() + " t10").isCloseTo(r.t10(), within(EPS));
      assertThat(s.t90C()).as(crop + " " + r.stage() + " t90").isCloseTo(r.t90(), within(EPS));
      assertThat(s.provenance()).isEqualTo(Provenance.BASE);
    }
  }

  @Test
  void everyCropFileIsCheckedHere() {
    assertThat(lib.crops()).extracting(Crop::id).containsExactlyInAnyOrderElementsOf(
        tables().map(a -> (String) a.get()[0]).toList());
  }

  @Test
  void everyFileStatesTheThirtyMinuteExposureAndCitesEveryStage() {
    for (Crop c : lib.crops()) {
      assertThat(c.exposure()).as(c.id()).isEqualTo("30 min");
      assertThat(c.basis()).as(c.id()).contains("30 minutes");
      c.stages().forEach(s -> assertThat(s.source()).as(c.id() + " " + s.id()).isNotBlank());
    }
  }

  @Test
  void stagesNameThePrimaryBulletin() {
    assertThat(lib.crop("apple").orElseThrow().stages()).allMatch(s -> s.source().contains("EB0913"));
    assertThat(lib.crop("pear").orElseThrow().stages()).allMatch(s -> s.source().contains("EB0978"));
    assertThat(lib.crop("sweet-cherry").orElseThrow().stages()).allMatch(s -> s.source().contains("EB1128"));
    assertThat(lib.crop("peach").orElseThrow().stages()).allMatch(s -> s.source().contains("EB0914"));
    assertThat(lib.crop("apricot").orElseThrow().stages()).allMatch(s -> s.source().contains("EB1240"));
    assertThat(lib.crop("tart-cherry").orElseThrow().stages())
        .allMatch(s -> s.source().contains("Research Report 220"));
    assertThat(lib.crop("grapevine").orElseThrow().stages()).allMatch(s -> s.source().contains("Table 4.8"));
    assertThat(lib.crop("cranberry").orElseThrow().stages()).allMatch(s -> s.source().contains("UMass"));
  }

  @Test
  void oneToleranceStagesSaySoAndKeepTheTolerance() {
    for (String crop : List.of("highbush-blueberry", "strawberry", "cranberry")) {
      Crop c = lib.crop(crop).orElseThrow();
      assertThat(c.toleranceMarginC()).as(crop).isCloseTo(MARGIN_F / 1.8, within(EPS));
      for (Stage s : c.stages()) {
        assertThat(s.singleTolerance()).as(crop + " " + s.id()).isTrue();
        assertThat(s.note()).containsIgnoringCase("single stage tolerance");
        assertThat(s.t10C()).isEqualTo(s.toleranceC());
      }
      assertThat(lib.effective(crop, null).stages().get(0).source())
          .contains("T10 = tolerance, T90 = tolerance − 1.67 °C (3.0 °F)");
    }
  }

  /** UMass Cranberry Station: second spring column (Ben Lear, Stevens) and the fall fruit table. */
  @Test
  void cranberryVarietiesFollowTheirColumns() {
    EffectiveProfile benLear = lib.effective("cranberry", "ben-lear");
    EffectiveProfile stevens = lib.effective("cranberry", "stevens");
    EffectiveProfile howes = lib.effective("cranberry", "howes");
    // Ben Lear, Stevens & hybrids column: 20, 22, 25*, 27**, 29.5-30, 29.5-30, 29.5-30 °F.
    double[] spring = {20, 22, 25, 27, 30, 30, 30};
    String[] ids = {"spring-dormant", "white-bud", "bud-swell", "bud-break", "bud-elongation",
        "roughneck-to-hook", "hook-and-bloom"};
    for (int i = 0; i < ids.length; i++) {
      for (EffectiveProfile p : List.of(benLear, stevens)) {
        assertThat(p.stage(ids[i]).orElseThrow().t10C()).as(p.label() + " " + ids[i])
            .isCloseTo(c(spring[i]), within(EPS));
        assertThat(p.stage(ids[i]).orElseThrow().t90C()).isCloseTo(c(spring[i] - MARGIN_F), within(EPS));
      }
      assertThat(howes.stage(ids[i]).orElseThrow()).isEqualTo(lib.effective("cranberry", null)
          .stage(ids[i]).orElseThrow());
    }
    // Fruit table: deep red 23 (Ben Lear 24); maroon Early Black 23, Howes 20, Stevens 22, Ben Lear 24.
    assertThat(benLear.stage("deep-red").orElseThrow().t10C()).isCloseTo(c(24), within(EPS));
    assertThat(stevens.stage("deep-red").orElseThrow().t10C()).isCloseTo(c(23), within(EPS));
    assertThat(lib.effective("cranberry", "early-black").stage("maroon").orElseThrow().t10C())
        .isCloseTo(c(23), within(EPS));
    assertThat(howes.stage("maroon").orElseThrow().t10C()).isCloseTo(c(20), within(EPS));
    assertThat(stevens.stage("maroon").orElseThrow().t10C()).isCloseTo(c(22), within(EPS));
    assertThat(benLear.stage("maroon").orElseThrow().t10C()).isCloseTo(c(24), within(EPS));
  }

  @Test
  void theBundledCopyReadsLikeTheFolder() {
    assertThat(CropLibrary.load(org.rimeward.io.BundledData.bundled("crop-profiles")).crops())
        .extracting(Crop::id).containsExactlyElementsOf(lib.crops().stream().map(Crop::id).toList());
  }
}
