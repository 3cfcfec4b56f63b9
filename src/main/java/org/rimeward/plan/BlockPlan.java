package org.rimeward.plan;

import java.time.Instant;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.facts.NightSeries;
import org.rimeward.rules.facts.RiskLevel;
import org.rimeward.rules.facts.Status;

/**
 * Tonight's plan for one block, with every rule that fired for it.
 *
 * @param variety null when the block names none (the crop's reference table applies)
 * @param thresholdSource where T10 and T90 came from
 * @param sprinkling what the night asks of the block's sprinklers; empty without sprinklers
 * @param alarm the start and alarm readings; empty when the block has no sprinkling to start
 * @param series the block's night step by step, as the physics computed it
 * @param coldAirOffsetC the farm file's offset of the block's air from the forecast's
 */
public record BlockPlan(String blockId, String crop, String variety, String stage,
    String stageName, double t10C, double t90C, String thresholdSource, double targetC,
    double minAirC, double minBudC, double minWetBulbC, Instant coldestAt, int coldestLine,
    RiskLevel risk, double killPctUnprotected, Status status, List<Action> actions,
    Optional<Sprinkling> sprinkling, Optional<AlarmReading> alarm,
    List<FiredRule> cautions, List<FiredRule> rules, NightSeries series, double coldAirOffsetC) {
  public BlockPlan {
    actions = List.copyOf(actions);
    cautions = List.copyOf(cautions);
    rules = List.copyOf(rules);
  }

  /** When the first action begins; empty when there is nothing to do. */
  public Optional<Instant> firstAction() {
    return actions.stream().map(Action::begins).min(Comparator.naturalOrder());
  }

  /** Whether tonight threatens the block at all: any risk but none. */
  public boolean atRisk() {
    return risk != RiskLevel.NONE;
  }

  public boolean needsAction() {
    return !actions.isEmpty();
  }

  public Optional<Action.Sprinkle> sprinkle() {
    return actions.stream().filter(Action.Sprinkle.class::isInstance).map(Action.Sprinkle.class::cast)
        .findFirst();
  }

  public Optional<Action.Cover> cover() {
    return actions.stream().filter(Action.Cover.class::isInstance).map(Action.Cover.class::cast)
        .findFirst();
  }
}
