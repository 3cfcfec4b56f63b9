package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.rimeward.io.BadInputException;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/**
 * Why a block was (or was not) protected in a recorded run: the rules that fired for it in firing
 * order with the numbers each saw, the farm-wide rules about the water source it draws on, and the
 * inputs those numbers came from (the forecast lines quoted from the recorded forecast, the crop
 * profile value and its source, every input file's hash). Everything is read from the record.
 */
public final class BlockWhy {
  private static final ObjectMapper JSON = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT);
  private static final DateTimeFormatter STAMP =
      DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss", Locale.ROOT);

  /** One rule in the chain; {@code farmWide} for a rule that matched no block. */
  public record Step(int seq, String ruleId, String kind, String explanation, JsonNode values,
      boolean farmWide) {}

  private final RunRecord run;
  private final RecordedBlock block;
  private final JsonNode decision;
  private final List<Step> steps;
  private final String waterSource;
  private final Map<Integer, String> forecastLines;

  private BlockWhy(RunRecord run, RecordedBlock block, JsonNode decision, List<Step> steps,
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
    JsonNode decision = read(block.decisionJson(), run);
    JsonNode plan = read(run.planJson(), run);
    Map<Integer, String> kinds = new TreeMap<>();
    for (JsonNode r : decision.path("rules")) {
      kinds.put(r.path("seq").asInt(), r.path("kind").asText(""));
    }
    List<Step> steps = new ArrayList<>();
    for (RecordedRule r : block.rules()) {
      steps.add(new Step(r.seq(), r.ruleId(), kinds.getOrDefault(r.seq(), ""), r.explanation(),
          read(r.factsJson(), run), false));
    }
    String source = null;
    for (JsonNode a : decision.path("actions")) {
      if (a.path("source").isTextual()) {
        source = a.path("source").asText();
      }
    }
    if (source != null) {
      for (JsonNode r : plan.path("farm_rules")) {
        if (concerns(r.path("values"), source)) {
          steps.add(new Step(r.path("seq").asInt(), r.path("id").asText(),
              r.path("kind").asText(""), r.path("explanation").asText(""), r.path("values"), true));
        }
      }
    }
    steps.sort(Comparator.comparingInt(Step::seq));
    Map<Integer, String> lines = new TreeMap<>();
    if (decision.path("coldest_forecast_line").canConvertToInt()) {
      lines.put(decision.path("coldest_forecast_line").asInt(), null);
    }
    for (Step s : steps) {
      collectLines(s.values(), null, lines);
    }
    if (!lines.isEmpty()) {
      lines.put(1, null); // the header, naming the columns of the lines quoted
    }
    String[] forecast = run.inputs().stream().filter(i -> i.kind() == InputKind.FORECAST)
        .findFirst().map(i -> i.text().split("\r?\n", -1)).orElse(new String[0]);
    lines.replaceAll((n, v) -> n >= 1 && n <= forecast.length ? forecast[n - 1] : null);
    return new BlockWhy(run, block, decision, List.copyOf(steps), source, lines);
  }

  /** A farm-wide rule is about the source when one of its {@code ...sourceId} values names it. */
  private static boolean concerns(JsonNode values, String source) {
    for (Iterator<Map.Entry<String, JsonNode>> it = values.fields(); it.hasNext();) {
      Map.Entry<String, JsonNode> e = it.next();
      String k = e.getKey();
      if ((k.equals("sourceId") || k.endsWith(".sourceId")) && source.equals(e.getValue().asText())) {
        return true;
      }
    }
    return false;
  }

  /** Forecast lines a rule saw: in its moments ({@code forecast_line}) and its {@code ...Line} values. */
  private static void collectLines(JsonNode n, String key, Map<Integer, String> out) {
    if (n.isObject()) {
      for (Iterator<Map.Entry<String, JsonNode>> it = n.fields(); it.hasNext();) {
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
    String crop = decision.path("crop").asText("");
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
    root.set("actions", decision.path("actions").deepCopy());
    ObjectNode profile = root.putObject("profile");
    for (String k : List.of("crop", "variety", "stage", "t10_c", "t90_c", "threshold_source",
        "target_c")) {
      profile.set(k, decision.path(k).isMissingNode() ? JSON.nullNode() : decision.get(k));
    }
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
    try {
      return JSON.writeValueAsString(root) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }

  public String text(UnitSystem units) {
    ZoneId zone = ZoneId.of(run.zoneId());
    StringBuilder s = new StringBuilder();
    s.append("Why ").append(block.blockId()).append(" is ").append(block.status())
        .append(" (risk ").append(block.risk()).append(") on the night of ").append(run.night())
        .append('\n');
    s.append("Run ").append(run.runId()).append(", recorded ")
        .append(STAMP.format(run.ranAt().atZone(zone))).append(' ').append(run.zoneId())
        .append(", farm ").append(run.farmName()).append('\n');
    s.append(block.protectionNeeded() ? "Protection planned:" : "No protection was planned.")
        .append('\n');
    for (JsonNode a : decision.path("actions")) {
      s.append("  ").append(action(a)).append('\n');
    }
    s.append("\nProfile: ").append(decision.path("crop").asText("?"));
    if (decision.path("variety").isTextual()) {
      s.append('/').append(decision.path("variety").asText());
    }
    s.append(" at ").append(decision.path("stage").asText("?")).append(": T10 ")
        .append(temp(decision.path("t10_c"), units)).append(", T90 ")
        .append(temp(decision.path("t90_c"), units)).append(", target ")
        .append(temp(decision.path("target_c"), units)).append('\n');
    s.append("  source: ").append(decision.path("threshold_source").asText("?")).append('\n');
    profileFile().ifPresent(f -> s.append("  from ").append(f.name()).append(" (sha256 ")
        .append(f.sha256()).append(")\n"));

    s.append("\nRules, in the order they fired:\n");
    for (Step st : steps) {
      s.append(String.format(Locale.ROOT, "  %d. %s (%s%s)%n", st.seq(), st.ruleId(),
          st.kind().isEmpty() ? "rule" : st.kind(), st.farmWide()
              ? ", farm-wide, about " + waterSource : ""));
      s.append("     ").append(st.explanation()).append('\n');
      if (st.values().size() > 0) {
        s.append("     saw: ").append(values(st.values())).append('\n');
      }
    }
    if (steps.isEmpty()) {
      s.append("  none recorded\n");
    }
    run.inputs().stream().filter(i -> i.kind() == InputKind.FORECAST).findFirst().ifPresent(f -> {
      s.append("\nForecast lines these numbers came from (").append(f.name()).append("):\n");
      forecastLines.forEach((n, text) -> s.append(String.format(Locale.ROOT, "  line %d: %s%n", n,
          text == null ? "(not in the recorded forecast)" : text)));
    });
    s.append("\nInputs (SHA-256)\n");
    for (RecordedInput in : run.inputs()) {
      s.append(String.format(Locale.ROOT, "  %-12s %s  %s%n", RunReport.kindName(in.kind()),
          in.sha256(), in.name()));
    }
    return s.toString();
  }

  private static String values(JsonNode values) {
    List<String> parts = new ArrayList<>();
    for (Iterator<Map.Entry<String, JsonNode>> it = values.fields(); it.hasNext();) {
      Map.Entry<String, JsonNode> e = it.next();
      JsonNode v = e.getValue();
      String shown;
      if (v.isObject() && v.has("forecast_line")) {
        shown = v.path("value").asText() + " at " + v.path("at").asText() + " (forecast line "
            + v.path("forecast_line").asText() + ")";
      } else {
        shown = v.isTextual() ? v.asText() : v.toString();
      }
      parts.add(e.getKey() + " = " + shown);
    }
    return String.join("; ", parts);
  }

  private static String action(JsonNode a) {
    if ("sprinkle".equals(a.path("method").asText())) {
      return "sprinkle from " + a.path("start").asText("?") + " to " + a.path("stop").asText("?")
          + " from " + a.path("source").asText("?")
          + (a.path("water_granted").asBoolean(true) ? "" : " (no water left for it)");
    }
    if ("cover".equals(a.path("method").asText())) {
      return "covers on from " + a.path("deploy_start").asText("?") + ", off at "
          + a.path("remove").asText("?");
    }
    return a.toString();
  }

  private static String temp(JsonNode n, UnitSystem units) {
    return n.isNumber() ? Quantities.format(n.asDouble(), Dimension.TEMPERATURE, units, 1) : "?";
  }

  private static JsonNode read(String json, RunRecord run) {
    try {
      return JSON.readTree(json);
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException("run " + run.runId() + ": a recorded JSON value cannot be"
          + " read back; run 'rimeward audit verify'");
    }
  }
}
