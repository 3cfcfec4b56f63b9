package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.facts.Status;

/**
 * The whole demo plan, end to end, against a reviewed copy. A change to a rule, a profile, the
 * physics or the demo data shows up here as a diff to read; when the change is intended, run
 * {@code mvn test -Dtest=DemoPlanGoldenTest -Drimeward.golden.update=true} and review the diff of
 * the golden file before committing it.
 */
class DemoPlanGoldenTest {
  static final Path GOLDEN = Path.of("src/test/resources/golden/demo-plan.json");
  static Plan plan;

  @BeforeAll
  static void planDemo() {
    plan = new NightPlanner().plan(new PlanRequest(TestFarms.DEMO, null, TestFarms.CROPS,
        TestFarms.RULES, null));
  }

  @Test
  void demoPlanMatchesTheReviewedCopy() throws IOException {
    ObjectNode tree = PlanJson.toTree(plan);
    tree.put("tool_version", "(any)");
    // Any edit of a rule or profile changes these digests; FarmFolderInputsTest checks them.
    ((ObjectNode) tree.path("inputs").path("crop_profiles")).put("sha256", "(any)");
    ((ObjectNode) tree.path("inputs").path("rules")).put("sha256", "(any)");
    String actual = org.rimeward.io.Json.pretty(tree);
    if (Boolean.getBoolean("rimeward.golden.update")) {
      Files.writeString(GOLDEN, actual);
    }
    assertThat(actual).isEqualTo(Files.readString(GOLDEN));
  }

  /** What the demo farm is for: each situation the README promises is in it. */
  @Test
  void theDemoNightShowsEverySituation() {
    assertThat(plan.blocks()).hasSizeGreaterThanOrEqualTo(8);
    assertThat(plan.blocks().stream().map(BlockPlan::crop).distinct().count()).isGreaterThanOrEqualTo(5);
    assertThat(plan.water()).hasSize(2);
    assertThat(plan.water().stream().filter(WaterEntry::isShortOfWater).count()).isEqualTo(1);
    assertThat(plan.blocks()).anyMatch(b -> b.cover().isPresent());
    assertThat(plan.blocks()).anyMatch(b -> b.status() == Status.NOT_NEEDED);
    assertThat(plan.blocks()).anyMatch(b -> b.status() == Status.SHORT_OF_WATER);
    assertThat(plan.blocks()).anyMatch(b -> b.status() == Status.UNPROTECTED);
    assertThat(plan.blocks()).anyMatch(b -> b.status() == Status.NOT_ADVISED);
    assertThat(plan.blocks()).anyMatch(b -> b.status() == Status.WATCH);
    assertThat(plan.blocks()).anyMatch(b -> b.alarm().isPresent());
    assertThat(plan.trail()).anyMatch(r -> r.ruleId().startsWith("WIND-"));
  }

  /** A rule that fired twice for one block means facts were inserted twice: plans would double. */
  @Test
  void noRuleFiresTwiceForTheSameBlock() {
    Set<String> seen = new HashSet<>();
    for (FiredRule r : plan.trail()) {
      String key = r.ruleId() + "@" + (r.blockId() != null ? r.blockId() : r.sourceId());
      assertThat(seen.add(key)).as("%s fired twice", key).isTrue();
    }
  }

  @Test
  void blocksAreSortedByTheirFirstAction() {
    var starts = plan.blocks().stream().filter(BlockPlan::needsAction)
        .map(b -> b.firstAction().orElseThrow()).toList();
    assertThat(starts).isSorted();
    assertThat(plan.blocks().get(plan.blocks().size() - 1).needsAction()).isFalse();
  }
}
