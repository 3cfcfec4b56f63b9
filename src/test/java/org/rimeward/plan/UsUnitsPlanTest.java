package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.units.UnitSystem;

/**
 * The invented demo plan read in US units, with every explanation: no metric quantity left in
 * the reader's words. A source's own wording kept beside its US figure, "(2.78 °C)", is a
 * citation and is allowed, as are the crop tables' source notes.
 */
class UsUnitsPlanTest {
  @TempDir Path tmp;

  private static final Pattern METRIC = Pattern.compile("\\d\\s?(°C|m/s|mm/h|m3/h|m³/h|m³|m3|ha)\\b");
  private static final Pattern CITED = Pattern.compile("\\([^()]*(°C|g/m²)[^()]*\\)");

  @Test
  void everyQuantityInEveryExplanationIsInUsUnits() {
    Plan plan = TestFarms.plan(TestFarms.copyDemo(tmp));
    String text = PlanText.render(plan, UnitSystem.US, true);
    for (BlockPlan b : plan.blocks()) {
      text = text.replace(b.thresholdSource(), "");
    }
    text = CITED.matcher(text).replaceAll("");
    assertThat(text).doesNotContainPattern(METRIC);
    assertThat(text).contains("°F", "in/h", "gpm", "per 1,000 gal").containsPattern("\\d,\\d{3} gal");
    assertThat(text).doesNotContain("within 2 °C", "0 °C");
  }

  @Test
  void theMetricPlanStaysMetric() {
    Plan plan = TestFarms.plan(TestFarms.copyDemo(tmp));
    String text = PlanText.render(plan, UnitSystem.METRIC, true);
    assertThat(text).contains("°C", "mm/h", "m3/h", "per m³").doesNotContain(" gpm", " gal");
  }
}
