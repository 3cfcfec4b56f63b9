package org.rimeward.plan;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.Map;
import org.rimeward.rules.FiredRule;

/**
 * The plan as JSON, always metric. This schema is stable: other tools and the audit trail read
 * it. Keys are documented in the README; new keys may be added, existing ones keep their meaning.
 */
public final class PlanJson {
  private static final ObjectMapper MAPPER = new ObjectMapper()
      .enable(SerializationFeature.INDENT_OUTPUT);
  private static final DateTimeFormatter ISO_MINUTE =
      DateTimeFormatter.ofPattern("yyyy-MM-dd'T'HH:mmXXX", Locale.ROOT);

  private PlanJson() {}

  public static ObjectMapper mapper() {
    return MAPPER;
  }

  public static String toText(Plan plan) {
    try {
      return MAPPER.writeValueAsString(toTree(plan)) + "\n";
    } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }

  public static ObjectNode toTree(Plan plan) {
    ZoneId zone = plan.night().zone();
    ObjectNode root = MAPPER.createObjectNode();
    root.put("farm", plan.farmName());
    root.put("tool_version", plan.toolVersion());
    ObjectNode night = root.putObject("night");
    night.put("date", plan.night().date().toString());
    night.put("zone", zone.getId());
    night.put("sunset", time(plan.night().sunset(), zone));
    night.put("sunrise", time(plan.night().sunrise(), zone));
    night.put("coldest_at", time(plan.night().coldestAt(), zone));
    night.put("min_air_c", round(plan.night().minAirC(), 2));
    ObjectNode policy = root.putObject("policy");
    policy.put("target", plan.policy().target());
    policy.put("start_margin_c", round(plan.policy().startMarginC(), 2));
    policy.put("stop_rule", plan.policy().stopRule());
    ArrayNode blocks = root.putArray("blocks");
    for (BlockPlan b : plan.blocks()) {
      ObjectNode o = blocks.addObject();
      o.put("block", b.blockId());
      o.put("crop", b.crop());
      o.put("variety", b.variety());
      o.put("stage", b.stage());
      o.put("t10_c", round(b.t10C(), 2));
      o.put("t90_c", round(b.t90C(), 2));
      o.put("threshold_source", b.thresholdSource());
      o.put("target_c", round(b.targetC(), 2));
      o.put("min_air_c", round(b.minAirC(), 2));
      o.put("min_bud_c", round(b.minBudC(), 2));
      o.put("min_wet_bulb_c", round(b.minWetBulbC(), 2));
      o.put("coldest_at", time(b.coldestAt(), zone));
      o.put("coldest_forecast_line", b.coldestLine());
      o.put("risk", word(b.risk()));
      o.put("kill_pct_unprotected", round(b.killPctUnprotected(), 1));
      o.put("status", word(b.status()));
      ArrayNode actions = o.putArray("actions");
      for (Action a : b.actions()) {
        ObjectNode x = actions.addObject();
        if (a instanceof Action.Sprinkle s) {
          x.put("method", "sprinkle");
          // No water, no times: a crew must not read a start and stop as "sprinkle".
          x.put("start", s.withWater() ? time(s.start(), zone) : null);
          x.put("stop", s.withWater() ? time(s.stop(), zone) : null);
          x.put("starts_at_once", s.startsAtOnce());
          x.put("required_rate_mm_h", round(s.requiredRateMmH(), 2));
          x.put("design_rate_mm_h", round(s.designRateMmH(), 2));
          x.put("installed_rate_mm_h", round(s.runRateMmH(), 2));
          x.put("flow_m3_h", round(s.flowM3H(), 1));
          x.put("area_ha", round(s.areaHa(), 2));
          x.put("water_m3", round(s.waterM3(), 1));
          x.put("wanted_flow_m3_h", round(s.wantedFlowM3H(), 1));
          x.put("wanted_water_m3", round(s.wantedWaterM3(), 1));
          x.put("source", s.source());
          x.put("water_granted", s.withWater());
          x.put("grant", word(s.grant()));
          ArrayNode sets = x.putArray("sets");
          s.sets().forEach(sets::add);
        } else if (a instanceof Action.Cover c) {
          x.put("method", "cover");
          x.put("deploy_start", time(c.deployStart(), zone));
          x.put("deploy_by", time(c.deployBy(), zone));
          x.put("remove", time(c.remove(), zone));
          x.put("protection_c", round(c.protectionC(), 2));
          x.put("sufficient", c.sufficient());
        }
      }
      ArrayNode cautions = o.putArray("cautions");
      b.cautions().forEach(c -> cautions.add(c.explanation()));
      ArrayNode rules = o.putArray("rules");
      b.rules().forEach(r -> rules.add(rule(r, zone)));
    }
    ArrayNode water = root.putArray("water");
    for (WaterEntry w : plan.water()) {
      ObjectNode o = water.addObject();
      o.put("source", w.source());
      o.put("peak_flow_m3_h", round(w.peakFlowM3H(), 1));
      o.put("wanted_peak_flow_m3_h", round(w.wantedPeakFlowM3H(), 1));
      o.put("max_flow_m3_h", round(w.maxFlowM3H(), 1));
      o.put("volume_m3", round(w.volumeM3(), 1));
      o.put("wanted_volume_m3", round(w.wantedVolumeM3(), 1));
      if (Double.isNaN(w.availableM3())) {
        o.putNull("available_m3");
      } else {
        o.put("available_m3", round(w.availableM3(), 1));
      }
      o.put("short", w.isShortOfWater());
      ArrayNode served = o.putArray("served");
      w.served().forEach(served::add);
      ArrayNode part = o.putArray("part");
      w.part().forEach(part::add);
      ArrayNode without = o.putArray("without");
      w.without().forEach(without::add);
    }
    ArrayNode cautions = root.putArray("cautions");
    plan.cautions().forEach(cautions::add);
    ArrayNode farmRules = root.putArray("farm_rules");
    plan.trail().stream().filter(r -> r.blockId() == null).forEach(r -> farmRules.add(rule(r, zone)));
    return root;
  }

