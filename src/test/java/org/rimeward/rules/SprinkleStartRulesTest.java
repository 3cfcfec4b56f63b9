package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.SprinkleStart;
import org.rimeward.rules.facts.NotAdvisedReason;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.SprinklingNotAdvised;
import org.rimeward.rules.facts.StartThreshold;

/**
 * rules/sprinkling/start.drl. A sprinkled block (3.8 mm/h from "pond"), target T10 -2.2 °C, a
 * farm start margin of 1 °C (invented for the test; the rules' own default is 0 °C, FAO 2005
 * Table 7.5). Depression 1 °C, so the wet bud is the wet bulb less 1 °C.
 */
class SprinkleStartRulesTest {
  static Scenario.BlockBuilder sprinkled(Scenario s) {
    return s.source("pond", 500, 5000).block("b1").sprinklers(3.8, "pond").kill(40);
  }

  static BundledRules.Run frostNight() {
    return BundledRules.run(sprinkled(new Scenario())
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  static BundledRules.Run windAt0300(double windMs, double coverC) {
    double[] wind = Scenario.with(Scenario.fill(16, 1.0), 9, windMs);
    return BundledRules.run(sprinkled(new Scenario()).covers(coverC, 2).wind(wind)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  @Test
  void thresholdIsTargetPlusMargin() {
    BundledRules.Run r = frostNight();
    BundledRules.assertFired(r, "b1").firesOnce("START-THRESHOLD")
        .doesNotFire("START-THRESHOLD-UNDER-COVERS");
    // -2.2 + 1.0 = -1.2 °C
    assertThat(r.one(StartThreshold.class, "b1").thresholdC()).isCloseTo(-1.2, within(1e-9));
    assertThat(r.explanation("START-THRESHOLD", "b1")).contains("-1.2 °C", "-2.2 °C", "1.0 °C");
  }

  @Test
  void noThresholdWhenNoProtectionIsNeeded() {
    // Coldest dry bud -2.15 °C (air -1.15 less 1 °C): just above the target.
    double[] air = Scenario.coldestAt0200(-1.15);
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario())
        .hourly(air, Scenario.minus(air, 1.0)).done());
    BundledRules.assertFired(r, "b1").doesNotFire("START-THRESHOLD", "SPRINKLE-START");
    assertThat(r.all(StartThreshold.class)).isEmpty();
  }

  @Test
  void startWhenTheWetBudCrossesTheThresholdBetweenSteps() {
    BundledRules.Run r = frostNight();
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-START").doesNotFire("SPRINKLE-START-AT-ONCE");
    // Wet bud 22:00 -0.5 °C, 23:00 -1.5 °C; threshold -1.2 °C is reached 0.7 / 1.0 of the way,
    // 42 min after 22:00: 22:42, read from the 23:00 step, forecast line 7.
    SprinkleStart s = r.one(SprinkleStart.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(0, 22, 42));
    assertThat(s.atOnce()).isFalse();
    assertThat(s.line()).isEqualTo(7);
    assertThat(r.explanation("SPRINKLE-START", "b1")).contains("22:42", "line 7", "-1.2 °C");
  }

  @Test
  void startRoundsDownToTheMinute() {
    // Wet bud 22:00 -0.45 °C, 23:00 -2.0 °C: (-0.45 + 1.2) / (-0.45 + 2.0) = 0.75 / 1.55 of the
    // hour = 1742 s = 29 min 2 s after 22:00; an early start is the safe side, so 22:29.
    double[] wet = Scenario.with(Scenario.with(Scenario.FROST_WET, 4, 0.55), 5, -1.0);
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).hourly(Scenario.FROST_AIR, wet).done());
    assertThat(r.one(SprinkleStart.class, "b1").at()).isEqualTo(Scenario.at(0, 22, 29));
  }

