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

/**
 * The physics of the sprinkler balance: its heat-transfer law against an independent correlation,
 * its energy identities, and properties over seeded random frost-night conditions. The published
 * rate tables are in {@link SprinklerRateTablesTest}.
 */
class SprinklerBalanceTest {
  private static final double WATER_C = 5.0;
  private static final double P_KPA = 101.325;

  @ParameterizedTest(name = "Re {0}")
  @CsvSource({"100, 0.683, 0.466", "1000, 0.683, 0.466", "5000, 0.193, 0.618", "20000, 0.193, 0.618"})
  void churchillBernsteinAgreesWithHilpert(double re, double c, double m) {
    // Hilpert (1933) as tabulated by Incropera & DeWitt, Table 7.2 (from memory): Nu = C Re^m Pr^1/3,
    // C = 0.683, m = 0.466 for Re 40-4000; C = 0.193, m = 0.618 for Re 4000-40 000. Two published
    // fits to the same wind-tunnel data agree to about 10 %.
    double hilpert = c * Math.pow(re, m) * Math.cbrt(0.71);
    assertThat(Convection.cylinderForcedNusselt(re)).isCloseTo(hilpert, within(0.12 * hilpert));
  }

  @Test
  void convectionRisesAsRootOfWindOverDiameter() {
    // A small cylinder's coefficient grows about as sqrt(u/d) at these Reynolds numbers.
    double h1 = Convection.cylinderWPerM2K(0.01, 2, -4, 4);
    double h4 = Convection.cylinderWPerM2K(0.01, 8, -4, 4);
    assertThat(h4 / h1).isBetween(1.8, 2.3);
    assertThat(Convection.cylinderWPerM2K(0.005, 2, -4, 4) / h1).isBetween(1.3, 1.5);
    // Calm air: free convection only, a few W/m² K for a 10 mm cylinder 4 K below the air.
    assertThat(Convection.cylinderWPerM2K(0.01, 0, -4, 4)).isBetween(3.0, 10.0);
  }

  @Test
  void rateIsTheLossOverTheHeatOfFreezingTimesTheGroundAreaFactor() {
    // 1 mm/h of water freezing releases 334 000 J / 3600 s = 92.8 W/m² (frost reference 2.3).
    SprinklerBalance.IceLoss loss = SprinklerBalance.iceLoss(-4, -7, 2, P_KPA, 0);
    double rate = SprinklerBalance.requiredRateMmH(-4, -7, 2, 0.0, P_KPA);
    assertThat(rate).isCloseTo(SprinklerBalance.GROUND_AREA_FACTOR * loss.totalWm2() / 92.78, within(0.01));
    // Evaporation from the wet ice is of the same order as convection on a dry frost night
    // (about 7.5 kg must freeze for each kg that evaporates).
    assertThat(loss.evaporationWm2() / loss.convectionWm2()).isBetween(0.5, 2.0);
  }

  @Test
  void cloudCutsTheLongWaveLossOnly() {
    SprinklerBalance.IceLoss clear = SprinklerBalance.iceLoss(-3, -6, 0.5, P_KPA, 0);
    SprinklerBalance.IceLoss overcast = SprinklerBalance.iceLoss(-3, -6, 0.5, P_KPA, 100);
    assertThat(overcast.longWaveWm2()).isLessThan(0.5 * clear.longWaveWm2());
    assertThat(overcast.convectionWm2()).isEqualTo(clear.convectionWm2());
    assertThat(SprinklerBalance.requiredRateMmH(-3, -6, 0.5, WATER_C, P_KPA, 100))
        .isLessThan(SprinklerBalance.requiredRateMmH(-3, -6, 0.5, WATER_C, P_KPA));
  }

  @Test
  void answersAtAnyWindAndStaysFinite() {
    // The balance answers in any wind; whether to sprinkle in it is the rules' call.
    double at8 = SprinklerBalance.requiredRateMmH(-4, -7, 8, WATER_C, P_KPA);
    double at12 = SprinklerBalance.requiredRateMmH(-4, -7, 12, WATER_C, P_KPA);
    double at15 = SprinklerBalance.requiredRateMmH(-4, -7, 15, WATER_C, P_KPA);
    assertThat(at8).isFinite().isGreaterThan(SprinklerBalance.requiredRateMmH(-4, -7, 4.5, WATER_C, P_KPA));
    assertThat(at12).isFinite().isGreaterThan(at8);
    assertThat(at15).isFinite().isGreaterThan(at12);
    assertThat(SprinklerBalance.requiredRateMmH(-4, -7, SprinklerBalance.MAX_WIND_MS, WATER_C, P_KPA)).isFinite();
  }

  @Test
  void warmAndHumidAirNeedsNoWater() {
    // Air above 0 °C and a dew point above 0 °C: the ice gains heat from the air and from
    // condensation, so nothing needs to freeze.
    assertThat(SprinklerBalance.requiredRateMmH(4, 2, 3, WATER_C, P_KPA, 100)).isZero();
  }