  static ObjectNode rule(FiredRule r, ZoneId zone) {
    ObjectNode o = MAPPER.createObjectNode();
    o.put("seq", r.seq());
    o.put("id", r.ruleId());
    o.put("kind", r.kind());
    o.put("explanation", r.explanation());
    ObjectNode values = o.putObject("values");
    for (Map.Entry<String, Object> e : r.values().entrySet()) {
      values.set(e.getKey(), value(e.getValue(), zone));
    }
    return o;
  }

  private static com.fasterxml.jackson.databind.JsonNode value(Object v, ZoneId zone) {
    var f = MAPPER.getNodeFactory();
    if (v == null) {
      return f.nullNode();
    }
    if (v instanceof org.rimeward.rules.facts.Moment m) {
      ObjectNode o = MAPPER.createObjectNode();
      o.put("at", time(m.at(), zone));
      o.put("value", round(m.value(), 2));
      o.put("forecast_line", m.line());
      return o;
    }
    if (v instanceof Instant t) {
      return f.textNode(time(t, zone));
    }
    if (v instanceof Integer || v instanceof Long) {
      return f.numberNode(((Number) v).longValue());
    }
    if (v instanceof Number n) {
      double d = n.doubleValue();
      return Double.isFinite(d) ? f.numberNode(round(d, 3)) : f.nullNode();
    }
    if (v instanceof Boolean b) {
      return f.booleanNode(b);
    }
    if (v instanceof Enum<?> e) {
      return f.textNode(word(e));
    }
    return f.textNode(v.toString());
  }

  static String time(Instant t, ZoneId zone) {
    return t == null ? null : ISO_MINUTE.format(t.atZone(zone));
  }

  static String word(Enum<?> e) {
    return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }

  static BigDecimal round(double v, int decimals) {
    BigDecimal d = BigDecimal.valueOf(v).setScale(decimals, RoundingMode.HALF_UP);
    return d.signum() == 0 ? d.abs() : d;
  }
}
