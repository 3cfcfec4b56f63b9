package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/**
 * A recorded run rendered for a person, a program (JSON) or a spreadsheet (CSV). Everything comes
 * from the record: the plan document as the planner wrote it, and the rules as they fired.
 */
public final class RunReport {
  /** The CSV columns, one row per block action (a block with no action gets one row, "none"). */
  public static final List<String> CSV_HEADER = List.of("run_id", "night", "block", "crop",
      "stage", "status", "risk", "method", "start", "stop", "water_m3", "source", "first_rule",
      "done_start", "done_stop");

  private static final ObjectMapper JSON = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT);
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);
  private static final DateTimeFormatter STAMP =
      DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss", Locale.ROOT);

  private RunReport() {}

  /** The run as JSON: metadata, the policy, every input's hash and size, and the plan itself. */
  public static String json(RunRecord run) {
    ObjectNode root = JSON.createObjectNode();
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
    root.set("plan", parseOrText(run.planJson()));
    try {
      return JSON.writeValueAsString(root) + "\n";
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }

  /** One CSV row per block action, from the recorded plan, with {@link #CSV_HEADER}. */
  public static String csv(RunRecord run) {
    return csv(run, List.of());
  }

  /**
   * As {@link #csv(RunRecord)}, with what the crew recorded beside each advised action:
   * {@code done_start} and {@code done_stop} (empty when nothing was recorded).
   */
  public static String csv(RunRecord run, List<CrewAction> actions) {
    java.time.ZoneId zone = java.time.ZoneId.of(run.zoneId());
    JsonNode plan = parsePlan(run);
    StringWriter out = new StringWriter();
    try (CSVPrinter p = new CSVPrinter(out, CSVFormat.DEFAULT.builder()
        .setHeader(CSV_HEADER.toArray(String[]::new)).get())) {
      for (JsonNode b : plan.path("blocks")) {
        String firstRule = b.path("rules").path(0).path("id").asText("");
        String id = b.path("block").asText();
        if (firstRule.isEmpty()) {
          firstRule = run.block(id).flatMap(rb -> rb.rules().stream().findFirst())
              .map(RecordedRule::ruleId).orElse("");
        }
        List<String> head = List.of(run.runId(), run.night().toString(), id,
            b.path("crop").asText(""), b.path("stage").asText(""), b.path("status").asText(""),
            b.path("risk").asText(""));
        if (b.path("actions").isEmpty()) {
          p.printRecord(concat(head, List.of("none", "", "", "", "", firstRule, "", "")));
        }
        for (JsonNode a : b.path("actions")) {
          boolean cover = "cover".equals(a.path("method").asText());
          p.printRecord(concat(head, List.of(a.path("method").asText(""),
              a.path(cover ? "deploy_start" : "start").asText(""),
              a.path(cover ? "remove" : "stop").asText(""),
              a.path("water_m3").isNumber() ? a.path("water_m3").asText() : "",
              a.path("source").asText(""), firstRule,
              CrewReport.doneTimes(id, a.path("method").asText(""), actions, zone)[0],
              CrewReport.doneTimes(id, a.path("method").asText(""), actions, zone)[1])));
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  /** A readable summary: the night, each block's decision and actions, rules, cautions, inputs. */
  public static String text(RunRecord run, UnitSystem units) {
    JsonNode plan = parsePlan(run);
    ZoneId zone = ZoneId.of(run.zoneId());
    StringBuilder s = new StringBuilder();
    s.append("Run ").append(run.runId()).append('\n');
    s.append("Recorded ").append(STAMP.format(run.ranAt().atZone(zone))).append(' ')
        .append(run.zoneId()).append(" by rimeward ").append(run.toolVersion())
        .append(", farm ").append(run.farmName()).append('\n');
    JsonNode night = plan.path("night");
    s.append("Night of ").append(run.night());
    if (night.has("sunset") || night.has("sunrise")) {
      s.append(": sunset ").append(clock(night.path("sunset"))).append(", sunrise ")
          .append(clock(night.path("sunrise")));
    }
    s.append("\n");
    for (JsonNode b : plan.path("blocks")) {
      String id = b.path("block").asText();
      s.append('\n').append(id).append(" (").append(join(" ", b.path("crop").asText(""),
          b.path("variety").asText(""))).append(", ").append(b.path("stage").asText("?"))
          .append("): ").append(b.path("status").asText("?")).append(", risk ")
          .append(b.path("risk").asText("?")).append('\n');
      s.append("  coldest ").append(clock(b.path("coldest_at"))).append(": air ")
          .append(temp(b.path("min_air_c"), units)).append(", bud ")
          .append(temp(b.path("min_bud_c"), units)).append(", wet-bulb ")
          .append(temp(b.path("min_wet_bulb_c"), units)).append("; T10 ")
          .append(temp(b.path("t10_c"), units)).append(", T90 ")
          .append(temp(b.path("t90_c"), units)).append(", target ")
          .append(temp(b.path("target_c"), units)).append('\n');
      if (b.path("kill_pct_unprotected").isNumber()) {
        s.append("  expected bud kill if unprotected: ")
            .append(String.format(Locale.ROOT, "%.0f %%", b.path("kill_pct_unprotected").asDouble()))
            .append('\n');
      }
      if (b.path("actions").isEmpty()) {
        s.append("  no action\n");
      }
      for (JsonNode a : b.path("actions")) {
        s.append("  ").append(action(a, units)).append('\n');
      }
      for (JsonNode c : b.path("cautions")) {
        s.append("  caution: ").append(c.asText()).append('\n');
      }
      List<RecordedRule> fired = run.block(id).map(RecordedBlock::rules).orElse(List.of());
      if (!fired.isEmpty()) {
        s.append("  rules fired, in order:\n");
        for (RecordedRule r : fired) {
          s.append("    ").append(r.seq()).append(". ").append(r.ruleId()).append(": ")
              .append(r.explanation()).append('\n');
        }
      } else if (!b.path("rules").isEmpty()) {
        s.append("  rules:\n");
        for (JsonNode r : b.path("rules")) {
          s.append("    ").append(r.path("id").asText()).append(": ")
              .append(r.path("explanation").asText()).append('\n');
        }
      }
    }
    if (!plan.path("water").isEmpty()) {
      s.append("\nWater\n");
      for (JsonNode w : plan.path("water")) {
        s.append("  ").append(w.path("source").asText("?")).append(": ")
            .append(qty(w.path("volume_m3"), Dimension.VOLUME, units, 0)).append(" needed of ")
            .append(qty(w.path("available_m3"), Dimension.VOLUME, units, 0))
            .append(" available; peak flow ")
            .append(qty(w.path("peak_flow_m3_h"), Dimension.FLOW, units, 0)).append(" of ")
            .append(qty(w.path("max_flow_m3_h"), Dimension.FLOW, units, 0))
            .append(w.path("short").asBoolean(false) ? " -- SHORT" : "").append('\n');
      }
    }
    if (!plan.path("farm_rules").isEmpty()) {
      s.append("\nFarm-wide rules, in order\n");
      for (JsonNode r : plan.path("farm_rules")) {
        s.append("    ").append(r.path("seq").asText("?")).append(". ")
            .append(r.path("id").asText("?")).append(": ").append(r.path("explanation").asText(""))
            .append('\n');
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

  private static String action(JsonNode a, UnitSystem units) {
    String method = a.path("method").asText("?");
    if ("cover".equals(method)) {
      return "cover: deploy from " + clock(a.path("deploy_start")) + ", on by "
          + clock(a.path("deploy_by")) + ", remove at " + clock(a.path("remove"));
    }
    if ("sprinkle".equals(method)) {
      return "sprinkle " + clock(a.path("start")) + " to " + clock(a.path("stop")) + ": "
          + qty(a.path("required_rate_mm_h"), Dimension.RATE, units, 1) + " needed, "
          + qty(a.path("installed_rate_mm_h"), Dimension.RATE, units, 1) + " installed, "
          + qty(a.path("water_m3"), Dimension.VOLUME, units, 0) + " from "
          + a.path("source").asText("?");
    }
    return method + ": " + a;
  }

  private static String temp(JsonNode n, UnitSystem units) {
    return qty(n, Dimension.TEMPERATURE, units, 1);
  }

  private static String qty(JsonNode n, Dimension dim, UnitSystem units, int decimals) {
    // Acre-feet and inches per hour are large units: whole numbers would hide the answer.
    if ((dim == Dimension.VOLUME || dim == Dimension.RATE) && units == UnitSystem.US) {
      decimals = 2;
    }
    return n.isNumber() ? Quantities.format(n.asDouble(), dim, units, decimals) : "?";
  }

  private static String clock(JsonNode n) {
    if (!n.isTextual()) {
      return "?";
    }
    try {
      return CLOCK.format(OffsetDateTime.parse(n.asText()));
    } catch (DateTimeParseException e) {
      return n.asText();
    }
  }

  private static String join(String sep, String... parts) {
    return String.join(sep, java.util.Arrays.stream(parts).filter(p -> !p.isEmpty()).toList());
  }

  private static List<String> concat(List<String> a, List<String> b) {
    return java.util.stream.Stream.concat(a.stream(), b.stream()).toList();
  }

  static String kindName(InputKind kind) {
    return kind.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  private static JsonNode parsePlan(RunRecord run) {
    JsonNode plan = parseOrText(run.planJson());
    if (!plan.isObject()) {
      throw new AuditIntegrityException("run " + run.runId() + ": its recorded plan is not a JSON"
          + " object; show it with --json to see the text as recorded");
    }
    return plan;
  }

  private static JsonNode parseOrText(String json) {
    try {
      return JSON.readTree(json);
    } catch (JsonProcessingException e) {
      return JSON.getNodeFactory().textNode(json);
    }
  }
}
