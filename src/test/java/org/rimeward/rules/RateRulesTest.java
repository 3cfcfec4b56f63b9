package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.NotAdvisedReason;
import org.rimeward.rules.facts.SprinkleNeed;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.SprinklingNotAdvised;

/**
 * rules/sprinkling/rate.drl: the need over the hours sprinkling would run, against the installed
 * rate. A rate short of the need is not advised alone: NC State Extension's start/stop guide says
 * it is better not to turn on a system that cannot give the rate the night needs. The frost night
 * of {@link Scenario} runs from 22:42 to 07:40; the needs are invented test values.
 */
class RateRulesTest {
  /** The frost night with the required rate {@code peakMmH} at 03:00, inside the run. */
  static BundledRules.Run requiredAt0300(double peakMmH) {
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 9, peakMmH);
    return BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").kill(40).rate(rate)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  @Test
  void theNeedIsThePeakOverTheRun() {
    BundledRules.Run r = requiredAt0300(3.1);
    BundledRules.assertFired(r, "b1").firesOnce("RATE-NEED");
    SprinkleNeed n = r.one(SprinkleNeed.class, "b1");
    assertThat(n.requiredRateMmH()).isEqualTo(3.1);
    assertThat(n.peakAt()).isEqualTo(Scenario.at(1, 3, 0));
    assertThat(n.installedRateMmH()).isEqualTo(3.8);
    assertThat(n.unknownAt()).isNull();
    assertThat(r.explanation("RATE-NEED", "b1")).contains("22:42", "07:40", "3.10 mm/h", "03:00", "3.80 mm/h");
  }

  @Test
  void noNeedWithoutARun() {
    // Near miss: the coldest dry bud -2.15 °C stays above the -2.2 °C target, so no run.
    double[] air = Scenario.coldestAt0200(-1.15);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").hourly(air, Scenario.minus(air, 1.0)).done());
    BundledRules.assertFired(r, "b1").doesNotFire("RATE-NEED", "RATE-SHORT", "RATE-ENOUGH");
    assertThat(r.all(SprinkleNeed.class)).isEmpty();
  }

  @Test
  void rateShortWhenTheNightNeedsMoreThanInstalled() {
    BundledRules.Run r = requiredAt0300(3.81);
    BundledRules.assertFired(r, "b1").firesOnce("RATE-SHORT").doesNotFire("RATE-ENOUGH", "SPRINKLE-PLAN");
    SprinklingNotAdvised x = r.one(SprinklingNotAdvised.class, "b1");
    assertThat(x.reason()).isEqualTo(NotAdvisedReason.RATE_SHORT);
    assertThat(x.requiredRateMmH()).isEqualTo(3.81);
    assertThat(x.installedRateMmH()).isEqualTo(3.8);
    assertThat(x.at()).isEqualTo(Scenario.at(1, 3, 0));
    assertThat(r.explanation("RATE-SHORT", "b1")).contains("3.80 mm/h", "3.81 mm/h", "not advised",
        "NC State", "40 %");
    assertThat(r.all(SprinklePlan.class)).isEmpty();
  }

  @Test
  void rateEnoughAtEquality() {
    BundledRules.Run r = requiredAt0300(3.8);
    BundledRules.assertFired(r, "b1").firesOnce("RATE-ENOUGH").doesNotFire("RATE-SHORT");
    assertThat(r.all(SprinklingNotAdvised.class)).isEmpty();
    assertThat(r.explanation("RATE-ENOUGH", "b1")).contains("3.80 mm/h, covers the 3.80 mm/h");
    assertThat(r.one(SprinklePlan.class, "b1").requiredRateMmH()).isEqualTo(3.8);
  }

  @Test
  void rateEnoughFiresOnlyWithEnoughAndRateShortOnlyWhenShort() {
    BundledRules.assertFired(requiredAt0300(3.81), "b1").doesNotFire("RATE-ENOUGH");
    BundledRules.assertFired(requiredAt0300(3.8), "b1").doesNotFire("RATE-SHORT");
  }

  @Test
  void aRequiredPeakOutsideTheRunDoesNotCount() {
    // 18:00 needs 6 mm/h, but sprinkling runs from 22:42; inside the run 2.0 mm/h is enough.
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 0, 6.0);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").kill(40).rate(rate)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    assertThat(r.one(SprinklePlan.class, "b1").requiredRateMmH()).isEqualTo(2.0);
    BundledRules.assertFired(r, "b1").fires("RATE-ENOUGH");
  }

  @Test
  void aNeedTheBalanceCannotComputeInsideTheRunIsNotAdvised() {
    // 03:00: the balance gave no need (NaN, outside its range); the hours around it need 2 mm/h.
    BundledRules.Run r = requiredAt0300(Double.NaN);
    BundledRules.assertFired(r, "b1").firesOnce("RATE-NEED-UNKNOWN")
        .doesNotFire("RATE-SHORT", "RATE-ENOUGH", "SPRINKLE-PLAN");
    SprinklingNotAdvised x = r.one(SprinklingNotAdvised.class, "b1");
    assertThat(x.reason()).isEqualTo(NotAdvisedReason.NEED_UNKNOWN);
    assertThat(x.at()).isEqualTo(Scenario.at(1, 3, 0));
    assertThat(x.requiredRateMmH()).isEqualTo(2.0);
    assertThat(r.explanation("RATE-NEED-UNKNOWN", "b1")).contains("03:00", "-3.0 °C", "not advised")
        .doesNotContain("NaN", "Infinity");
  }

  @Test
  void anUnknownNeedOutsideTheRunDoesNotCount() {
    // 18:00 unknown, the run starts at 22:42: the run's need is known everywhere.
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 0, Double.NaN);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").kill(40).rate(rate)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    BundledRules.assertFired(r, "b1").doesNotFire("RATE-NEED-UNKNOWN").fires("RATE-ENOUGH", "SPRINKLE-PLAN");
  }
}
