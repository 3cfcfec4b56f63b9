package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rimeward.farm.Block;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.Measure;
import org.rimeward.rules.facts.Moment;
import org.rimeward.weather.ForecastStep;

/**
 * The air temperature at which the planner's wet bulb reaches 0 °C, against a published table
 * of sprinkler start temperatures by dew point.
 */
class StartAirByDewPointTest {
  /**
   * OMAFA, E. Pate, ONfruit "Frost Protection Options for Strawberry Growers" (May 2024): suggested
   * starting air temperature by dew point (printed in °C and °F). Rows where the table's own wet
   * bulb is within 0.1 °C of 0 °C (by the psychrometric equation) are matched within 0.3 °C.
   */
  @ParameterizedTest(name = "dew point {0} °C -> start near {1} °C air")
  @CsvSource({"-5.5, 3.3", "-8.3, 4.4", "-4.4, 2.7", "-6.7, 3.8"})
  void wetBulbReachesZeroWhereThePublishedTableStarts(double dewPointC, double publishedStartC) {
    assertThat(airWhereWetBulbIsZero(dewPointC)).as("air when the wet bulb reaches 0 °C at Td %s", dewPointC)
        .isCloseTo(publishedStartC, within(0.3));
  }

  /**
   * The table's rows at dew points −1.1 to −3.8 °C are rounded to whole °F and start where the
   * wet bulb is still about −0.4 °C (computed with the WMO psychrometer equation at 101.3 kPa, as
   * docs/reference/check-values.md §2.2 notes). At those rows a 0 °C wet-bulb start is up to 0.7 °C warmer than
   * the table: earlier, the safe side. Pinned so that a change of method shows here.
   */
  @ParameterizedTest(name = "dew point {0} °C -> table {1} °C, engine warmer by at most 0.7 °C")
  @CsvSource({"-1.1, 0.0", "-1.7, 0.5", "-2.8, 1.1", "-3.8, 1.6"})
  void roundedRowsStartSlightlyColderThanAZeroWetBulb(double dewPointC, double publishedStartC) {
    double engine = airWhereWetBulbIsZero(dewPointC);
    assertThat(engine - publishedStartC).isBetween(0.3, 0.75);
  }

  static double airWhereWetBulbIsZero(double dewPointC) {
    // Air falls 0.05 °C every 5 minutes from 7 °C at a fixed dew point, sea level (101.3 kPa).
    List<ForecastStep> steps = new ArrayList<>();
    Instant t0 = Instant.parse("2026-04-15T03:00:00Z");
    for (int i = 0; i <= 200; i++) {
      double air = 7.0 - 0.05 * i;
      steps.add(new ForecastStep(t0.plusSeconds(300L * i), ZoneOffset.UTC, air,
          Math.min(dewPointC, air), 2.0, 10.0, 100, OptionalDouble.empty(), i + 2));
    }
    Block block = new Block("b", "strawberry", null, "open-blossom", 1.0, 0.0,
        OptionalDouble.empty(), Optional.empty(), Optional.empty());
    BlockNight night = BlockPhysics.compute(block, -1.1, -2.8, steps, 101.3, "test.csv");
    Moment zero = night.series().firstAtOrBelow(Measure.WET_BULB_C, 0.0).get(0);
    return night.series().valueAtTime(Measure.AIR_C, zero.at());
  }
}
