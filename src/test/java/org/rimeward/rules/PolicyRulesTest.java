package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.StartMargin;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.TargetBasis;
import org.rimeward.rules.facts.Thresholds;
import org.rimeward.units.UnitSystem;

/**
 * rules/policy: the thresholds every decision reads, set once with their sources, and the start
 * margin. Values: watch band 1.5 °C (forecast minimums miss by 1 to 2 °C; FAO 2005 ch. 4),
 * breezy above 2.2 m/s and windy above 4.5 m/s at 10 m (5 and 10 mph: NC State Extension, Poling
 * 2014; Virginia Tech 2017), clear morning below 30 % cloud (common practice), start margin 0 °C
 * (FAO 2005 Table 7.5), alarm 1.0 °C above the start (FAO 2005 ch. 7), cover margin 0.5 °C,
 * overcast 70 %, half the cover credited in wind or cloud (common practice); the night watch's
 * start-due lead 30 min, colder-than-forecast margin 1.0 °C and stale after 60 min (Rimeward's
 * choices); radiation nights with mean wind at most 2.0 m/s (FAO 2005 ch. 6, "wind less than
 * 2 m/s, no clouds", SEEN-2nd: docs/reference/site-minimum.md), cloud at most 25 %, early cooling
 * at least 2.0 °C, dew-point depression at least 1.0 °C and no gap over 90 min (Rimeward's
 * choices, stated in the same file).
 */
class PolicyRulesTest {
  static BundledRules.Run frost(Scenario s) {
    return BundledRules.run(s.block("b1").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  @Test
  void theThresholdsAreSetOnceWithTheirSources() {
    BundledRules.Run r = frost(new Scenario());
    BundledRules.assertFired(r).firesOnce("THRESHOLDS");
    assertThat(r.all(Thresholds.class)).containsExactly(
        new Thresholds(1.5, 2.2, 4.5, 30.0, 0.0, 1.0, 0.5, 70.0, 0.5, 30, 1.0, 60,
            2.0, 25.0, 2.0, 1.0, 90));
    assertThat(r.firing("THRESHOLDS").explanation()).contains("1.5 °C", "2.2 m/s", "4.5 m/s",
        "30 %", "0.0 °C", "1.0 °C", "0.5 °C", "70 %", "FAO 2005", "Poling 2014", "Virginia Tech",
        "common practice", "start-due 30 min ahead", "stale after 60 min", "at most 2.0 m/s",
        "at most 25 %", "no gap over 90 min", "Rimeward's choices");
  }

  @Test
  void theThresholdsShowInTheUsersUnits() {
    FiredRule f = frost(new Scenario()).firing("THRESHOLDS");
    // Differences: 1.5 °C is 2.7 °F, 1.0 °C is 1.8 °F; winds 5 and 10 mph.
    assertThat(Explanations.render(f.template(), f.values(), UnitSystem.US, Scenario.ZONE))
        .contains("2.7 °F", "1.8 °F", "4.9 mph", "10.1 mph").doesNotContain("°C", "m/s");
  }

  @Test
  void thresholdsGivenByATestAreNotSetAgain() {
    Thresholds own = new Thresholds(2.0, 2.0, 5.0, 20.0, 0.5, 1.5, 0.3, 80.0, 0.6, 20, 1.5, 45,
        3.0, 30.0, 1.5, 0.5, 60);
    BundledRules.Run r = frost(new Scenario().fact(own));
    BundledRules.assertFired(r).doesNotFire("THRESHOLDS");
    assertThat(r.all(Thresholds.class)).containsExactly(own);
  }

  @Test
  void theRulesDefaultStartMarginWhenTheFarmSetsNone() {
    BundledRules.Run r = frost(new Scenario().policy(
        new PolicyFact(TargetBasis.T10, Double.NaN, Double.NaN, StopBasis.WET_BULB_ABOVE_FREEZING)));
    BundledRules.assertFired(r).firesOnce("START-MARGIN-DEFAULT").doesNotFire("START-MARGIN-FARM");
    assertThat(r.all(StartMargin.class)).containsExactly(new StartMargin(0.0, false));
    assertThat(r.firing("START-MARGIN-DEFAULT").explanation()).contains("0.0 °C", "Table 7.5");
  }

  @Test
  void theFarmsOwnStartMarginEvenAtZero() {
    BundledRules.Run r = frost(new Scenario().policy(
        new PolicyFact(TargetBasis.T10, Double.NaN, 0.0, StopBasis.WET_BULB_ABOVE_FREEZING)));
    BundledRules.assertFired(r).firesOnce("START-MARGIN-FARM").doesNotFire("START-MARGIN-DEFAULT");
    assertThat(r.all(StartMargin.class)).containsExactly(new StartMargin(0.0, true));
  }

  @Test
  void theFarmMarginDoesNotFireWithoutOne() {
    BundledRules.Run r = frost(new Scenario().policy(
        new PolicyFact(TargetBasis.T10, Double.NaN, Double.NaN, StopBasis.WET_BULB_ABOVE_FREEZING)));
    BundledRules.assertFired(r).doesNotFire("START-MARGIN-FARM");
  }
}
