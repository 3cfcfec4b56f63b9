package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.CoverPlan;

/**
 * rules/covers/covers.drl. A covered block without sprinklers, depression 0 (dry bud = air),
 * target T10 -2.2 °C, start margin 1 °C, 2.0 °C of cover, a 2 h crew. Sunset 19:40, sunrise
 * 06:30. Covers on by sunset (UMaine Highmoor guidance: cover in the afternoon before the freeze).
 * Thresholds of rules/policy/thresholds.drl: covers alone only with 0.5 °C to spare (common
 * practice); half the published protection credited when the coldest hour is above 2.2 m/s at
 * 10 m or at 70 % cloud or more (common practice; the published figures are radiation-night ones).
 */
class CoverRulesTest {
  /** Coldest air {@code minC} at 04:00 and 05:00; -1.5 °C at 07:00, +1.5 °C at 08:00. */
  static double[] air(double minC) {
    return new double[] {6, 5, 4, 3, 2, 1, 0, -1, -2, -3, minC, minC, -3, -1.5, 1.5, 4};
  }

  static BundledRules.Run covered(double minC, double coverC) {
    return covered(minC, coverC, 1.0, 0.0);
  }

  /** As {@link #covered(double, double)}, with the wind at 10 m and the cloud of every hour. */
  static BundledRules.Run covered(double minC, double coverC, double windMs, double cloudPct) {
    double[] a = air(minC);
    return BundledRules.run(new Scenario().block("b1").covers(coverC, 2).depression(0)
        .wind(Scenario.fill(16, windMs)).cloud(Scenario.fill(16, cloudPct))
        .hourly(a, Scenario.minus(a, 1.0)).done());
  }

  @Test
  void sufficientWhenCoveredBudStaysAboveTheTargetByTheMargin() {
    // -3.5 + 2.0 = -1.5 °C under the covers, above -2.2 + 0.5 = -1.7 °C.
    BundledRules.Run r = covered(-3.5, 2.0);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-SUFFICIENT").doesNotFire("COVER-INSUFFICIENT");
    CoverPlan c = r.one(CoverPlan.class, "b1");
    assertThat(c.sufficient()).isTrue();
    assertThat(c.coveredMinBudC()).isEqualTo(-1.5);
    // Deploy: sunset 19:40 less the crew's 2 h = 17:40.
    assertThat(c.deployStart()).isEqualTo(Scenario.at(0, 17, 40));
    assertThat(c.deployBy()).isEqualTo(Scenario.SUNSET);
    // Off once the air stays at or above max(-2.2 + 1.0, 0) = 0 °C after sunrise: between 07:00
    // (-1.5) and 08:00 (+1.5), 1.5 / 3.0 of the hour = 30 min, so 07:30.
    assertThat(c.removeAtC()).isEqualTo(0.0);
    assertThat(c.remove()).isEqualTo(Scenario.at(1, 7, 30));
    assertThat(r.explanation("COVER-SUFFICIENT", "b1"))
        .contains("-1.5 °C", "-3.5 °C", "2.0 °C", "-2.2 °C", "0.5 °C", "17:40", "19:40", "07:30",
            "0.0 °C");
  }

  @Test
  void notSufficientOnAMarginOfHundredths() {
    // -4.15 + 2.0 = -2.15 °C: 0.05 °C above the target is no "covers alone will do".
    BundledRules.Run r = covered(-4.15, 2.0);
    BundledRules.assertFired(r, "b1").doesNotFire("COVER-SUFFICIENT").firesOnce("COVER-INSUFFICIENT");
    // -2.15 shows as -2.2 °C (one decimal, half away from zero).
    assertThat(r.explanation("COVER-INSUFFICIENT", "b1")).contains("-4.2 °C", "2.0 °C", "-2.2 °C", "0.5 °C");
  }

  @Test
  void notSufficientJustInsideTheMargin() {
    // -3.75 + 2.0 = -1.75 °C against -1.7 °C; -3.65 gives -1.65 °C, sufficient.
    BundledRules.assertFired(covered(-3.75, 2.0), "b1").doesNotFire("COVER-SUFFICIENT");
    BundledRules.assertFired(covered(-3.65, 2.0), "b1").fires("COVER-SUFFICIENT");
  }

  @Test
  void insufficientCoversStillGoOn() {
    BundledRules.Run r = covered(-4.25, 2.0);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-INSUFFICIENT");
    CoverPlan c = r.one(CoverPlan.class, "b1");
    assertThat(c.sufficient()).isFalse();
    assertThat(c.coveredMinBudC()).isEqualTo(-2.25);
    assertThat(c.remove()).isEqualTo(Scenario.at(1, 7, 30));
    assertThat(r.explanation("COVER-INSUFFICIENT", "b1"))
        .contains("-2.3 °C", "-4.3 °C", "2.0 °C", "-2.2 °C", "17:40", "07:30");
  }

