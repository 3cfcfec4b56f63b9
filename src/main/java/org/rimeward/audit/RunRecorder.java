package org.rimeward.audit;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.rimeward.io.Json;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanDocuments;
import org.rimeward.plan.PlanInputs;

/**
 * Turns a plan into the record the audit trail keeps of its run.
 *
 * <p>Each block's rules are its rows of the trail, with the values each rule saw as its facts.
 * Rules that matched no block (the water budget of a source, a source short of water) stay in the
 * recorded plan document under {@code farm_rules}, exactly as the plan prints them; the plan
 * document is part of the run's own chained row, so they are covered by the chain as well. They
 * are not given a pseudo block, so that block counts and {@code --block} filters mean real blocks.
 */
public final class RunRecorder {
  private RunRecorder() {}

  /** The record of {@code plan}, run at {@code ranAt}, under a new run id. */
  public static RunRecord toRecord(Plan plan, Instant ranAt) {
    return toRecord(plan, ranAt, RunRecord.newRunId(ranAt));
  }

  /** As {@link #toRecord(Plan, Instant)} with a given run id. */
  public static RunRecord toRecord(Plan plan, Instant ranAt, String runId) {
    PlanDocument doc = PlanDocuments.of(plan);
    List<RecordedInput> inputs = new ArrayList<>();
    for (PlanInputs.Input in : plan.inputs().files()) {
      inputs.add(RecordedInput.of(kind(in.kind()), in.name(), in.content()));
    }
    List<RecordedBlock> blocks = new ArrayList<>();
    for (PlanDocument.Block b : doc.blocks()) {
      List<RecordedRule> rules = new ArrayList<>();
      for (PlanDocument.Rule r : b.rules()) {
        rules.add(new RecordedRule(r.seq(), r.id(), r.explanation(), Json.compact(r.values())));
      }
      blocks.add(new RecordedBlock(b.block(), b.status(), b.risk(), !b.actions().isEmpty(),
          Json.compact(b), rules));
    }
    return new RunRecord(runId, ranAt, plan.toolVersion(), plan.farmName(), plan.night().date(),
        plan.night().zone().getId(), Json.compact(doc.policy()), inputs, blocks, plan.cautions(),
        Json.pretty(doc));
  }

  static InputKind kind(PlanInputs.Kind k) {
    return switch (k) {
      case FARM -> InputKind.FARM;
      case FORECAST -> InputKind.FORECAST;
      case CROP_PROFILE -> InputKind.CROP_PROFILE;
      case RULE -> InputKind.RULE;
      case READINGS -> InputKind.READINGS;
    };
  }
}
