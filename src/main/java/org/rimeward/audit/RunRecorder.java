package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanInputs;
import org.rimeward.plan.PlanJson;
import org.rimeward.rules.FiredRule;

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
  private static final ObjectMapper COMPACT = new ObjectMapper();

  private RunRecorder() {}

  /** The record of {@code plan}, run at {@code ranAt}, under a new run id. */
  public static RunRecord toRecord(Plan plan, Instant ranAt) {
    return toRecord(plan, ranAt, RunRecord.newRunId(ranAt));
  }

  /** As {@link #toRecord(Plan, Instant)} with a given run id. */
  public static RunRecord toRecord(Plan plan, Instant ranAt, String runId) {
    ObjectNode tree = PlanJson.toTree(plan);
    List<RecordedInput> inputs = new ArrayList<>();
    for (PlanInputs.Input in : plan.inputs().files()) {
      inputs.add(RecordedInput.of(kind(in.kind()), in.name(), in.content()));
    }
    List<RecordedBlock> blocks = new ArrayList<>();
    for (BlockPlan b : plan.blocks()) {
      JsonNode decision = blockNode(tree, b.blockId());
      JsonNode renderedRules = decision.path("rules");
      List<RecordedRule> rules = new ArrayList<>();
      for (int i = 0; i < b.rules().size(); i++) {
        FiredRule r = b.rules().get(i);
        JsonNode rendered = renderedRules.path(i);
        if (rendered.path("seq").asInt(-1) != r.seq()) {
          throw new IllegalStateException("block " + b.blockId() + ": rule " + r.ruleId()
              + " (firing " + r.seq() + ") is not where the plan document lists it");
        }
        rules.add(new RecordedRule(r.seq(), r.ruleId(), r.explanation(),
            compact(rendered.path("values"))));
      }
      blocks.add(new RecordedBlock(b.blockId(), word(b.status()), word(b.risk()), b.needsAction(),
          compact(decision), rules));
    }
    return new RunRecord(runId, ranAt, plan.toolVersion(), plan.farmName(), plan.night().date(),
        plan.night().zone().getId(), compact(tree.path("policy")), inputs, blocks, plan.cautions(),
        PlanJson.toText(plan));
  }

  private static JsonNode blockNode(ObjectNode tree, String blockId) {
    for (JsonNode n : tree.path("blocks")) {
      if (blockId.equals(n.path("block").asText())) {
        return n;
      }
    }
    throw new IllegalStateException("block " + blockId + " is missing from the plan document");
  }

  static InputKind kind(PlanInputs.Kind k) {
    return switch (k) {
      case FARM -> InputKind.FARM;
      case FORECAST -> InputKind.FORECAST;
      case CROP_PROFILE -> InputKind.CROP_PROFILE;
      case RULE -> InputKind.RULE;
    };
  }

  private static String word(Enum<?> e) {
    return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  private static String compact(JsonNode n) {
    try {
      return COMPACT.writeValueAsString(n.isMissingNode() ? COMPACT.createObjectNode() : n);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }
}
