package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.CoverPlan;

/**
 * rules/covers/covers.drl. A covered block without sprinklers, depression 0 (dry bud = air),
 * target T10 -2.2 °C, margin 1 °C, 2.0 °C of cover, a 2 h crew. Sunset 19:40, sunrise 06:30.
 * Covers on by sunset (UMaine Highmoor guidance: cover in the afternoon before the freeze).
 */
class CoverRulesTest {
  /** Coldest air {@code minC} at 04:00 and 05:00; -1.5 °C at 07:00, +1.5 °C at 08:00. */
  static double[] air(double minC) {
    return new double[] {6, 5, 4, 3, 2, 1, 0, -1, -2, -3, minC, minC, -3, -1.5, 1.5, 4};
  }

  static BundledRules.Run covered(double minC, double coverC) {
    double[] a = air(minC);
    return BundledRules.run(new Scenario().block("b1").covers(coverC, 2).depression(0)
        .hourly(a, Scenario.minus(a, 1.0)).done());
  }

  @Test
  void sufficientWhenCoveredBudStaysAboveTheTarget() {
    // -4.0 + 2.0 = -2.0 °C under the covers, above -2.2 °C.
    BundledRules.Run r = covered(-4.0, 2.0);
    assertThat(r.firedFor("b1")).containsOnlyOnce("COVER-SUFFICIENT").doesNotContain("COVER-INSUFFICIENT");
    CoverPlan c = r.one(CoverPlan.class, "b1");
    assertThat(c.sufficient()).isTrue();
    assertThat(c.coveredMinBudC()).isEqualTo(-2.0);
    // Deploy: sunset 19:40 less the crew's 2 h = 17:40.
    assertThat(c.deployStart()).isEqualTo(Scenario.at(0, 17, 40));
    assertThat(c.deployBy()).isEqualTo(Scenario.SUNSET);
    // Off once the air stays at or above max(-2.2 + 1.0, 0) = 0 °C after sunrise: between 07:00
    // (-1.5) and 08:00 (+1.5), 1.5 / 3.0 of the hour = 30 min, so 07:30.
    assertThat(c.removeAtC()).isEqualTo(0.0);
    assertThat(c.remove()).isEqualTo(Scenario.at(1, 7, 30));
    assertThat(r.explanation("COVER-SUFFICIENT", "b1"))
        .contains("-2.0 °C", "-4.0 °C", "2.0 °C", "-2.2 °C", "17:40", "19:40", "07:30", "0.0 °C",
            "test cover");
  }

  @Test
  void notSufficientWhenCoveredBudOnlyReachesTheTarget() {
    // -4.25 + 2.0 = -2.25 °C: not above -2.2 °C.
    BundledRules.Run r = covered(-4.25, 2.0);
    assertThat(r.firedFor("b1")).doesNotContain("COVER-SUFFICIENT");
  }

  @Test
  void insufficientCoversStillGoOn() {
    BundledRules.Run r = covered(-4.25, 2.0);
    assertThat(r.firedFor("b1")).containsOnlyOnce("COVER-INSUFFICIENT");
    CoverPlan c = r.one(CoverPlan.class, "b1");
    assertThat(c.sufficient()).isFalse();
    assertThat(c.coveredMinBudC()).isEqualTo(-2.25);
    assertThat(c.remove()).isEqualTo(Scenario.at(1, 7, 30));
    assertThat(r.explanation("COVER-INSUFFICIENT", "b1"))
        .contains("-2.3 °C", "-4.3 °C", "2.0 °C", "-2.2 °C", "17:40", "07:30");
  }

  @Test
  void notInsufficientJustAboveTheTarget() {
    // -4.15 + 2.0 = -2.15 °C, above -2.2 °C.
    BundledRules.Run r = covered(-4.15, 2.0);
    assertThat(r.firedFor("b1")).doesNotContain("COVER-INSUFFICIENT").contains("COVER-SUFFICIENT");
  }

  @Test
  void noCoverPlanWhenNoProtectionIsNeeded() {
    double[] a = Scenario.coldestAt0200(-2.15);
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").covers(2.0, 2).depression(0)
        .hourly(a, Scenario.minus(a, 1.0)).done());
    assertThat(r.firedFor("b1")).doesNotContain("COVER-SUFFICIENT", "COVER-INSUFFICIENT");
    assertThat(r.all(CoverPlan.class)).isEmpty();
  }

  @Test
  void coversComeOffNoEarlierThanSunriseThoughTheAirIsWarmBefore() {
    // Air above 0 °C from 05:00 on: off at sunrise, 06:30, not before and not at the next step.
    double[] a = {6, 5, 4, 3, 2, 1, 0, -1, -4, -3, -1, 1, 2, 3, 4, 5};
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").covers(2.0, 2).depression(0)
        .hourly(a, Scenario.minus(a, 1.0)).done());
    assertThat(r.one(CoverPlan.class, "b1").remove()).isEqualTo(Scenario.SUNRISE);
  }

  static BundledRules.Run coveredAndSprinkled(double minC) {
    double[] a = air(minC);
    return BundledRules.run(new Scenario().source("pond", 500, Double.NaN).block("b1")
        .covers(2.0, 2).sprinklers(3.8, "pond").depression(0).hourly(a, Scenario.minus(a, 1.0)).done());
  }

  @Test
  void coversStayOnUntilSprinklingOverThemStops() {
    // Not enough alone (-4.25 + 2.0 = -2.25 °C), so sprinkling runs over the covers. The air lets
    // them off at 07:30; the wet bulb (air - 1) reaches 0 °C between 07:00 (-2.5) and 08:00 (+0.5)
    // at 2.5 / 3.0 of the hour, 07:50, when sprinkling stops: the covers stay on until then.
    BundledRules.Run r = coveredAndSprinkled(-4.25);
    assertThat(r.firedFor("b1")).containsOnlyOnce("COVER-OFF-AFTER-SPRINKLING");
    assertThat(r.one(org.rimeward.rules.facts.CoverRemovalDelayed.class, "b1").remove())
        .isEqualTo(Scenario.at(1, 7, 50));
    assertThat(r.explanation("COVER-OFF-AFTER-SPRINKLING", "b1")).contains("07:50", "07:30");
  }

  @Test
  void coversAloneComeOffOnTheirOwnTime() {
    // Enough alone (-4.0 + 2.0 = -2.0 °C): no sprinkling, so nothing delays the removal.
    BundledRules.Run r = coveredAndSprinkled(-4.0);
    assertThat(r.firedFor("b1")).doesNotContain("COVER-OFF-AFTER-SPRINKLING", "SPRINKLE-PLAN");
  }
}