  static Stream<Arguments> anyConditions() {
    Random r = new Random(20_260_412L);
    return IntStream.range(0, 300).mapToObj(i -> {
      double t = -40 + 60 * r.nextDouble();
      double td = Math.max(-40, t - 30 * r.nextDouble());
      return Arguments.of(t, td, SprinklerBalance.MAX_WIND_MS * r.nextDouble(), 40 * r.nextDouble(),
          50 + 60 * r.nextDouble(), 100 * r.nextDouble());
    });
  }

  @ParameterizedTest
  @MethodSource("anyConditions")
  void finiteAndNeverNegativeForEveryInputInRange(double t, double td, double u, double water,
      double p, double cloud) {
    assertThat(SprinklerBalance.requiredRateMmH(t, td, u, water, p, cloud)).isFinite().isNotNegative();
  }

  static Stream<Arguments> frostNights() {
    Random r = new Random(991L);
    return IntStream.range(0, 200).mapToObj(i -> {
      double t = -12 + 12 * r.nextDouble();
      double td = t - 0.5 - 8 * r.nextDouble();
      double u = 15 * r.nextDouble();
      double water = 15 * r.nextDouble();
      double p = 80 + 22 * r.nextDouble();
      double cloud = 100 * r.nextDouble();
      return Arguments.of(t, td, u, water, p, cloud);
    });
  }

  @ParameterizedTest
  @MethodSource("frostNights")
  void needRisesWithWindAndWithCold(double t, double td, double u, double water, double p, double cloud) {
    double base = SprinklerBalance.requiredRateMmH(t, td, u, water, p, cloud);
    assertThat(base).isGreaterThan(0);
    assertThat(SprinklerBalance.requiredRateMmH(t, td, u + 0.5, water, p, cloud)).as("more wind").isGreaterThan(base);
    assertThat(SprinklerBalance.requiredRateMmH(t - 0.5, td, u, water, p, cloud)).as("colder air").isGreaterThan(base);
    assertThat(SprinklerBalance.requiredRateMmH(t - 0.5, td - 0.5, u, water, p, cloud))
        .as("colder night, same dew-point depression").isGreaterThan(base);
    assertThat(SprinklerBalance.requiredRateMmH(t, td - 0.5, u, water, p, cloud)).as("drier air").isGreaterThan(base);
    // Warmer supply water brings sensible heat; cloud returns long-wave; both need a little less.
    assertThat(SprinklerBalance.requiredRateMmH(t, td, u, water + 5, p, cloud)).isLessThan(base);
    if (cloud < 90) {
      assertThat(SprinklerBalance.requiredRateMmH(t, td, u, water, p, cloud + 10)).isLessThan(base);
    }
  }

  @ParameterizedTest
  @MethodSource("frostNights")
  void protectionIsTheInverseOfTheNeed(double t, double td, double u, double water, double p, double cloud) {
    double rate = SprinklerBalance.requiredRateMmH(t, td, u, water, p, cloud);
    SprinklerBalance.Protection to = SprinklerBalance.protection(rate, td, u, water, p, cloud);
    assertThat(to.limit()).isEqualTo(SprinklerBalance.Limit.AIR_TEMPERATURE);
    assertThat(to.airTempC()).isCloseTo(t, within(0.005));
  }

  @Test
  void protectionSaysWhichEndLimitsIt() {
    // A generous rate in calm air holds even with the air down at its dew point: the limit
    // depends on a lower dew point than the one given.
    SprinklerBalance.Protection wet = SprinklerBalance.protection(20, -6, 0.2, WATER_C, P_KPA, 0);
    assertThat(wet.limit()).isEqualTo(SprinklerBalance.Limit.DEW_POINT);
    assertThat(wet.airTempC()).isEqualTo(-6.0);
    // A trickle in a strong dry wind is short even at 0 °C air.
    SprinklerBalance.Protection dry = SprinklerBalance.protection(0.5, -10, 8, WATER_C, P_KPA, 0);
    assertThat(dry.limit()).isEqualTo(SprinklerBalance.Limit.FREEZING);
  }

  @Test
  void inputOutsideTheValidRangeIsAnErrorNamingIt() {
    assertThatThrownBy(() -> SprinklerBalance.requiredRateMmH(-4, -3, 1, WATER_C, P_KPA))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("dew point");
    assertThatThrownBy(() -> SprinklerBalance.requiredRateMmH(-4, -7, -1, WATER_C, P_KPA))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("wind speed at 2 m");
    assertThatThrownBy(() -> SprinklerBalance.requiredRateMmH(Double.NaN, -7, 1, WATER_C, P_KPA))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("air temperature");
    assertThatThrownBy(() -> SprinklerBalance.protection(0, -7, 1, WATER_C, P_KPA, 0))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("application rate");
  }
}