  @Test
  void noStartWhenTheWetBudBottomsOutJustAboveTheThreshold() {
    // Wet bud never below -1.15 °C (wet bulb -0.15 °C), against a -1.2 °C threshold.
    double[] wet = java.util.Arrays.stream(Scenario.FROST_WET).map(w -> Math.max(w, -0.15)).toArray();
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).hourly(Scenario.FROST_AIR, wet).done());
    BundledRules.assertFired(r, "b1").fires("START-THRESHOLD")
        .doesNotFire("SPRINKLE-START", "SPRINKLE-START-AT-ONCE");
    assertThat(r.all(SprinkleStart.class)).isEmpty();
  }

  @Test
  void atOnceWhenTheFirstStepIsAlreadyAtOrBelow() {
    // 18:00 wet bulb -0.5 °C, wet bud -1.5 °C: below -1.2 °C at the first step, line 2.
    double[] wet = Scenario.with(Scenario.FROST_WET, 0, -0.5);
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).hourly(Scenario.FROST_AIR, wet).done());
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-START-AT-ONCE").doesNotFire("SPRINKLE-START");
    SprinkleStart s = r.one(SprinkleStart.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(0, 18, 0));
    assertThat(s.atOnce()).isTrue();
    assertThat(s.line()).isEqualTo(2);
    assertThat(r.explanation("SPRINKLE-START-AT-ONCE", "b1")).contains("18:00", "line 2", "-1.5 °C", "-1.2 °C");
  }

  @Test
  void notAtOnceWhenTheFirstStepIsJustAbove() {
    // 18:00 wet bud -1.15 °C, 19:00 -2.15 °C: 0.05 / 1.0 of the hour = 3 min, so 18:03 (line 3).
    double[] wet = Scenario.with(Scenario.with(Scenario.FROST_WET, 0, -0.15), 1, -1.15);
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).hourly(Scenario.FROST_AIR, wet).done());
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-START-AT-ONCE").fires("SPRINKLE-START");
    SprinkleStart s = r.one(SprinkleStart.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(0, 18, 3));
    assertThat(s.line()).isEqualTo(3);
  }

  @Test
  void aWindBorneFreezeStillFindsTheRunButPlansNoSprinkling() {
    // The run must be known to judge its wind: the start and stop are found, the plan is not made.
    BundledRules.Run r = windAt0300(4.51, 0);
    BundledRules.assertFired(r, "b1").fires("START-THRESHOLD", "SPRINKLE-START", "SPRINKLE-UNSAFE-WIND")
        .doesNotFire("SPRINKLE-PLAN");
    assertThat(r.one(SprinklingNotAdvised.class, "b1").reason()).isEqualTo(NotAdvisedReason.WIND);
    assertThat(r.all(SprinklePlan.class)).isEmpty();
  }

  @Test
  void overCoversSprinklingIsNotUnsafeInWind() {
    // NC State Extension: in a wind-borne freeze sprinkling "cannot be safely used unless there
    // is a row cover". Covers 1 °C: -5.0 + 1.0 = -4.0 °C, not enough alone.
    BundledRules.Run r = windAt0300(6.0, 1.0);
    BundledRules.assertFired(r, "b1").doesNotFire("SPRINKLE-UNSAFE-WIND")
        .fires("START-THRESHOLD-UNDER-COVERS", "SPRINKLE-START", "SPRINKLE-PLAN");
  }

  @Test
  void underCoversTheThresholdIsLowerByTheCoversProtection() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).covers(1.0, 2)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    BundledRules.assertFired(r, "b1").firesOnce("START-THRESHOLD-UNDER-COVERS")
        .doesNotFire("START-THRESHOLD");
    // -2.2 + 1.0 - 1.0 = -2.2 °C; wet bud 23:00 -1.5, 00:00 -2.5: 0.7 of the hour, 23:42, line 8.
    assertThat(r.one(StartThreshold.class, "b1").thresholdC()).isCloseTo(-2.2, within(1e-9));
    SprinkleStart s = r.one(SprinkleStart.class, "b1");
    assertThat(s.at()).isEqualTo(Scenario.at(0, 23, 42));
    assertThat(s.line()).isEqualTo(8);
    assertThat(r.explanation("START-THRESHOLD-UNDER-COVERS", "b1"))
        .contains("-2.2 °C", "1.0 °C", "UMaine");
  }

  @Test
  void noSprinklingOverCoversThatAreEnoughAlone() {
    // Coldest dry bud -5.0 °C; 3.4 °C of cover keeps it at -1.6 °C, above -2.2 °C with the
    // 0.5 °C cover margin to spare.
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario()).covers(3.4, 2)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    BundledRules.assertFired(r, "b1").fires("COVER-SUFFICIENT")
        .doesNotFire("START-THRESHOLD-UNDER-COVERS", "START-THRESHOLD", "SPRINKLE-START");
  }
}
