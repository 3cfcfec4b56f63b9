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
import org.junit.jupiter.params.provider.MethodSource;

class KillCurveTest {
  private static double f2c(double f) {
    return (f - 32) / 1.8;
  }

  @Test
  void appleFullBloomPassesThroughBothPublishedPoints() {
    // Penn State Extension / WSU EB0913: apple full bloom 10 % kill 28 °F, 90 % kill 25 °F (30 min).
    KillCurve c = new KillCurve(f2c(28), f2c(25));
    assertThat(c.killPct(f2c(28))).isCloseTo(10, within(1e-9));
    assertThat(c.killPct(f2c(25))).isCloseTo(90, within(1e-9));
    assertThat(c.killPct(f2c(26.5))).isCloseTo(50, within(1e-9));
    assertThat(c.tempForKillPct(10)).isCloseTo(f2c(28), within(1e-9));
    assertThat(c.tempForKillPct(90)).isCloseTo(f2c(25), within(1e-9));
  }

  static Stream<Arguments> randomCurves() {
    Random r = new Random(55L);
    return IntStream.range(0, 100).mapToObj(i -> {
      double t10 = -12 + 12 * r.nextDouble();
      double t90 = t10 - 0.3 - 8 * r.nextDouble();
      return Arguments.of(t10, t90, -25 + 30 * r.nextDouble(), 0.5 + 99 * r.nextDouble());
    });
  }

  @ParameterizedTest
  @MethodSource("randomCurves")
  void monotonicAndInvertible(double t10, double t90, double temp, double pct) {
    KillCurve c = new KillCurve(t10, t90);
    assertThat(c.killPct(t10)).isCloseTo(10, within(1e-6));
    assertThat(c.killPct(t90)).isCloseTo(90, within(1e-6));
    assertThat(c.killPct(temp - 0.1)).isGreaterThanOrEqualTo(c.killPct(temp));
    assertThat(c.killPct(temp)).isBetween(0.0, 100.0);
    assertThat(c.killPct(c.tempForKillPct(pct))).isCloseTo(pct, within(1e-6));
  }

  @Test
  void invalidCurvesAndPercentagesAreErrors() {
    assertThatThrownBy(() -> new KillCurve(-3, -2)).isInstanceOf(OutOfRangeException.class)
        .hasMessageContaining("must be below");
    assertThatThrownBy(() -> new KillCurve(-3, -3)).isInstanceOf(OutOfRangeException.class);
    KillCurve c = new KillCurve(-2.2, -3.9);
    assertThatThrownBy(() -> c.tempForKillPct(100)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> c.tempForKillPct(0)).isInstanceOf(OutOfRangeException.class);
  }
}