  @Test
  void notInsufficientWithTheMarginToSpare() {
    BundledRules.Run r = covered(-3.6, 2.0);
    BundledRules.assertFired(r, "b1").doesNotFire("COVER-INSUFFICIENT").fires("COVER-SUFFICIENT");
  }

  static BundledRules.Run coldestAt0200(double minC) {
    double[] a = Scenario.coldestAt0200(minC);
    return BundledRules.run(new Scenario().block("b1").covers(2.0, 2).depression(0)
        .hourly(a, Scenario.minus(a, 1.0)).done());
  }

  @Test
  void noCoverPlanBeyondTheWatchBand() {
    // -0.65 °C is more than the 1.5 °C watch band above the -2.2 °C target.
    BundledRules.Run r = coldestAt0200(-0.65);
    BundledRules.assertFired(r, "b1").doesNotFire("COVER-SUFFICIENT", "COVER-INSUFFICIENT", "COVER-NEAR-MISS",
        "COVER-CREDIT-FULL", "COVER-CREDIT-REDUCED");
    assertThat(r.all(CoverPlan.class)).isEmpty();
  }

  @Test
  void aNearMissIsCoveredBecauseSunsetComesBeforeTheOutcomeIsKnown() {
    // -2.1 °C: 0.1 °C above the target, inside the watch band. Covers go on by sunset.
    BundledRules.Run r = coldestAt0200(-2.1);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-NEAR-MISS")
        .doesNotFire("COVER-SUFFICIENT", "COVER-INSUFFICIENT");
    CoverPlan c = r.one(CoverPlan.class, "b1");
    assertThat(c.deployStart()).isEqualTo(Scenario.at(0, 17, 40));
    assertThat(c.deployBy()).isEqualTo(Scenario.SUNSET);
    assertThat(r.explanation("COVER-NEAR-MISS", "b1")).contains("-2.1 °C", "-2.2 °C", "19:40", "17:40");
  }

  @Test
  void noNearMissCoverWhenProtectionIsNeeded() {
    BundledRules.Run r = coldestAt0200(-2.2);
    BundledRules.assertFired(r, "b1").doesNotFire("COVER-NEAR-MISS").fires("COVER-SUFFICIENT");
  }

  @Test
  void fullCreditOnACalmClearNight() {
    BundledRules.Run r = covered(-3.5, 2.0, 2.2, 69.9);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-CREDIT-FULL").doesNotFire("COVER-CREDIT-REDUCED");
    assertThat(r.one(org.rimeward.rules.facts.CoverCredit.class, "b1").protectionC()).isEqualTo(2.0);
    assertThat(r.explanation("COVER-CREDIT-FULL", "b1")).contains("2.0 °C", "2.2 m/s", "70 %", "04:00");
  }

  @Test
  void halfCreditWhenBreezyAtTheColdestHour() {
    // 2.21 m/s at 10 m: just above 5 mph. 1.0 °C credited; -3.5 + 1.0 = -2.5 °C, not enough.
    BundledRules.Run r = covered(-3.5, 2.0, 2.21, 0);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-CREDIT-REDUCED")
        .doesNotFire("COVER-CREDIT-FULL", "COVER-SUFFICIENT").fires("COVER-INSUFFICIENT");
    assertThat(r.one(org.rimeward.rules.facts.CoverCredit.class, "b1").protectionC()).isEqualTo(1.0);
    assertThat(r.one(CoverPlan.class, "b1").coveredMinBudC()).isEqualTo(-2.5);
    assertThat(r.explanation("COVER-CREDIT-REDUCED", "b1")).contains("1.0 °C", "0.5", "2.0 °C", "common practice");
  }

  @Test
  void halfCreditWhenOvercastAtTheColdestHour() {
    BundledRules.Run r = covered(-3.5, 2.0, 1.0, 70);
    BundledRules.assertFired(r, "b1").firesOnce("COVER-CREDIT-REDUCED").doesNotFire("COVER-CREDIT-FULL");
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
    BundledRules.assertFired(r, "b1").firesOnce("COVER-OFF-AFTER-SPRINKLING");
    assertThat(r.one(org.rimeward.rules.facts.CoverRemovalDelayed.class, "b1").remove())
        .isEqualTo(Scenario.at(1, 7, 50));
    assertThat(r.explanation("COVER-OFF-AFTER-SPRINKLING", "b1")).contains("07:50", "07:30");
  }

  @Test
  void coversAloneComeOffOnTheirOwnTime() {
    // Enough alone (-3.5 + 2.0 = -1.5 °C): no sprinkling, so nothing delays the removal.
    BundledRules.Run r = coveredAndSprinkled(-3.5);
    BundledRules.assertFired(r, "b1").doesNotFire("COVER-OFF-AFTER-SPRINKLING", "SPRINKLE-PLAN");
  }
}
