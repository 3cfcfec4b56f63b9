package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Random;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;

class BudTemperatureTest {
  @ParameterizedTest(name = "T {0} °C, Td {1} °C")
  @CsvSource({"0, -5", "-2, -6", "3, -3", "-4, -12", "2, -1"})
  void clearCalmNightPutsBudsOneToThreeDegreesBelowAir(double t, double td) {
    // Leuning & Cremer (1988) Agric. For. Meteorol. 42:121: leaves 1-3 °C below adjacent air on
    // radiation-frost nights; FAO 2005 (Snyder & de Melo-Abreu): buds and flowers run colder than air.
    BudTemperature b = BudTemperature.estimate(t, td, 0, 0);
    assertThat(b.depressionC()).isBetween(1.0, 3.0);
    assertThat(b.budTempC()).isCloseTo(t - b.depressionC(), org.assertj.core.api.Assertions.within(1e-9));
  }

  @ParameterizedTest(name = "T {0} °C, Td {1} °C")
  @CsvSource({"0, -5", "-2, -5", "3, 0", "-3, -8"})
  void overcastOrWindyNightLeavesBudsNearAirTemperature(double t, double td) {
    // Körner (2013), Strasburger's Plant Sciences, via BioNumbers 113222: leaves 3-5 K below air
    // under a clear sky, "clouds and fog reduce the effect". Tyson et al. (smallfruits.org,
    // "Frost/Freeze Protection by Sprinkler Irrigation"): a 4 mph wind prevents frost while the air
    // stays above 32 °F, i.e. wind keeps plants at air temperature. "Near zero" is taken as < 0.5 °C.
    assertThat(BudTemperature.estimate(t, td, 0, 100).depressionC()).isLessThan(0.5);
    assertThat(BudTemperature.estimate(t, td, 3, 0).depressionC()).isLessThan(0.5);
    assertThat(BudTemperature.estimate(t, td, 4, 0).depressionC()).isLessThan(0.5);
  }

  static Stream<Arguments> randomNights() {
    Random r = new Random(7311L);
    return IntStream.range(0, 100).mapToObj(i -> {
      double t = -10 + 15 * r.nextDouble();
      double td = t - 0.5 - 12 * r.nextDouble();
      double u1 = 6 * r.nextDouble();
      double u2 = u1 + 0.2 + 6 * r.nextDouble();
      double c1 = 90 * r.nextDouble();
      double c2 = c1 + 5 + (95 - c1) * r.nextDouble();
      return Arguments.of(t, td, u1, u2, c1, c2);
    });
  }

  @ParameterizedTest
  @MethodSource("randomNights")
  void depressionFallsWithWindAndCloud(double t, double td, double u1, double u2, double c1, double c2) {
    double calm = BudTemperature.estimate(t, td, u1, c1).depressionC();
    assertThat(calm).isGreaterThanOrEqualTo(0);
    assertThat(BudTemperature.estimate(t, td, u2, c1).depressionC()).isLessThan(calm);
    assertThat(BudTemperature.estimate(t, td, u1, c2).depressionC()).isLessThan(calm);
  }

  @Test
  void badInputsAreErrors() {
    assertThatThrownBy(() -> BudTemperature.estimate(0, 1, 0, 0)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> BudTemperature.estimate(0, -5, -1, 0)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> BudTemperature.estimate(0, -5, 0, 101)).isInstanceOf(OutOfRangeException.class);
  }

  @Test
  void withoutSunTheSolarFormIsTheNightForm() {
    BudTemperature night = BudTemperature.estimate(-2, -6, 0.5, 0);
    BudTemperature dark = BudTemperature.estimate(-2, -6, 0.5, 0, 0.0);
    org.assertj.core.api.Assertions.assertThat(dark).isEqualTo(night);
  }

  /**
   * Sunlit plant parts run warmer than the air in light wind (Campbell &amp; Norman 1998, ch. 14,
   * from memory: a few kelvin for small organs in full sun). Here only the direction and order are
   * checked: more sun, warmer bud; strong sun in light wind puts the bud above the air.
   */
  @Test
  void theMorningSunWarmsABudAboveTheAir() {
    double dawn = BudTemperature.estimate(-1, -6, 1.0, 0, 50).budTempC();
    double morning = BudTemperature.estimate(-1, -6, 1.0, 0, 300).budTempC();
    double noon = BudTemperature.estimate(-1, -6, 1.0, 0, 800).budTempC();
    org.assertj.core.api.Assertions.assertThat(dawn).isLessThan(morning);
    org.assertj.core.api.Assertions.assertThat(morning).isLessThan(noon);
    org.assertj.core.api.Assertions.assertThat(noon).isGreaterThan(-1.0).isLessThan(4.0);
  }

  @Test
  void solarRadiationOutOfRangeIsAnError() {
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> BudTemperature.estimate(0, -5, 1, 0, 2000))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("solar radiation");
  }

  /**
   * A forecast's window can open on a warm afternoon or hold a gale: the estimate answers there
   * (a bud then sits within a degree of the air, as any small organ in wind or daylight does; common
   * practice) rather than refusing the night.
   */
  @Test
  void aWarmAfternoonAndAGaleAreEstimatedNotRefused() {
    BudTemperature warm = BudTemperature.estimate(28, 10, 2.0, 20, 0);
    org.assertj.core.api.Assertions.assertThat(warm.depressionC()).isBetween(0.0, 3.0);
    BudTemperature gale = BudTemperature.estimate(-3, -8, 35.0, 0, 0);
    org.assertj.core.api.Assertions.assertThat(gale.depressionC()).isBetween(0.0, 0.5);
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> BudTemperature.estimate(60, 10, 1, 0, 0))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("air temperature");
  }
}
