package org.rimeward.watch;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.minimum.RadiationNights;
import org.rimeward.plan.RadiationNightCriteria;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.RuleFolders;
import org.rimeward.rules.RuleThresholds;
import org.rimeward.rules.facts.Thresholds;

/**
 * The night watch's thresholds and the radiation-night criteria come from the rule files (rule
 * THRESHOLDS), not from Java: the bundled values, then a copy of the rules with other numbers.
 */
class RuleFileThresholdsTest {
  @TempDir Path tmp;

  private static Thresholds of(Path rules) {
    return RuleThresholds.of(RuleBook.loadCached(rules, rules.resolveSibling("cache")));
  }

  @Test
  void theBundledRulesGiveTheWatchAndTheSiteModelTheirNumbers() {
    Thresholds t = RuleThresholds.of(RuleBook.load(Path.of("rules")));
    WatchPolicy p = WatchPolicy.from(t, Duration.ofSeconds(10));
    // Rimeward's stated choices: start-due 30 min ahead, colder by more than 1 °C, stale after
    // 60 min. The wind limit is the wind rules' windy limit at 10 m (10 mph, Virginia Tech
    // tree-fruit guidance after UF/IFAS Circ. 287), the same number, not a second one.
    assertThat(p).isEqualTo(new WatchPolicy(Duration.ofMinutes(30), 1.0, Duration.ofMinutes(60),
        4.5, Duration.ofSeconds(10)));
    assertThat(p.windyWind10mMs()).isEqualTo(t.windyWind10mMs());
    // FAO 2005 ch. 6: radiation frost, "wind less than 2 m/s, no clouds" (SEEN-2nd,
    // docs/reference/site-minimum.md); 25 % cloud, 2 °C early cooling, 1 °C depression and
    // 90 min gaps are Rimeward's choices.
    assertThat(RadiationNightCriteria.of(t)).isEqualTo(
        new RadiationNights.Criteria(2.0, 25.0, 2.0, 1.0, Duration.ofMinutes(90)));
  }

  @Test
  void otherNumbersInACopyOfTheRuleFilesChangeThePolicyAndTheCriteria() throws Exception {
    Path rules = RuleFolders.withThresholds(tmp.resolve("rules"), """
        new Thresholds(1.5, 2.2, 6.0, 30.0, 0.0, 1.0, 0.5, 70.0, 0.5,
              45, 1.5, 90,
              3.0, 40.0, 1.5, 0.5, 120)""");
    Thresholds t = of(rules);
    assertThat(WatchPolicy.from(t, Duration.ofSeconds(5))).isEqualTo(new WatchPolicy(
        Duration.ofMinutes(45), 1.5, Duration.ofMinutes(90), 6.0, Duration.ofSeconds(5)));
    assertThat(RadiationNightCriteria.of(t)).isEqualTo(
        new RadiationNights.Criteria(3.0, 40.0, 1.5, 0.5, Duration.ofMinutes(120)));
  }
}
