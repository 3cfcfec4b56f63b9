package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.rules.FiredRule;

/**
 * The pollinator caution follows the crop profile's {@code flowering} flag through the planner:
 * covers keep pollinators from open flowers (common practice: uncover during the day in bloom).
 * Apple full bloom and post bloom share one row of WSU EB0913 (28 °F / 25 °F), so the two nights
 * below differ only in whether the flowers are open.
 */
class PollinatorCautionPlanTest {
  @TempDir Path tmp;

  static final String COVERED_APPLE = """
        - id: test-apple
          crop: apple
          stage: STAGE
          area: 2.0 ha
          covers:
            protection: 2.0C
            deploy_hours: 2
      """;

  /** An invented clear, calm night down to −3 °C: cold enough that the covers go on. */
  private Plan planAt(String stage) {
    double[] air = {6, 4, 2, 0, -1, -2, -2.5, -3, -3, -3, -2.5, -1, 2, 5, 7, 8, 9};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp.resolve(stage), COVERED_APPLE.replace("STAGE", stage),
        Forecasts.hourly("2026-04-14", 20, "-07:00", air, Forecasts.fill(n, -6.0),
            Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    return TestFarms.plan(farm);
  }

  @Test
  void firesAtFullBloom() {
    BlockPlan b = planAt("full-bloom").blocks().get(0);
    assertThat(b.cover()).as("covers planned").isPresent();
    assertThat(b.cautions()).extracting(FiredRule::ruleId).contains("CAUTION-COVER-POLLINATORS");
  }

  /**
   * Near miss: the same covers on the same night after petal fall (BBCH 69, end of flowering),
   * flagged {@code flowering: false}. A test of the stage's id for "bloom", or of BBCH principal
   * stage 6, would have fired here.
   */
  @Test
  void doesNotFireAtPetalFall() {
    BlockPlan b = planAt("post-bloom").blocks().get(0);
    assertThat(b.cover()).as("covers planned").isPresent();
    assertThat(b.cautions()).extracting(FiredRule::ruleId)
        .doesNotContain("CAUTION-COVER-POLLINATORS");
  }
}
