package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.WindExposure;
import org.rimeward.rules.facts.WindLevel;

/**
 * rules/wind/wind.drl: wind bands while the air is below freezing. Bands: above 2.2 m/s (5 mph)
 * sprinkling needs more water (NC State Extension, Poling 2014); above 4.5 m/s (10 mph) a
 * wind-borne freeze, no sprinkling alone (Virginia Tech tree-fruit guidance, 2017).
 */
class WindRulesTest {
  /** The frost night with the strongest wind at 03:00, when the air is -3 °C. */
  static BundledRules.Run windAt0300(double windMs) {
    double[] wind = Scenario.with(Scenario.fill(16, 1.0), 9, windMs);
    return BundledRules.run(new Scenario().block("b1").wind(wind)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
  }

  @Test
  void breezyJustAbove5Mph() {
    BundledRules.Run r = windAt0300(2.21);
    assertThat(r.firedFor("b1")).containsOnlyOnce("WIND-BREEZY").doesNotContain("WIND-WINDY");
    assertThat(r.one(WindExposure.class, "b1")).isEqualTo(new WindExposure("b1", WindLevel.BREEZY, 2.21));
  }

  @Test
  void breezyUpToAndAt10Mph() {
    BundledRules.Run r = windAt0300(4.5);
    assertThat(r.firedFor("b1")).containsOnlyOnce("WIND-BREEZY").doesNotContain("WIND-WINDY");
    assertThat(r.explanation("WIND-BREEZY", "b1")).contains("4.5 m/s", "2.2 m/s");
  }

  @Test
  void calmAt2Point2IsNotBreezy() {
    BundledRules.Run r = windAt0300(2.2);
    assertThat(r.firedFor("b1")).doesNotContain("WIND-BREEZY", "WIND-WINDY");
    assertThat(r.all(WindExposure.class)).isEmpty();
  }

  @Test
  void windyJustAbove10Mph() {
    BundledRules.Run r = windAt0300(4.51);
    assertThat(r.firedFor("b1")).containsOnlyOnce("WIND-WINDY").doesNotContain("WIND-BREEZY");
    assertThat(r.one(WindExposure.class, "b1")).isEqualTo(new WindExposure("b1", WindLevel.WINDY, 4.51));
    assertThat(r.explanation("WIND-WINDY", "b1")).contains("4.5 m/s");
  }

  @Test
  void notWindyAt4Point5() {
    BundledRules.Run r = windAt0300(4.5);
    assertThat(r.firedFor("b1")).doesNotContain("WIND-WINDY");
  }

  @Test
  void windWhileTheAirIsAboveFreezingDoesNotCount() {
    // 20:00, air +4 °C: the strongest wind of the night, but not a freezing wind.
    double[] wind = Scenario.with(Scenario.fill(16, 1.0), 2, 8.0);
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").wind(wind)
        .hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done());
    assertThat(r.all(WindExposure.class)).isEmpty();
  }
}
