package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.NearMiss;
import org.rimeward.rules.facts.NeedsProtection;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.Risk;
import org.rimeward.rules.facts.RiskLevel;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.TargetBasis;

/**
 * rules/risk/risk.drl: the risk band from the coldest dry bud against T10, T90 and the target.
 * The depression is 0 here, so the coldest dry bud is exactly the coldest air the test gives (at
 * 02:00, forecast line 10). Block: T10 -2.2 °C, T90 -3.9 °C, target T10.
 */
class RiskRulesTest {
  static Scenario night(double minDryBudC, double killPct) {
    double[] air = Scenario.coldestAt0200(minDryBudC);
    return new Scenario().block("b1").depression(0).kill(killPct)
        .hourly(air, Scenario.minus(air, 1.0)).done();
  }

  static Risk risk(BundledRules.Run r) {
    return r.one(Risk.class, "b1");
  }

  @Test
  void severeAtT90() {
    BundledRules.Run r = BundledRules.run(night(-3.9, 90));
    BundledRules.assertFired(r, "b1").fires("RISK-SEVERE")
        .doesNotFire("RISK-DAMAGE", "RISK-WATCH", "RISK-NONE");
    assertThat(risk(r)).isEqualTo(new Risk("b1", RiskLevel.SEVERE, -3.9, 90));
    assertThat(r.explanation("RISK-SEVERE", "b1"))
        .contains("-3.9 °C", "02:00", "line 10", "90 %", "-2.2 °C");
  }

  @Test
  void notSevereJustAboveT90() {
    BundledRules.Run r = BundledRules.run(night(-3.85, 85));
    BundledRules.assertFired(r, "b1").doesNotFire("RISK-SEVERE").fires("RISK-DAMAGE");
  }

  @Test
  void damageAtT10() {
    BundledRules.Run r = BundledRules.run(night(-2.2, 10));
    BundledRules.assertFired(r, "b1").fires("RISK-DAMAGE").doesNotFire("RISK-SEVERE", "RISK-WATCH");
    assertThat(risk(r)).isEqualTo(new Risk("b1", RiskLevel.DAMAGE, -2.2, 10));
    assertThat(r.explanation("RISK-DAMAGE", "b1")).contains("-2.2 °C", "-3.9 °C", "02:00", "10 %");
  }

  @Test
  void noDamageJustAboveT10() {
    BundledRules.Run r = BundledRules.run(night(-2.15, 8));
    BundledRules.assertFired(r, "b1").doesNotFire("RISK-DAMAGE").fires("RISK-WATCH");
  }

  // Watch band: 1.5 °C above the target (rules/policy/thresholds.drl: forecast minimums commonly
  // miss by 1 to 2 °C; FAO 2005 ch. 4 on spatial spread). The band's edges are tested 0.05 °C
  // inside and outside, as -2.2 + 1.5 is not exactly -0.7 in binary.
  @Test
  void watchJustInsideTheBand() {
    BundledRules.Run r = BundledRules.run(night(-0.75, 1));
    BundledRules.assertFired(r, "b1").fires("RISK-WATCH").doesNotFire("RISK-NONE", "RISK-DAMAGE");
    assertThat(risk(r)).isEqualTo(new Risk("b1", RiskLevel.WATCH, -0.75, 1));
    assertThat(r.explanation("RISK-WATCH", "b1")).contains("-0.8 °C", "-2.2 °C", "1.5 °C", "02:00");
  }

  @Test
  void noWatchJustOutsideTheBand() {
    BundledRules.Run r = BundledRules.run(night(-0.65, 0));
    BundledRules.assertFired(r, "b1").doesNotFire("RISK-WATCH");
  }

  @Test
  void noneJustOutsideTheBand() {
    BundledRules.Run r = BundledRules.run(night(-0.65, 0));
    BundledRules.assertFired(r, "b1").fires("RISK-NONE");
    assertThat(risk(r).level()).isEqualTo(RiskLevel.NONE);
    // -0.65 °C shows as -0.7 °C: one decimal, half away from zero.
    assertThat(r.explanation("RISK-NONE", "b1")).contains("-0.7 °C", "-2.2 °C", "1.5 °C");
  }

