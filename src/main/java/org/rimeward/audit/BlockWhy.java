package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Json;
import org.rimeward.plan.PlanDocument;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * Why a block was (or was not) protected in a recorded run: the rules that fired for it in firing
 * order with the numbers each saw, the farm-wide rules about the water source it draws on, and the
 * inputs those numbers came from (the forecast lines quoted from the recorded forecast, the crop
 * profile value and its source, every input file's hash). Everything is read from the record.
 */
public final class BlockWhy {
  private static final ObjectMapper JSON = Json.mapper();

  /** One rule in the chain; {@code farmWide} for a rule that matched no block. */
  public record Step(int seq, String ruleId, String kind, String explanation, JsonNode values,
      boolean farmWide) {}

  private final RunRecord run;
  private final RecordedBlock block;
  private final PlanDocument.Block decision;
  private final List<Step> steps;
  private final String waterSource;
  private final Map<Integer, String> forecastLines;

  private BlockWhy(RunRecord run, RecordedBlock block, PlanDocument.Block decision, List<Step> steps,
      String waterSource, Map<Integer, String> forecastLines) {
    this.run = run;
    this.block = block;
    this.decision = decision;
    this.steps = steps;
    this.waterSource = waterSource;
    this.forecastLines = forecastLines;
  }

  /** The chain for {@code blockId} in {@code run}. */
  public static BlockWhy of(RunRecord run, String blockId) {
    RecordedBlock block = run.block(blockId).orElseThrow(() -> new BadInputException("BLOCK: run "
        + run.runId() + " planned no block '" + blockId + "'; it planned "
        + String.join(", ", run.blocks().stream().map(RecordedBlock::blockId).toList())));
    PlanDocument plan = RunReport.plan(run);
    PlanDocument.Block decision = block.decision();
    Map<Integer, String> kinds = new TreeMap<>();
    for (PlanDocument.Rule r : decision.rules()) {
      kinds.put(r.seq(), r.kind());
    }
    List<Step> steps = new ArrayList<>();
    for (RecordedRule r : block.rules()) {
      steps.add(new Step(r.seq(), r.ruleId(), kinds.getOrDefault(r.seq(), ""), r.explanation(),
          values(r.factsJson(), run), false));
    }
    String source = decision.sprinkle().map(PlanDocument.Sprinkle::source).orElse(null);
    if (source != null) {
      for (PlanDocument.Rule r : plan.farmRules()) {
        if (r.sourceId().filter(source::equals).isPresent()) {
          steps.add(new Step(r.seq(), r.id(), r.kind(), r.explanation(), r.values(), true));
        }
      }
    }
    steps.sort(Comparator.comparingInt(Step::seq));
    Map<Integer, String> lines = new TreeMap<>();
    lines.put(decision.coldestForecastLine(), null);
    for (Step s : steps) {
      collectLines(s.values(), null, lines);
    }
    lines.put(1, null); // the header, naming the columns of the lines quoted
    String[] forecast = run.inputs().stream().filter(i -> i.kind() == InputKind.FORECAST)
        .findFirst().map(i -> i.text().split("\r?\n", -1)).orElse(new String[0]);
    lines.replaceAll((n, v) -> n >= 1 && n <= forecast.length ? forecast[n - 1] : null);
    return new BlockWhy(run, block, decision, List.copyOf(steps), source, lines);
  }

  /** Forecast lines a rule saw: in its moments ({@code forecast_line}) and its {@code ...Line} values. */
  private static void collectLines(JsonNode n, String key, Map<Integer, String> out) {
    if (n.isObject()) {
      for (Iterator<Map.Entry<String, JsonNode>> it = n.properties().iterator(); it.hasNext();) {
        Map.Entry<String, JsonNode> e = it.next();
        collectLines(e.getValue(), e.getKey(), out);
      }
    } else if (key != null && n.canConvertToInt() && n.isIntegralNumber()
        && (key.equals("forecast_line") || key.endsWith("Line"))) {
      out.put(n.asInt(), null);
    }
  }

  public List<Step> steps() {
    return steps;
  }

  public RunRecord run() {
    return run;
  }

  public RecordedBlock block() {
    return block;
  }

  /** The forecast lines the chain refers to, by line number, as the recorded forecast has them. */
  public Map<Integer, String> forecastLines() {
    return java.util.Collections.unmodifiableMap(forecastLines);
  }

  /** The recorded crop-profile file for the block's crop, if the run recorded one. */
  public java.util.Optional<RecordedInput> profileFile() {
    String crop = decision.crop();
    return run.inputs().stream().filter(i -> i.kind() == InputKind.CROP_PROFILE)
        .filter(i -> stem(i.name()).equals(crop)).findFirst();
  }

  private static String stem(String name) {
    String base = name.substring(name.lastIndexOf('/') + 1);
    int dot = base.lastIndexOf('.');
    return dot > 0 ? base.substring(0, dot) : base;
  }

  public String json() {
    ObjectNode root = JSON.createObjectNode();
    root.put("run", run.runId());
    root.put("ran_at", run.ranAt().toString());
    root.put("night", run.night().toString());
    root.put("block", block.blockId());
    root.put("status", block.status());
    root.put("risk", block.risk());
    root.put("protection_needed", block.protectionNeeded());
    root.set("actions", JSON.valueToTree(decision.actions()));
    ObjectNode profile = root.putObject("profile");
    profile.put("crop", decision.crop());
    profile.put("variety", decision.variety());
    profile.put("stage", decision.stage());
    profile.put("t10_c", Json.round(decision.t10C(), 2));
    profile.put("t90_c", Json.round(decision.t90C(), 2));
    profile.put("threshold_source", decision.thresholdSource());
    profile.put("target_c", Json.round(decision.targetC(), 2));
    profileFile().ifPresentOrElse(f -> profile.put("file", f.name()), () -> profile.putNull("file"));
    ArrayNode rules = root.putArray("rules");
    for (Step s : steps) {
      ObjectNode r = rules.addObject();
      r.put("seq", s.seq());
      r.put("id", s.ruleId());
      r.put("kind", s.kind());
      r.put("scope", s.farmWide() ? "farm" : "block");
      r.put("explanation", s.explanation());
      r.set("values", s.values());
    }
    ObjectNode inputs = root.putObject("inputs");
    ArrayNode lines = inputs.putArray("forecast_lines");
    forecastLines.forEach((n, text) -> {
      ObjectNode l = lines.addObject();
      l.put("line", n);
      l.put("text", text);
    });
    ArrayNode files = inputs.putArray("files");
    for (RecordedInput in : run.inputs()) {
      ObjectNode f = files.addObject();
      f.put("kind", RunReport.kindName(in.kind()));
      f.put("name", in.name());
      f.put("sha256", in.sha256());
      f.put("bytes", in.sizeBytes());
    }
    return Json.pretty(root);
  }

  /**
   * The recorded profile edits, made before this run and reaching their file, of the crop,
   * variety and stage the block's values came from: what changed the numbers this run used.
   */
  public List<RecordedEdit> editsThatShaped(List<RecordedEdit> all) {
    List<RecordedEdit> out = new ArrayList<>();
    for (RecordedEdit r : all) {
      var e = r.edit();
      if (r.applied() && !e.at().isAfter(run.ranAt()) && e.crop().equals(decision.crop())
          && decision.variety() != null && decision.variety().equals(e.variety())
          && (e.stage() == null || e.stage().equals(decision.stage()))) {
        out.add(r);
      }
    }
    return out;
  }

  public String text(UnitSystem units) {
    return text(units, List.of());
  }

  /**
   * What a person reads: the decision, the profile values and their source, the rules in firing
   * order with their explanations, the forecast lines used, the edits that changed the values,
   * and the inputs that mattered. The values each rule saw, and every input's hash, are in
   * {@link #json()}.
   */
  public String text(UnitSystem units, List<RecordedEdit> edits) {
    UnitFormat fmt = UnitFormat.of(units);
    ZoneId zone = ZoneId.of(run.zoneId());
    StringBuilder s = new StringBuilder();
    s.append("Why ").append(block.blockId()).append(" is ").append(block.status())
        .append(" (risk ").append(block.risk()).append(") on the night of ").append(run.night())
        .append('\n');
    s.append("Run ").append(run.runId()).append(", recorded ")
        .append(fmt.stamp(run.ranAt().atZone(zone).toOffsetDateTime())).append(' ').append(run.zoneId())
        .append(", farm ").append(run.farmName()).append('\n');
    s.append(block.protectionNeeded() ? "Protection planned:" : "No protection was planned.")
        .append('\n');
    for (PlanDocument.Action a : decision.actions()) {
      s.append("  ").append(action(a)).append('\n');
    }
    s.append("\nProfile: ").append(decision.crop());
    if (decision.variety() != null) {
      s.append('/').append(decision.variety());
    }
    s.append(" at ").append(decision.stage()).append(": T10 ")
        .append(fmt.temp(decision.t10C())).append(", T90 ")
        .append(fmt.temp(decision.t90C())).append(", target ")
        .append(fmt.temp(decision.targetC())).append('\n');
    s.append("  source: ").append(decision.thresholdSource()).append('\n');
    profileFile().ifPresent(f -> s.append("  from ").append(f.name()).append(" (sha256 ")
        .append(f.sha256()).append(")\n"));

    s.append("\nRules, in the order they fired:\n");
    for (Step st : steps) {
      s.append(String.format(Locale.ROOT, "  %d. %s (%s%s)%n", st.seq(), st.ruleId(),
          st.kind().isEmpty() ? "rule" : st.kind(), st.farmWide()
              ? ", farm-wide, about " + waterSource : ""));
      s.append("     ").append(st.explanation()).append('\n');
    }
    if (steps.isEmpty()) {
      s.append("  none recorded\n");
    }
    run.inputs().stream().filter(i -> i.kind() == InputKind.FORECAST).findFirst().ifPresent(f -> {
      s.append("\nForecast lines these numbers came from (").append(f.name()).append("):\n");
      forecastLines.forEach((n, text) -> s.append(String.format(Locale.ROOT, "  line %d: %s%n", n,
          text == null ? "(not in the recorded forecast)" : text)));
    });
    if (!edits.isEmpty()) {
      s.append("\nProfile edits that changed these values:\n");
      for (RecordedEdit r : edits) {
        var e = r.edit();
        s.append("  ").append(fmt.stamp(e.at().atZone(zone).toOffsetDateTime())).append(" by ")
            .append(e.by()).append(": ").append(e.field().equals("variety") ? "added the variety"
                : e.field().toUpperCase(Locale.ROOT) + " " + temp(fmt, e.beforeC()) + " → "
                    + temp(fmt, e.afterC()))
            .append(" (").append(e.note()).append(")\n");
      }
    }
    s.append("\nInputs that mattered (SHA-256; every input with --json)\n");
    for (RecordedInput in : run.inputs()) {
      boolean mattered = in.kind() == InputKind.FARM || in.kind() == InputKind.FORECAST
          || profileFile().map(f -> f.name().equals(in.name())).orElse(false);
      if (mattered) {
        s.append(String.format(Locale.ROOT, "  %-12s %s  %s%n", RunReport.kindName(in.kind()),
            in.sha256().substring(0, 12), in.name()));
      }
    }
    long rules = run.inputs().stream().filter(i -> i.kind() == InputKind.RULE).count();
    if (rules > 0) {
      s.append(String.format(Locale.ROOT, "  and %d rule file%s%n", rules, rules == 1 ? "" : "s"));
    }
    return s.toString();
  }

  private static String temp(UnitFormat fmt, Double c) {
    return c == null ? "none" : fmt.temp(c);
  }

  private static String action(PlanDocument.Action a) {
    if (a instanceof PlanDocument.Sprinkle sp && !sp.waterGranted()) {
      return "sprinklers off: no water from " + sp.source();
    }
    if (a instanceof PlanDocument.Sprinkle sp) {
      return "sprinkle from " + Json.time(sp.start()) + " to " + Json.time(sp.stop()) + " from "
          + sp.source();
    }
    PlanDocument.Cover c = (PlanDocument.Cover) a;
    return "covers on from " + Json.time(c.deployStart()) + ", off at " + Json.time(c.remove());
  }

  private static JsonNode values(String json, RunRecord run) {
    try {
      return JSON.readTree(json);
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException("run " + run.runId() + ": a recorded JSON value cannot be"
          + " read back; run 'rimeward audit verify'");
    }
  }
}
