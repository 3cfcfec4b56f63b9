package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import org.junit.jupiter.api.Test;

/**
 * The FAO 2005 ch. 6 square-root night trend, T(t) = T0 + b'·√(t − t0) from sunset + 2 h to
 * sunrise. Check values: docs/reference/site-minimum.md §2 (COMPUTED; the first two sets equal the
 * example of the R 'frost' package's getTrend, which implements the trend of the FAO 2005
 * spreadsheet FFST.xls, SEEN-2nd).
 */
class CoolingCurveTest {
  private static final Instant SUNSET = Instant.parse("2026-04-15T02:50:00Z");

  private static CoolingCurve curve(double t0C, double minC, int sunsetToSunriseH) {
    return new CoolingCurve(t0C, minC, SUNSET.plus(Duration.ofHours(2)),
        SUNSET.plus(Duration.ofHours(sunsetToSunriseH)));
  }

  private static void hourly(CoolingCurve c, int firstHour, double... expected) {
    for (int i = 0; i < expected.length; i++) {
      int h = firstHour + i;
      assertThat(c.tempAtC(SUNSET.plus(Duration.ofHours(h)))).as("hour %d after sunset", h)
          .isCloseTo(expected[i], within(0.0015));
    }
  }

  @Test
  void celsiusExampleT0095MinMinus545Over15Hours() {
    CoolingCurve c = curve(0.95, -5.45, 15);
    assertThat(c.slopePerRootHour()).isCloseTo(-1.77504, within(1e-5));
    hourly(c, 3, -0.825, -1.560, -2.124, -2.600, -3.019, -3.398, -3.746, -4.071, -4.375, -4.663,
        -4.937, -5.199, -5.450);
  }

  @Test
  void fahrenheitExampleGivesTheSameShapeOnAnyLinearScale() {
    CoolingCurve c = curve(33.7, 22.2, 15);
    assertThat(c.slopePerRootHour()).isCloseTo(-3.18953, within(1e-5));
    hourly(c, 3, 30.510, 29.189, 28.176, 27.321, 26.568, 25.887, 25.261, 24.679, 24.131, 23.614,
        23.122, 22.651, 22.200);
  }

  @Test
  void twelveHourNight() {
    CoolingCurve c = curve(4.0, -2.0, 12);
    assertThat(c.slopePerRootHour()).isCloseTo(-1.89737, within(1e-5));
    hourly(c, 3, 2.103, 1.317, 0.714, 0.205, -0.243, -0.648, -1.020, -1.367, -1.692, -2.000);
  }

  @Test
  void flatOutsideItsSpanAndRefusesABackwardSpan() {
    CoolingCurve c = curve(4.0, -2.0, 12);
    assertThat(c.tempAtC(SUNSET)).isEqualTo(4.0);
    assertThat(c.tempAtC(SUNSET.plus(Duration.ofHours(14)))).isEqualTo(-2.0);
    assertThatThrownBy(() -> new CoolingCurve(1, 0, SUNSET, SUNSET))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("before sunrise");
  }
}
