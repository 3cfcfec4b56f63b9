package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.time.ZoneId;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;
import org.rimeward.io.Json;
import org.rimeward.plan.PlanCsv;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanText;
import org.rimeward.plan.RecordedExplanations;
import org.rimeward.rules.RuleTemplates;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * A recorded run rendered for a person, a program (JSON) or a spreadsheet (CSV). Everything comes
 * from the record: the plan document as the planner wrote it, read back as a {@link PlanDocument},
 * and the rules as they fired.
 */
public final class RunReport {
  private RunReport() {}

  /** The recorded plan document of {@code run}. */
  public static PlanDocument plan(RunRecord run) {
    try {
      return PlanJson.read(run.planJson());
    } catch (IllegalArgumentException e) {
      throw new AuditIntegrityException("run " + run.runId() + ": its recorded plan cannot be read"
          + " back (" + e.getMessage() + "); show it with --json to see the text as recorded");
    }
  }

  /** The run as JSON: metadata, the policy, every input's hash and size, and the plan itself. */
  public static String json(RunRecord run) {
    ObjectNode root = Json.mapper().createObjectNode();
    root.put("run_id", run.runId());
    root.put("ran_at", run.ranAt().toString());
    root.put("tool_version", run.toolVersion());
    root.put("farm", run.farmName());
    root.put("night", run.night().toString());
    root.put("zone", run.zoneId());
    root.set("policy", parseOrText(run.policyJson()));
    ArrayNode inputs = root.putArray("inputs");
    for (RecordedInput in : run.inputs()) {
      ObjectNode n = inputs.addObject();
      n.put("kind", kindName(in.kind()));
      n.put("name", in.name());
      n.put("sha256", in.sha256());
      n.put("bytes", in.sizeBytes());
    }
    // The plan as it was recorded, key for key: a filed export must not lose what a newer
    // version wrote.
    root.set("plan", parseOrText(run.planJson()));
    return Json.pretty(root);
  }

  /**
   * The run's plan in the plan CSV schema, with the run id and the trail's head as the first
   * columns, and what the crew recorded beside each advised action in {@code done_start} and
   * {@code done_stop} (empty when nothing was recorded).
   */
  public static String csv(RunRecord run, List<CrewAction> actions, ChainHead head) {
    ZoneId zone = ZoneId.of(run.zoneId());
    return PlanCsv.render(plan(run), new PlanCsv.Recorded(run.runId(), head.toString()),
        (block, method) -> CrewReport.doneTimes(block, method, actions, zone));
  }

  /**
   * Each recorded rule's explanation in {@code units}, from the templates in the run's own rule
   * files and the values it recorded (see {@link RecordedExplanations}).
   */
  public static Function<PlanDocument.Rule, String> explainer(RunRecord run, UnitSystem units) {
    List<String> ruleFiles = run.inputs().stream().filter(i -> i.kind() == InputKind.RULE)
        .map(i -> new String(i.content(), StandardCharsets.UTF_8)).toList();
    return RecordedExplanations.of(RuleTemplates.read(ruleFiles), units, ZoneId.of(run.zoneId()));
  }

