package org.rimeward.plan;

import java.util.List;
import org.rimeward.rules.FiredRule;

/**
 * The nightly decision: every block's plan sorted by when its first action begins, the water
 * budget, the cautions, the whole trail of fired rules, and the inputs that shaped it.
 *
 * @param cautions the standing cautions and the farm-wide ones; each block keeps its own too
 */
public record Plan(String farmName, String toolVersion, NightSummary night, PlanPolicy policy,
    List<BlockPlan> blocks, List<WaterEntry> water, List<String> cautions, List<FiredRule> trail,
    PlanInputs inputs, NightUpdate update) {
  /** A plan made at dusk, from the forecast alone. */
  public Plan(String farmName, String toolVersion, NightSummary night, PlanPolicy policy,
      List<BlockPlan> blocks, List<WaterEntry> water, List<String> cautions, List<FiredRule> trail,
      PlanInputs inputs) {
    this(farmName, toolVersion, night, policy, blocks, water, cautions, trail, inputs, null);
  }

  /** The same plan re-made during the night; {@code update} says from when and with what. */
  public Plan withUpdate(NightUpdate u) {
    return new Plan(farmName, toolVersion, night, policy, blocks, water, cautions, trail, inputs, u);
  }

  public Plan {
    blocks = List.copyOf(blocks);
    water = List.copyOf(water);
    cautions = List.copyOf(cautions);
    trail = List.copyOf(trail);
  }

  /** Whether any block needs protection tonight. */
  public boolean actionNeeded() {
    return blocks.stream().anyMatch(BlockPlan::needsAction);
  }
}
