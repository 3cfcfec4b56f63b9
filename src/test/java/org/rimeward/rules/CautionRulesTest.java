package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.function.UnaryOperator;
import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.BlockStatus;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.Status;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.TargetBasis;

/** rules/cautions/cautions.drl: what the manager should know; they decide nothing. */
class CautionRulesTest {
  static PolicyFact fixed(double c) {
    return new PolicyFact(TargetBasis.FIXED, c, 1.0, StopBasis.WET_BULB_ABOVE_FREEZING);
  }

  /** One block, coldest dry bud exactly {@code minC} at 02:00 (depression 0). */
  static BundledRules.Run coldest(Scenario s, double minC, UnaryOperator<Scenario.BlockBuilder> setUp) {
    double[] air = Scenario.coldestAt0200(minC);
    setUp.apply(s.block("b1").depression(0).kill(40)).hourly(air, Scenario.minus(air, 1.0)).done();
    return BundledRules.run(s);
  }

  static BundledRules.Run frost(UnaryOperator<Scenario.BlockBuilder> setUp) {
    Scenario s = new Scenario().source("pond", 500, 5000);
    setUp.apply(s.block("b1").kill(40)).hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    return BundledRules.run(s);
  }

  static double[] windAt0300(double ms) {
    return Scenario.with(Scenario.fill(16, 1.0), 9, ms);
  }

  // Watch band 1.5 °C above the target (rules/policy/thresholds.drl).
  @Test
  void watchWhenWithinTheBand() {
    BundledRules.Run r = coldest(new Scenario(), -1.0, b -> b);
    FiredRule f = r.firing("CAUTION-WATCH", "b1");
    assertThat(f.isCaution()).isTrue();
    assertThat(f.explanation()).contains("b1", "-1.0 °C", "-2.2 °C", "1.5 °C", "miss by that much");
  }

  @Test
  void noWatchOutsideTheBand() {
    BundledRules.Run r = coldest(new Scenario(), -0.65, b -> b);
    BundledRules.assertFired(r).doesNotFire("CAUTION-WATCH");
  }

  @Test
  void noWatchWhenProtectionIsNeeded() {
    // Fixed target -1.0 °C, warmer than T10 -2.2 °C: a coldest bud of -1.5 °C is in the watch
    // band of the kill tables but needs protection by the farm's target, and covers protect it.
    BundledRules.Run r = coldest(new Scenario().policy(fixed(-1.0)), -1.5, b -> b.covers(2.6, 2));
    assertThat(r.one(BlockStatus.class, "b1").status()).isEqualTo(Status.PROTECTED);
    BundledRules.assertFired(r).doesNotFire("CAUTION-WATCH");
  }

  @Test
  void startAtOnceWhenTheFirstStepIsAlreadyBelow() {
    double[] wet = Scenario.with(Scenario.FROST_WET, 0, -0.5);
    Scenario s = new Scenario().source("pond", 500, 5000);
    s.block("b1").sprinklers(3.8, "pond").hourly(Scenario.FROST_AIR, wet).done();
    BundledRules.Run r = BundledRules.run(s);
    assertThat(r.explanation("CAUTION-START-AT-ONCE", "b1")).contains("b1", "running now");
  }

  @Test
  void noStartAtOnceWhenTheFirstStepIsJustAbove() {
    // Wet bud at 18:00 -1.15 °C, the threshold -1.2 °C.
    double[] wet = Scenario.with(Scenario.with(Scenario.FROST_WET, 0, -0.15), 1, -1.15);
    Scenario s = new Scenario().source("pond", 500, 5000);
    s.block("b1").sprinklers(3.8, "pond").hourly(Scenario.FROST_AIR, wet).done();
    BundledRules.assertFired(BundledRules.run(s)).doesNotFire("CAUTION-START-AT-ONCE");
  }

