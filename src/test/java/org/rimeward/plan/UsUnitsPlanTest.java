package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.units.UnitSystem;

/**
 * The invented demo plan read in US units, with every explanation: no metric unit left anywhere
 * in the reader's words, not even in a source's note that quotes both ("-1.1 °C (30.0 °F)"
 * reads "30.0 °F"). The page is checked the same way in {@code NightPageTest}.
 */
class UsUnitsPlanTest {
  @TempDir Path tmp;

  /** A metric unit after a number, or a metric word: what a US reader must never meet. */
  static final Pattern METRIC = Pattern.compile(
      "°C|m³|\\bm3\\b|mm/h|m/s|g/m²|\\d\\s?ha\\b|hectare|per m\\b|\\d\\s?(L|ML|km)\\b");

  @Test
  void noMetricUnitInTheWholePlanWithEveryExplanation() {
    Plan plan = TestFarms.plan(TestFarms.copyDemo(tmp));
    String text = PlanText.render(plan, UnitSystem.US, true);
    assertThat(text).doesNotContainPattern(METRIC);
    assertThat(text).contains("°F", "in/h", "gpm", "per 1,000 gal").containsPattern("\\d,\\d{3} gal");
    // The sources' own figures, their metric twin dropped; the timeline's alarms in °F.
    assertThat(text).contains("single stage tolerance 30.0 °F, not a 10/90 curve",
        "fabric 1.50 oz/yd²: 5.0 °F, table point", "shifted 2.0 °F colder by the rome-beauty",
        "frost alarm: air 33.8 °F expected; sprinklers on at 32.0 °F air");
    assertThat(text).doesNotContain("within 2 °C", "0 °C");
  }

  @Test
  void theMetricPlanStaysMetric() {
    Plan plan = TestFarms.plan(TestFarms.copyDemo(tmp));
    String text = PlanText.render(plan, UnitSystem.METRIC, true);
    assertThat(text).contains("°C", "mm/h", "m3/h", "per m³").doesNotContain(" gpm", " gal");
  }
}
