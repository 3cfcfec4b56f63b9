package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

class PsychrometricsTest {
  private static final double SEA_LEVEL_KPA = 101.325;

  @ParameterizedTest(name = "e°({0} °C) = {1} kPa")
  @CsvSource({"1, 0.657", "2, 0.706", "3, 0.758", "4, 0.813", "5, 0.872", "6, 0.935", "7, 1.002",
      "8, 1.073", "9, 1.148", "10, 1.228", "15, 1.705", "20, 2.338", "25, 3.168"})
  void saturationOverWaterAgreesWithFao56Annex2(double tempC, double fao) {
    // FAO-56 Annex 2 rows (Eq. 11, Tetens form). The AERK form differs from Tetens by up to
    // 0.2 % over 0-25 °C, plus the table's 0.001 rounding: 0.3 % covers both.
    assertThat(Psychrometrics.saturationOverWaterKPa(tempC)).isCloseTo(fao, within(0.003 * fao));
  }

  @Test
  void saturationOverIceAgreesWithAshrae2017() {
    // 2017 ASHRAE Handbook - Fundamentals ch. 1 Table 3, as pinned in PsychroLib's test suite
    // (tests/test_psychrolib_si.py): 401.74 Pa at -5 °C, 103.24 Pa at -20 °C; within 0.2 %.
    assertThat(Psychrometrics.saturationOverIceKPa(-5) * 1000).isCloseTo(401.74, within(0.002 * 401.74));
    assertThat(Psychrometrics.saturationOverIceKPa(-20) * 1000).isCloseTo(103.24, within(0.002 * 103.24));
  }

  @ParameterizedTest(name = "T {0} °C, RH {1} % -> Td {2} °C")
  @CsvSource({"20, 50, 9.26", "10, 80, 6.71", "5, 60, -2.13", "2, 70, -2.90", "0, 50, -9.20",
      "-2, 80, -4.99", "25, 60, 16.70"})
  void dewPointFromRhMatchesAerkChecks(double t, double rh, double td) {
    // Shared reference 5.2 dew-point checks, COMPUTED from the AERK form (Alduchov & Eskridge 1996).
    assertThat(Psychrometrics.dewPointFromRhC(t, rh)).isCloseTo(td, within(0.01));
    assertThat(Psychrometrics.rhPct(t, td)).isCloseTo(rh, within(0.1));
    assertThat(Psychrometrics.vapourPressureFromRhKPa(t, rh))
        .isCloseTo(Psychrometrics.vapourPressureFromDewPointKPa(td), within(0.0005));
  }

  @ParameterizedTest(name = "Td {0} °C -> frost point {1} °C")
  @CsvSource({"0, -0.01", "-2, -1.77", "-5, -4.42", "-10, -8.88", "-15, -13.38"})
  void frostPointFromDewPoint(double td, double tf) {
    // Shared reference 5.2, COMPUTED with AERK and AERKi (Alduchov & Eskridge 1996).
    assertThat(Psychrometrics.frostPointFromDewPointC(td)).isCloseTo(tf, within(0.01));
  }

  @Test
  void ashraeBelowFreezingWetBulbCaseComesBack() {
    // 2017 ASHRAE Fundamentals via PsychroLib's test suite: Tdry -1 °C, Twet -5 °C, 95461 Pa ->
    // W = 0.00120399819933844 kg/kg. ASHRAE's -5 °C is an ice-covered bulb (its Eq. 37), so the
    // ice bulb should come back within 0.1 °C: the WMO coefficient 5.75e-4 and ASHRAE's enthalpy
    // form differ by a few hundredths of a degree here. A liquid (supercooled) bulb reads a
    // little warmer, so it gets 0.2 °C.
    double w = 0.00120399819933844;
    double pKPa = 95.461;
    double e = w * pKPa / (0.621945 + w);
    double td = Psychrometrics.dewPointC(e);
    assertThat(Psychrometrics.iceBulbC(-1, td, pKPa)).hasValueCloseTo(-5.0, within(0.1));
    assertThat(Psychrometrics.wetBulbC(-1, td, pKPa)).isCloseTo(-5.0, within(0.2));
  }

  @Test
  void stull2011ExampleAsLooseCrossCheck() {
    // Stull (2011) J. Appl. Meteor. Climatol. 50:2267 example (from memory): 20 °C, 50 % -> 13.7 °C.
    // Stull's fit has a mean absolute error of 0.28 °C, so only +/-0.3 °C is asked of the solver.
    double td = Psychrometrics.dewPointFromRhC(20, 50);
    assertThat(Psychrometrics.wetBulbC(20, td, SEA_LEVEL_KPA)).isCloseTo(13.7, within(0.3));
    assertThat(stull(20, 50)).as("Stull formula itself").isCloseTo(13.70, within(0.01));
  }

  @Test
  void knoxOneThirdRuleNearFreezing() {
    // Knox, Nevius & Knox (2017) BAMS 98(9), published example: 32 °F, Td 23 °F -> about 29 °F.
    double airC = 0.0;
    double tdC = (23 - 32) / 1.8;
    double ruleC = (29 - 32) / 1.8;
    assertThat(Psychrometrics.wetBulbC(airC, tdC, SEA_LEVEL_KPA)).isCloseTo(ruleC, within(0.3));
  }

