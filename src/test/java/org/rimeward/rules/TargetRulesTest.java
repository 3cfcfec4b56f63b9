package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.Target;
import org.rimeward.rules.facts.TargetBasis;

/** rules/risk/target.drl: the temperature each block is protected to. */
class TargetRulesTest {
  // The fixture's block is apple at full bloom, T10 28 °F (-2.2 °C), T90 25 °F (-3.9 °C): the
  // published critical-temperature tables of Penn State, Utah State and Michigan State Extension.
  static final double[] WARM = Scenario.fill(16, 5.0);

  static PolicyFact fixed(double c) {
    return new PolicyFact(TargetBasis.FIXED, c, 1.0, StopBasis.WET_BULB_ABOVE_FREEZING);
  }

  @Test
  void t10BasisTakesTheStagesTenPercentKillTemperature() {
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").hourly(WARM, WARM).done());
    BundledRules.assertFired(r, "b1").fires("TARGET-T10").doesNotFire("TARGET-FIXED");
    assertThat(r.one(Target.class, "b1")).isEqualTo(new Target("b1", -2.2, TargetBasis.T10));
    assertThat(r.explanation("TARGET-T10", "b1"))
        .contains("-2.2 °C", "apple", "full bloom", "test table");
  }

  @Test
  void t10DoesNotFireUnderAFixedTarget() {
    BundledRules.Run r = BundledRules.run(new Scenario().policy(fixed(-2.0))
        .block("b1").hourly(WARM, WARM).done());
    BundledRules.assertFired(r, "b1").doesNotFire("TARGET-T10");
  }

  @Test
  void fixedBasisTakesTheFarmsTargetAndStillNamesT10() {
    BundledRules.Run r = BundledRules.run(new Scenario().policy(fixed(-2.0))
        .block("b1").hourly(WARM, WARM).done());
    BundledRules.assertFired(r, "b1").firesOnce("TARGET-FIXED");
    assertThat(r.one(Target.class, "b1")).isEqualTo(new Target("b1", -2.0, TargetBasis.FIXED));
    assertThat(r.explanation("TARGET-FIXED", "b1")).contains("-2.0 °C", "-2.2 °C", "full bloom");
  }

  @Test
  void fixedDoesNotFireUnderT10() {
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").hourly(WARM, WARM).done());
    BundledRules.assertFired(r, "b1").doesNotFire("TARGET-FIXED");
  }

  @Test
  void everyBlockGetsExactlyOneTarget() {
    BundledRules.Run r = BundledRules.run(new Scenario()
        .block("b1").hourly(WARM, WARM).done()
        .block("b2").thresholds(-3.0, -6.0).hourly(WARM, WARM).done());
    assertThat(r.one(Target.class, "b1").targetC()).isEqualTo(-2.2);
    assertThat(r.one(Target.class, "b2").targetC()).isEqualTo(-3.0);
  }
}