  /** A readable summary: the night, each block's decision and actions, rules, cautions, inputs. */
  public static String text(RunRecord run, UnitSystem units) {
    PlanDocument plan = plan(run);
    Function<PlanDocument.Rule, String> words = explainer(run, units);
    UnitFormat fmt = UnitFormat.of(units);
    ZoneId zone = ZoneId.of(run.zoneId());
    StringBuilder s = new StringBuilder();
    s.append("Run ").append(run.runId()).append('\n');
    s.append("Recorded ").append(fmt.stamp(run.ranAt().atZone(zone).toOffsetDateTime()))
        .append(' ').append(run.zoneId()).append(" by rimeward ").append(run.toolVersion())
        .append(", farm ").append(run.farmName()).append('\n');
    PlanDocument.Night night = plan.night();
    s.append("Night of ").append(run.night());
    if (night.sunset() != null || night.sunrise() != null) {
      s.append(": sunset ").append(fmt.clock(night.sunset())).append(", sunrise ")
          .append(fmt.clock(night.sunrise()));
    }
    s.append("\n");
    for (PlanDocument.Block b : plan.blocks()) {
      s.append('\n').append(b.block()).append(" (").append(b.crop())
          .append(b.variety() != null && !b.variety().isEmpty() ? " " + b.variety() : "")
          .append(", ").append(b.stage()).append("): ").append(b.status()).append(", risk ")
          .append(b.risk()).append('\n');
      s.append("  coldest ").append(fmt.clock(b.coldestAt())).append(": air ")
          .append(fmt.temp(b.minAirC())).append(", bud ").append(fmt.temp(b.minBudC()))
          .append(", wet-bulb ").append(fmt.temp(b.minWetBulbC())).append("; T10 ")
          .append(fmt.temp(b.t10C())).append(", T90 ").append(fmt.temp(b.t90C()))
          .append(", target ").append(fmt.temp(b.targetC())).append('\n');
      s.append("  expected bud kill if unprotected: ")
          .append(String.format(Locale.ROOT, "%.0f %%", b.killPctUnprotected())).append('\n');
      if (b.actions().isEmpty()) {
        s.append("  no action\n");
      }
      for (PlanDocument.Action a : b.actions()) {
        s.append("  ").append(PlanText.action(a, fmt)).append('\n');
      }
      List<String> cautions = b.cautionRules().isEmpty() ? b.cautions()
          : b.cautionRules().stream().map(words).toList();
      for (String c : cautions) {
        s.append("  caution: ").append(c).append('\n');
      }
      List<RecordedRule> fired = run.block(b.block()).map(RecordedBlock::rules).orElse(List.of());
      if (!fired.isEmpty()) {
        s.append("  rules fired, in order:\n");
        for (RecordedRule r : fired) {
          s.append("    ").append(r.seq()).append(". ").append(r.ruleId()).append(": ")
              .append(words.apply(new PlanDocument.Rule(r.seq(), r.ruleId(), "", r.explanation(),
                  parseOrText(r.factsJson())))).append('\n');
        }
      }
    }
    if (!plan.water().isEmpty()) {
      s.append("\nWater\n");
      for (PlanDocument.Water w : plan.water()) {
        s.append("  ").append(w.source()).append(": ").append(fmt.volume(w.volumeM3()))
            .append(" needed of ")
            .append(w.availableM3() == null ? "no limit" : fmt.volume(w.availableM3()))
            .append(" available; peak flow ").append(fmt.flow(w.peakFlowM3H())).append(" of ")
            .append(fmt.flow(w.maxFlowM3H())).append(w.shortOfWater() ? " -- SHORT" : "")
            .append('\n');
      }
    }
    if (!plan.farmRules().isEmpty()) {
      s.append("\nFarm-wide rules, in order\n");
      for (PlanDocument.Rule r : plan.farmRules()) {
        s.append("    ").append(r.seq()).append(". ").append(r.id()).append(": ")
            .append(words.apply(r)).append('\n');
      }
    }
    List<String> cautions = run.cautions();
    if (!cautions.isEmpty()) {
      s.append("\nCautions\n");
      for (String c : cautions) {
        s.append("  - ").append(c).append('\n');
      }
    }
    s.append("\nInputs (SHA-256)\n");
    for (RecordedInput in : run.inputs()) {
      s.append(String.format(Locale.ROOT, "  %-12s %s  %s (%d bytes)%n", kindName(in.kind()),
          in.sha256(), in.name(), in.sizeBytes()));
    }
    return s.toString();
  }

  static String kindName(InputKind kind) {
    return kind.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  private static JsonNode parseOrText(String json) {
    try {
      return Json.mapper().readTree(json);
    } catch (JsonProcessingException e) {
      return Json.mapper().getNodeFactory().textNode(json);
    }
  }
}
