package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.rimeward.physics.Wind;
import org.rimeward.rules.facts.NotAdvisedReason;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.SprinklingNotAdvised;
import org.rimeward.rules.facts.WindExposure;
import org.rimeward.rules.facts.WindLevel;

/**
 * rules/wind/wind.drl: the wind over the hours sprinkling would run, while the air is below
 * freezing, at 10 m. Bands: above 2.2 m/s (5 mph) sprinkling needs more water (NC State
 * Extension, Poling 2014); above 4.5 m/s (10 mph) a wind-borne freeze, no sprinkling alone
 * (Virginia Tech tree-fruit guidance, 2017). The frost night of {@link Scenario} would sprinkle
 * from 22:42 to 07:40; its air is below 0 °C from 01:00 to 06:00.
 */
class WindRulesTest {
  static BundledRules.Run windAt(int step, double windMs, double coverC) {
    double[] wind = Scenario.with(Scenario.fill(16, 1.0), step, windMs);
    return BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").covers(coverC, 2).kill(40).wind(wind)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  /** 03:00, air -3 °C: inside the run and below freezing. */
  static BundledRules.Run windAt0300(double windMs) {
    return windAt(9, windMs, 0);
  }

  @Test
  void breezyJustAbove5Mph() {
    BundledRules.Run r = windAt0300(2.21);
    BundledRules.assertFired(r, "b1").firesOnce("WIND-BREEZY").doesNotFire("WIND-WINDY");
    WindExposure w = r.one(WindExposure.class, "b1");
    assertThat(w.level()).isEqualTo(WindLevel.BREEZY);
    assertThat(w.maxWind10mMs()).isEqualTo(2.21);
    // FAO-56 Eq. 47: u2 = u10 × 4.87 / ln(67.8 × 10 − 5.42) = 0.748 u10.
    assertThat(w.wind2mMs()).isCloseTo(2.21 * 0.748, within(0.002)).isEqualTo(Wind.at2mMs(2.21, 10));
    assertThat(w.at()).isEqualTo(Scenario.at(1, 3, 0));
  }

  @Test
  void breezyUpToAndAt10MphWithThe2mWindBeside() {
    BundledRules.Run r = windAt0300(4.5);
    BundledRules.assertFired(r, "b1").firesOnce("WIND-BREEZY").doesNotFire("WIND-WINDY");
    assertThat(r.explanation("WIND-BREEZY", "b1")).contains("4.5 m/s at 10 m", "3.4 m/s at 2 m",
        "2.2 m/s", "03:00");
  }

  @Test
  void calmAt2Point2IsNotBreezy() {
    BundledRules.Run r = windAt0300(2.2);
    BundledRules.assertFired(r, "b1").doesNotFire("WIND-BREEZY", "WIND-WINDY");
    assertThat(r.all(WindExposure.class)).isEmpty();
  }

  @Test
  void windyJustAbove10Mph() {
    BundledRules.Run r = windAt0300(4.51);
    BundledRules.assertFired(r, "b1").firesOnce("WIND-WINDY").doesNotFire("WIND-BREEZY");
    assertThat(r.one(WindExposure.class, "b1").level()).isEqualTo(WindLevel.WINDY);
    assertThat(r.explanation("WIND-WINDY", "b1")).contains("4.5 m/s", "10 mph", "03:00");
  }

  @Test
  void notWindyAt4Point5() {
    BundledRules.assertFired(windAt0300(4.5), "b1").doesNotFire("WIND-WINDY", "SPRINKLE-UNSAFE-WIND");
  }

  @Test
  void windWhileTheAirIsAboveFreezingDoesNotCount() {
    // 20:00, air +4 °C, before the run: the strongest wind of the night, but no freezing wind.
    assertThat(windAt(2, 8.0, 0).all(WindExposure.class)).isEmpty();
    // 07:00, air 0 °C: inside the run, but not below freezing.
    assertThat(windAt(13, 8.0, 0).all(WindExposure.class)).isEmpty();
    // 06:00, air -3 °C: inside the run and below freezing.
    assertThat(windAt(12, 8.0, 0).one(WindExposure.class, "b1").level()).isEqualTo(WindLevel.WINDY);
  }

  @Test
  void aCalmFrostAfterBreezyHoursAboveFreezingIsACalmFrost() {
    // 18:00 to 00:00 at 8 m/s while the air falls from +6 to 0 °C; calm from 01:00, when it freezes.
    double[] wind = {8, 8, 8, 8, 8, 8, 8, 1, 1, 1, 1, 1, 1, 1, 1, 1};
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").kill(40).wind(wind)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    assertThat(r.all(WindExposure.class)).isEmpty();
    assertThat(r.all(SprinklingNotAdvised.class)).isEmpty();
    assertThat(r.one(SprinklePlan.class, "b1").start()).isEqualTo(Scenario.at(0, 22, 42));
  }

  @Test
  void noWindJudgementWithoutARun() {
    // A block with sprinklers that needs no protection: its wind is not judged at all.
    double[] air = Scenario.coldestAt0200(1.0);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").wind(Scenario.fill(16, 9.0)).hourly(air, Scenario.minus(air, 1.0)).done());
    BundledRules.assertFired(r, "b1").doesNotFire("WIND-BREEZY", "WIND-WINDY", "SPRINKLE-UNSAFE-WIND");
  }

  @Test
  void unsafeAloneInAWindBorneFreeze() {
    BundledRules.Run r = windAt0300(4.51);
    BundledRules.assertFired(r, "b1").firesOnce("SPRINKLE-UNSAFE-WIND").doesNotFire("SPRINKLE-PLAN");
    SprinklingNotAdvised x = r.one(SprinklingNotAdvised.class, "b1");
    assertThat(x.reason()).isEqualTo(NotAdvisedReason.WIND);
    assertThat(x.wind10mMs()).isEqualTo(4.51);
    assertThat(x.requiredRateMmH()).isEqualTo(2.0);
    assertThat(x.installedRateMmH()).isEqualTo(3.8);
    assertThat(r.explanation("SPRINKLE-UNSAFE-WIND", "b1")).contains("4.5 m/s at 10 m", "3.4 m/s at 2 m",
        "10 mph", "2.00 mm/h", "3.80 mm/h", "40 %", "not advised");
  }

  @Test
  void overCoversSprinklingIsNotUnsafeInWind() {
    // NC State Extension: in a wind-borne freeze sprinkling "cannot be safely used unless there
    // is a row cover". Covers 1 °C: -5.0 + 0.5 credited in wind = -4.5 °C, not enough alone.
    BundledRules.Run r = windAt(9, 6.0, 1.0);
    BundledRules.assertFired(r, "b1").fires("WIND-WINDY").doesNotFire("SPRINKLE-UNSAFE-WIND");
  }
}