  @ParameterizedTest(name = "T {0} °C, RH {1} %")
  @CsvSource(nullValues = "-", value = {
      "20, 50, 13.84, -", "10, 50, 5.58, -", "5, 50, 1.39, -", "3, 50, -0.31, -0.54",
      "2, 60, -0.50, -0.66", "2, 40, -1.82, -2.02", "1, 70, -0.78, -0.87", "0, 80, -1.12, -1.15",
      "0, 50, -2.87, -2.96", "-2, 70, -3.54, -3.49", "-2, 50, -4.60, -4.60", "4, 30, -0.94, -1.26"})
  void wetAndIceBulbMatchReferenceTable(double t, double rh, double psyWater, Double psyIce) {
    // Shared reference 5.5 table, psy-water and psy-ice columns: COMPUTED there from the same
    // WMO-No. 8 psychrometer equations at 101.325 kPa, not published numbers; within 0.1 °C.
    double td = Psychrometrics.dewPointFromRhC(t, rh);
    assertThat(Psychrometrics.wetBulbC(t, td, SEA_LEVEL_KPA)).isCloseTo(psyWater, within(0.1));
    if (psyIce == null) {
      assertThat(Psychrometrics.iceBulbC(t, td, SEA_LEVEL_KPA)).isEmpty();
    } else {
      assertThat(Psychrometrics.iceBulbC(t, td, SEA_LEVEL_KPA)).hasValueCloseTo(psyIce, within(0.1));
    }
  }

  @ParameterizedTest(name = "Td {0} °C, start air {1} °C")
  @CsvSource({"-1.1, 0.0", "-1.7, 0.5", "-2.8, 1.1", "-3.8, 1.6", "-4.4, 2.7", "-5.5, 3.3",
      "-6.7, 3.8", "-8.3, 4.4"})
  void omafaStartTemperatureTableKeepsWetBulbNearZero(double td, double startAir) {
    // OMAFA (E. Pate, ONfruit "Frost Protection Options for Strawberry Growers", May 2024): dew point
    // -> suggested sprinkler start air temperature. The table holds the wet bulb at about 0 °C
    // (reference 2.2 computes -0.43 to +0.12 °C), so the solver must put every row within 0.5 °C of 0.
    assertThat(Psychrometrics.wetBulbC(startAir, td, 101.3)).isCloseTo(0.0, within(0.5));
  }

  @Test
  void omafaRowTdMinus5p5GivesWetBulbAtZero() {
    // OMAFA table row Td -5.5 °C -> start 3.3 °C; reference 2.2 computes Tw = +0.12 °C.
    assertThat(Psychrometrics.wetBulbC(3.3, -5.5, 101.3)).isCloseTo(0.12, within(0.05));
  }

  @ParameterizedTest(name = "Td {0} °C, Tc {1} °C -> air {2} °C")
  @CsvSource({"-2, 0, 1.3", "-6, -2, 0.1", "-10, -3, 0.1", "-14, -4, -0.3", "-8, 0, 4.2"})
  void computedAnalogOfFaoTable75(double td, double tc, double air) {
    // Shared reference 2.2, COMPUTED analog of FAO 2005 Table 7.5 (not the FAO numbers): at the
    // tabulated air temperature the wet bulb equals Tc; the 0.1 °C rounding of the table moves Tw
    // by at most about 0.05 °C.
    assertThat(Psychrometrics.wetBulbC(air, td, 101.3)).isCloseTo(tc, within(0.06));
  }

  static Stream<Arguments> randomAir() {
    Random r = new Random(20240415L);
    return IntStream.range(0, 200).mapToObj(i -> {
      double t = -20 + 40 * r.nextDouble();
      double td = Math.max(-39.9, t - 25 * r.nextDouble());
      double p = 60 + 45 * r.nextDouble();
      return Arguments.of(t, td, p);
    });
  }

  @ParameterizedTest
  @MethodSource("randomAir")
  void wetBulbLiesBetweenDewPointAndAir(double t, double td, double p) {
    double tw = Psychrometrics.wetBulbC(t, td, p);
    assertThat(tw).isBetween(td - 1e-4, t + 1e-4);
    Psychrometrics.iceBulbC(t, td, p).ifPresent(ti -> assertThat(ti).isLessThan(0.0));
  }

  @Test
  void dewPointAboveAirIsAnError() {
    assertThatThrownBy(() -> Psychrometrics.wetBulbC(0, 1, SEA_LEVEL_KPA))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("dew point");
    assertThatThrownBy(() -> Psychrometrics.iceBulbC(-3, -2, SEA_LEVEL_KPA))
        .isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> Psychrometrics.dewPointFromRhC(5, 101))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("relative humidity");
    assertThatThrownBy(() -> Psychrometrics.wetBulbC(5, 0, 20))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("pressure");
  }

  @Test
  void saturatedAirHasWetBulbAtAirTemperature() {
    assertThat(Psychrometrics.wetBulbC(-2, -2, SEA_LEVEL_KPA)).isCloseTo(-2, within(1e-4));
  }

  /** Stull (2011) fit, only as an independent cross-check of the solver. */
  private static double stull(double t, double rh) {
    return t * Math.atan(0.151977 * Math.sqrt(rh + 8.313659)) + Math.atan(t + rh)
        - Math.atan(rh - 1.676331) + 0.00391838 * Math.pow(rh, 1.5) * Math.atan(0.023101 * rh) - 4.686035;
  }
}