  @Test
  void noneDoesNotFireInsideTheBand() {
    BundledRules.Run r = BundledRules.run(night(-0.75, 1));
    BundledRules.assertFired(r, "b1").doesNotFire("RISK-NONE");
  }

  @Test
  void theWatchBandIsShownInTheUsersUnits() {
    // A band is a temperature difference: 1.5 °C is 2.7 °F, not 34.7 °F.
    FiredRule f = BundledRules.run(night(-0.75, 1)).firing("RISK-WATCH", "b1");
    assertThat(Explanations.render(f.template(), f.values(), org.rimeward.units.UnitSystem.US,
        Scenario.ZONE)).contains("2.7 °F").doesNotContain("34.7");
  }

  @Test
  void nearMissJustAboveTheTarget() {
    BundledRules.Run r = BundledRules.run(night(-2.15, 8));
    BundledRules.assertFired(r, "b1").firesOnce("NEAR-MISS").doesNotFire("NEEDS-PROTECTION");
    NearMiss m = r.one(NearMiss.class, "b1");
    assertThat(m.minDryBudC()).isEqualTo(-2.15);
    assertThat(m.marginC()).isCloseTo(0.05, org.assertj.core.api.Assertions.within(1e-9));
    assertThat(r.explanation("NEAR-MISS", "b1")).contains("-2.2 °C", "0.1 °C", "1.5 °C");
  }

  @Test
  void noNearMissAtTheTargetNorBeyondTheBand() {
    BundledRules.assertFired(BundledRules.run(night(-2.2, 10)), "b1").doesNotFire("NEAR-MISS");
    BundledRules.assertFired(BundledRules.run(night(-0.65, 0)), "b1").doesNotFire("NEAR-MISS");
    BundledRules.assertFired(BundledRules.run(night(-0.75, 0)), "b1").fires("NEAR-MISS");
  }

  @Test
  void exactlyOneRiskBandPerBlockAcrossTheRange() {
    for (double m = -6.0; m <= 3.0; m += 0.25) {
      BundledRules.Run r = BundledRules.run(night(m, 0));
      assertThat(r.about(Risk.class, "b1")).as("coldest bud %s", m).hasSize(1);
    }
  }

  @Test
  void needsProtectionWhenTheColdestBudReachesTheTarget() {
    BundledRules.Run r = BundledRules.run(night(-2.2, 10));
    BundledRules.assertFired(r, "b1").firesOnce("NEEDS-PROTECTION");
    assertThat(r.one(NeedsProtection.class, "b1")).isEqualTo(new NeedsProtection("b1", -2.2, -2.2));
    assertThat(r.explanation("NEEDS-PROTECTION", "b1")).contains("-2.2 °C");
  }

  @Test
  void noProtectionNeededJustAboveTheTarget() {
    BundledRules.Run r = BundledRules.run(night(-2.15, 8));
    BundledRules.assertFired(r, "b1").doesNotFire("NEEDS-PROTECTION");
    assertThat(r.all(NeedsProtection.class)).isEmpty();
  }

  @Test
  void needsProtectionFollowsAFixedTargetWarmerThanT10() {
    // Fixed target -1.0 °C: a coldest bud of -1.0 °C needs protection though it is 1.2 °C above T10.
    PolicyFact fixed = new PolicyFact(TargetBasis.FIXED, -1.0, 1.0, StopBasis.WET_BULB_ABOVE_FREEZING);
    double[] air = Scenario.coldestAt0200(-1.0);
    BundledRules.Run r = BundledRules.run(new Scenario().policy(fixed).block("b1").depression(0)
        .hourly(air, Scenario.minus(air, 1.0)).done());
    assertThat(r.one(NeedsProtection.class, "b1").targetC()).isEqualTo(-1.0);
    assertThat(risk(r).level()).isEqualTo(RiskLevel.WATCH);
  }
}
