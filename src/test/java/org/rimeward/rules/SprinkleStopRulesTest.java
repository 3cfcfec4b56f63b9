package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.SprinkleStart;
import org.rimeward.rules.facts.SprinkleStop;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.StopBeyondForecast;
import org.rimeward.rules.facts.TargetBasis;

/**
 * rules/sprinkling/stop.drl. A sprinkled block (3.8 mm/h on 4 ha from "pond"), target T10
 * -2.2 °C, margin 1 °C, depression 1 °C, sunrise 06:30. The default stop is the UF/IFAS
 * Circular 348 rule (Harrison, Gerber & Choate): irrigation can stop once the wet bulb is 32 °F
 * (0 °C) or higher; never before sunrise, and never while it dips again later.
 */
class SprinkleStopRulesTest {
  static final PolicyFact TARGET_STOP =
      new PolicyFact(TargetBasis.T10, Double.NaN, 1.0, StopBasis.WET_BULB_ABOVE_TARGET);

  static BundledRules.Run night(PolicyFact policy, double[] air, double[] wet) {
    return BundledRules.run(new Scenario().policy(policy).source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").kill(40).hourly(air, wet).done());
  }

  static BundledRules.Run night(double[] air, double[] wet) {
    return night(new Scenario().policy, air, wet);
  }

  @Test
  void stopsWhenTheWetBulbRisesThroughFreezingAfterSunrise() {
    BundledRules.Run r = night(Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-STOP-WET-BULB-FREEZING")
        .doesNotFire("SPRINKLE-STOP-WET-BULB-TARGET", "SPRINKLE-STOP-BEYOND-FORECAST");
    // Wet bulb 07:00 -1.0 °C, 08:00 +0.5 °C: 0 °C is reached 1.0 / 1.5 of the hour = 40 min
    // after 07:00, so 07:40, read from the 08:00 step (line 16).
    SprinkleStop s = r.one(SprinkleStop.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(1, 7, 40));
    assertThat(s.thresholdC()).isEqualTo(0.0);
    assertThat(s.line()).isEqualTo(16);
    assertThat(r.explanation("SPRINKLE-STOP-WET-BULB-FREEZING", "b1"))
        .contains("07:40", "line 16", "06:30", "Circular 348", "-1.2 °C");
  }

  @Test
  void freezingStopDoesNotFireUnderTheTargetStopBasis() {
    BundledRules.Run r = night(TARGET_STOP, Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-STOP-WET-BULB-FREEZING");
  }

  @Test
  void targetStopWhenTheWetBulbRisesThroughTargetPlusMargin() {
    // Depression 0, so the wet bud is the wet bulb and only the wet-bulb crossing counts.
    BundledRules.Run r = BundledRules.run(new Scenario().policy(TARGET_STOP).source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").kill(40).depression(0)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-STOP-WET-BULB-TARGET")
        .doesNotFire("SPRINKLE-STOP-WET-BULB-FREEZING");
    // Threshold -2.2 + 1.0 = -1.2 °C. Wet bulb 06:00 -3.5, 07:00 -1.0: (3.5 - 1.2) / 2.5 = 0.92 of
    // the hour = 55 min 12 s; a stop rounds up to the minute (the safe side): 06:56, line 15.
    SprinkleStop s = r.one(SprinkleStop.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(1, 6, 56));
    assertThat(s.thresholdC()).isCloseTo(-1.2, within(1e-9));
    assertThat(s.line()).isEqualTo(15);
    assertThat(r.explanation("SPRINKLE-STOP-WET-BULB-TARGET", "b1"))
        .contains("06:56", "line 15", "-1.2 °C", "-2.2 °C", "1.0 °C", "06:30");
  }

  @Test
  void targetStopWaitsUntilTheWetBudIsBackAboveTheStartThreshold() {
    // Depression 1 °C: the wet bulb is above -1.2 °C from 06:56, but the wet bud (wet bulb less
    // 1 °C) is still below the start threshold; it is back at -1.2 °C between 07:00 (-2.0) and
    // 08:00 (-0.5), 0.8 / 1.5 of the hour = 32 min after 07:00: 07:32, read from 08:00 (line 16).
    BundledRules.Run r = night(TARGET_STOP, Scenario.FROST_AIR, Scenario.FROST_WET);
    SprinkleStop s = r.one(SprinkleStop.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(1, 7, 32));
    assertThat(s.line()).isEqualTo(16);
    assertThat(r.explanation("SPRINKLE-STOP-WET-BULB-TARGET", "b1")).contains("07:32");
  }

  @Test
  void targetStopDoesNotFireUnderTheFreezingStopBasis() {
    BundledRules.Run r = night(Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-STOP-WET-BULB-TARGET");
  }

  @Test
  void neverBeforeSunriseThoughTheWetBulbIsAboveFreezingFromFourOClock() {
    // Wet bulb 03:00 -1.0, 04:00 +0.5 and rising: above 0 °C from 03:40, but the stop waits for
    // sunrise, 06:30, and not for the next forecast step (07:00).
    double[] wet = {3, 2.5, 2, 1.5, 0.5, -0.5, -1.5, -2, -3, -1, 0.5, 1, 1.5, 2, 2.5, 3};
    BundledRules.Run r = night(Scenario.minus(wet, -0.5), wet);
    assertThat(r.one(SprinkleStop.class, "b1").at()).isEqualTo(Scenario.SUNRISE);
  }

  @Test
  void aCrossingJustBeforeSunriseStillStopsAtSunrise() {
    // Wet bulb 06:00 -0.5, 07:00 +1.0: 0 °C at 06:20, before sunrise; stop at 06:30.
    double[] wet = Scenario.with(Scenario.with(Scenario.FROST_WET, 12, -0.5), 13, 1.0);
    BundledRules.Run r = night(Scenario.FROST_AIR, wet);
    assertThat(r.one(SprinkleStop.class, "b1").at()).isEqualTo(Scenario.SUNRISE);
  }

  @Test
  void aDipAfterTheFirstCrossingMovesTheStopPastTheDip() {
    // Wet bulb 07:00 +0.5 (above 0 °C), 08:00 -0.5 (below again), 09:00 +1.0, 10:00 +2.0. No stop
    // and restart: the stop is where it stays above, 0.5 / 1.5 of the hour after 08:00 = 08:20.
    double[] wet = {3, 2.5, 2, 1.5, 0.5, -0.5, -1.5, -2, -3, -3.8, -4, -4.5, -3.5, 0.5, -0.5, 1.0, 2.0};
    double[] air = Scenario.minus(wet, -1.0);
    BundledRules.Run r = night(air, wet);
    SprinkleStop s = r.one(SprinkleStop.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(1, 8, 20));
    assertThat(s.line()).isEqualTo(17);
  }

  @Test
  void neverBeforeTheStartWhenTheStartComesAfterSunrise() {
    // A dawn frost: the wet bud first reaches -1.2 °C after sunrise. Depression 1.5 °C.
    // Wet bulb 06:00 +2.0 (wet bud +0.5), 07:00 -0.9 (wet bud -2.4): the wet bud crosses -1.2 °C
    // 1.7 / 2.9 of the hour after 06:00 = 35 min 10 s, so the start is 06:35. The wet bulb never
    // falls below the target stop threshold -1.2 °C, so that alone would allow a stop at once;
    // sprinkling cannot stop before it starts, nor while the wet bud is still below the start
    // threshold: wet bud 07:00 -2.4, 08:00 0.0 is back at -1.2 °C 0.5 of the hour after 07:00.
    double[] wet = {8, 7.5, 7, 6.5, 6, 5.5, 5, 4.5, 4, 3.5, 3, 2.5, 2.0, -0.9, 1.5, 3.0};
    double[] air = {9, 8.5, 8, 7.5, 7, 6.5, 6, 5.5, 5, 4.5, 4, 3.5, 2.5, -0.7, 2.0, 4.0};
    BundledRules.Run r = BundledRules.run(new Scenario().policy(TARGET_STOP).source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").depression(1.5).kill(10).hourly(air, wet).done());
    SprinkleStart start = r.one(SprinkleStart.class, "b1");
    assertThat(start.at()).isEqualTo(Scenario.at(1, 6, 35));
    SprinkleStop stop = r.one(SprinkleStop.class, "b1");
    assertThat(stop.at()).isAfter(start.at()).isEqualTo(Scenario.at(1, 7, 30));
    assertThat(r.one(SprinklePlan.class, "b1").hours()).isCloseTo(55 / 60.0, within(1e-9));
  }

  @Test
  void beyondForecastWhenTheWetBulbEndsBelowFreezing() {
    double[] wet = Scenario.with(Scenario.FROST_WET, 15, -0.05);
    BundledRules.Run r = night(Scenario.FROST_AIR, wet);
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-STOP-BEYOND-FORECAST")
        .doesNotFire("SPRINKLE-STOP-WET-BULB-FREEZING", "SPRINKLE-PLAN");
    StopBeyondForecast b = r.one(StopBeyondForecast.class, "b1");
    assertThat(b.forecastEnd()).isEqualTo(Scenario.at(1, 9, 0));
    assertThat(r.all(SprinkleStop.class)).isEmpty();
    assertThat(r.explanation("SPRINKLE-STOP-BEYOND-FORECAST", "b1")).contains("09:00");
  }

  @Test
  void notBeyondForecastWhenTheLastStepIsExactlyFreezing() {
    // Wet bulb 08:00 -0.5, 09:00 0.0: at or above from the last step, 09:00.
    double[] wet = Scenario.with(Scenario.with(Scenario.FROST_WET, 14, -0.5), 15, 0.0);
    BundledRules.Run r = night(Scenario.FROST_AIR, wet);
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-STOP-BEYOND-FORECAST")
        .fires("SPRINKLE-STOP-WET-BULB-FREEZING");
    assertThat(r.one(SprinkleStop.class, "b1").at()).isEqualTo(Scenario.at(1, 9, 0));
  }

  @Test
  void planBetweenStartAndStopAtTheInstalledRate() {
    BundledRules.Run r = night(Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-PLAN");
    SprinklePlan p = r.one(SprinklePlan.class, "b1");
    // 22:42 to 07:40 is 8 h 58 min; 1 mm on 1 ha is 10 m³, so 3.8 mm/h × 4 ha = 152 m³/h and
    // 152 × 8.9667 h = 1362.9 m³.
    assertThat(p.start()).isEqualTo(Scenario.at(0, 22, 42));
    assertThat(p.stop()).isEqualTo(Scenario.at(1, 7, 40));
    assertThat(p.hours()).isCloseTo(8 + 58 / 60.0, within(1e-9));
    assertThat(p.flowM3H()).isCloseTo(152.0, within(1e-9));
    assertThat(p.waterM3()).isCloseTo(152.0 * (8 + 58 / 60.0), within(1e-6));
    assertThat(p.requiredRateMmH()).isEqualTo(2.0);
    assertThat(r.explanation("SPRINKLE-PLAN", "b1"))
        .contains("22:42", "07:40", "9.0 h", "3.80 mm/h", "152 m3/h", "1363 m3", "2.00 mm/h", "pond");
  }

  @Test
  void noPlanWithoutAStop() {
    double[] wet = Scenario.with(Scenario.FROST_WET, 15, -0.05);
    BundledRules.Run r = night(Scenario.FROST_AIR, wet);
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-PLAN");
    assertThat(r.all(SprinklePlan.class)).isEmpty();
  }
}