  @Test
  void rateShortNamesBothRates() {
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 9, 4.5);
    BundledRules.Run r = frost(b -> b.sprinklers(3.8, "pond").rate(rate));
    assertThat(r.explanation("CAUTION-RATE-SHORT", "b1")).contains("3.80 mm/h", "4.50 mm/h", "milky",
        "not advised", "40 %");
  }

  @Test
  void noRateShortCautionAtEquality() {
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 9, 3.8);
    BundledRules.assertFired(frost(b -> b.sprinklers(3.8, "pond").rate(rate))).doesNotFire("CAUTION-RATE-SHORT");
  }

  @Test
  void windNotAdvisedSaysSoAmongTheCautions() {
    BundledRules.Run r = frost(b -> b.sprinklers(3.8, "pond").wind(windAt0300(4.51)));
    assertThat(r.explanation("CAUTION-WIND-NOT-ADVISED", "b1")).contains("b1", "4.5 m/s", "03:00",
        "2.00 mm/h", "3.80 mm/h", "40 %");
  }

  @Test
  void noWindNotAdvisedCautionAt10Mph() {
    BundledRules.assertFired(frost(b -> b.sprinklers(3.8, "pond").wind(windAt0300(4.5))))
        .doesNotFire("CAUTION-WIND-NOT-ADVISED");
  }

  @Test
  void breezyOnASprinkledBlock() {
    BundledRules.Run r = frost(b -> b.sprinklers(3.8, "pond").wind(windAt0300(3.0)));
    assertThat(r.explanation("CAUTION-BREEZY", "b1")).contains("b1", "3.0 m/s", "2.2 m/s", "03:00");
  }

  @Test
  void noBreezyCautionAt5Mph() {
    // 2.2 m/s is not above the 5 mph band edge (NC State Extension, Poling 2014).
    BundledRules.assertFired(frost(b -> b.sprinklers(3.8, "pond").wind(windAt0300(2.2))))
        .doesNotFire("CAUTION-BREEZY");
  }

  @Test
  void noBreezyCautionWhereSprinklingIsNotAdvised() {
    // 1.0 mm/h is far short of the need on this night: sprinkling is not advised, so nothing
    // "runs" for the breeze to speed up; the not-advised words say what matters instead.
    BundledRules.Run r = frost(b -> b.sprinklers(1.0, "pond").wind(windAt0300(3.0)));
    BundledRules.assertFired(r).fires("CAUTION-RATE-SHORT").doesNotFire("CAUTION-BREEZY");
  }

  /** The frost night's coldest hour is 05:00 (step 11). */
  static double[] windAt0500(double ms) {
    return Scenario.with(Scenario.fill(16, 1.0), 11, ms);
  }

  @Test
  void windyOnACoveredBlock() {
    // Covers 2.0 °C on a coldest bud of -5.0 °C; wind 4.51 m/s at 10 m at 05:00, the coldest hour.
    BundledRules.Run r = frost(b -> b.covers(2.0, 2).wind(windAt0500(4.51)));
    assertThat(r.explanation("CAUTION-WINDY-COVERS", "b1")).contains("b1", "4.5 m/s", "05:00", "anchored");
  }

  @Test
  void noWindyCoversCautionAt10Mph() {
    BundledRules.assertFired(frost(b -> b.covers(2.0, 2).wind(windAt0500(4.5)))).doesNotFire("CAUTION-WINDY-COVERS");
  }

  /** A covered block (2 °C of cover) on a -4 °C night with the given cloud per hour. */
  static BundledRules.Run coveredUnder(double[] cloud) {
    return coldest(new Scenario(), -4.0, b -> b.covers(2.0, 2).cloud(cloud));
  }

  @Test
  void sunOnCoversWhenTheMorningClears() {
    // Cloud 100 % all night, 29 % at 08:00: below 30 % after sunrise (06:30).
    BundledRules.Run r = coveredUnder(Scenario.with(Scenario.fill(16, 100), 14, 29));
    assertThat(r.explanation("CAUTION-COVER-SUN", "b1")).contains("b1", "29 %", "0.0 °C");
  }

  @Test
  void noSunCautionAtThirtyPercent() {
    BundledRules.assertFired(coveredUnder(Scenario.with(Scenario.fill(16, 100), 14, 30)))
        .doesNotFire("CAUTION-COVER-SUN");
  }

  @Test
  void aClearSkyBeforeSunriseIsNotTheMorningSun() {
    // 0 % at 05:00, before sunrise; 100 % from 06:00 on.
    BundledRules.assertFired(coveredUnder(Scenario.with(Scenario.fill(16, 100), 11, 0)))
        .doesNotFire("CAUTION-COVER-SUN");
  }

  @Test
  void pollinatorsWhenCoversGoOnInBloom() {
    BundledRules.Run r = coveredUnder(Scenario.fill(16, 100));
    assertThat(r.explanation("CAUTION-COVER-POLLINATORS", "b1")).contains("b1", "full bloom");
  }

  @Test
  void noPollinatorCautionBeforeBloom() {
    BundledRules.Run r = coldest(new Scenario(), -3.5, b -> b.covers(2.0, 2).stage("tight-cluster", false));
    BundledRules.assertFired(r).fires("COVER-SUFFICIENT").doesNotFire("CAUTION-COVER-POLLINATORS");
  }

  @Test
  void unprotectedNamesTheExpectedKill() {
    BundledRules.Run r = frost(b -> b);
    assertThat(r.explanation("CAUTION-UNPROTECTED", "b1")).contains("b1", "40 %", "-5.0 °C");
  }

  @Test
  void coversThatAreNotEnoughSaySoInsteadOfNothingProtects() {
    // -5.0 °C coldest bud + 2.0 °C of cover = -3.0 °C, below the -2.2 °C target; no sprinklers.
    BundledRules.Run r = frost(b -> b.covers(2.0, 2));
    BundledRules.assertFired(r).fires("COVER-INSUFFICIENT", "CAUTION-COVERS-NOT-ENOUGH")
        .doesNotFire("CAUTION-UNPROTECTED");
    assertThat(r.explanation("CAUTION-COVERS-NOT-ENOUGH", "b1")).contains("-3.0 °C", "-2.2 °C", "40 %");
  }

  @Test
  void noCoversNotEnoughCautionWhenCoversSuffice() {
    // -3.5 + 2.0 = -1.5 °C under the covers: above the target with the margin, so protected.
    BundledRules.Run r = coldest(new Scenario(), -3.5, b -> b.covers(2.0, 2));
    BundledRules.assertFired(r).fires("COVER-SUFFICIENT").doesNotFire("CAUTION-COVERS-NOT-ENOUGH");
  }

  @Test
  void noUnprotectedCautionJustAboveTheTarget() {
    BundledRules.assertFired(coldest(new Scenario(), -2.15, b -> b)).doesNotFire("CAUTION-UNPROTECTED");
  }

  @Test
  void aFixedTargetColderThanT10AcceptsLoss() {
    BundledRules.Run r = coldest(new Scenario().policy(fixed(-2.5)), 3.0, b -> b);
    assertThat(r.explanation("CAUTION-TARGET-BELOW-T10", "b1")).contains("-2.5 °C", "-2.2 °C", "b1");
  }

  @Test
  void noLossCautionWhenTheFixedTargetIsT10() {
    BundledRules.assertFired(coldest(new Scenario().policy(fixed(-2.2)), 3.0, b -> b))
        .doesNotFire("CAUTION-TARGET-BELOW-T10");
  }

  /** Two blocks of 152 m³/h each on a well giving 200 m³/h: one must go without. */
  static BundledRules.Run shortWell(double valueB2) {
    Scenario s = new Scenario().source("well", 200, Double.NaN);
    s.block("b1").sprinklers(3.8, "well").kill(40).value(20000)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    s.block("b2").sprinklers(3.8, "well").kill(60).value(valueB2)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    return BundledRules.run(s);
  }

  @Test
  void rankedByAreaWhenABlockHasNoCropValue() {
    FiredRule f = shortWell(Double.NaN).firing("CAUTION-RANKED-BY-AREA");
    assertThat(f.sourceId()).isEqualTo("well");
    assertThat(f.explanation()).contains("well", "crop_value");
  }

  @Test
  void notRankedByAreaWhenEveryBlockHasAValue() {
    BundledRules.Run r = shortWell(10000);
    BundledRules.assertFired(r).fires("WATER-SHORT").doesNotFire("CAUTION-RANKED-BY-AREA");
  }

  @Test
  void cautionsComeLastInTheTrail() {
    BundledRules.Run r = shortWell(Double.NaN);
    java.util.List<FiredRule> trail = r.outcome().trail();
    int firstCaution = trail.stream().filter(FiredRule::isCaution).mapToInt(FiredRule::seq).min().orElseThrow();
    assertThat(trail).filteredOn(f -> f.seq() > firstCaution).allMatch(FiredRule::isCaution);
  }
}
