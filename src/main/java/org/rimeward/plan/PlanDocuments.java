package org.rimeward.plan;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rimeward.io.Json;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.facts.Measure;
import org.rimeward.rules.facts.Moment;
import org.rimeward.rules.facts.NightSeries;
import org.rimeward.water.Stake;

/**
 * Makes the {@link PlanDocument} of a plan: times in the farm's zone to the minute, enums as
 * lower-case words, the farm-wide rules apart from each block's.
 */
public final class PlanDocuments {
  private PlanDocuments() {}

  /**
   * The document as it reads back from its JSON, numbers rounded as written: what a recorded
   * run gives its renderers. The HTML page takes this one, so a recorded run's page is tonight's
   * page exactly; the text and CSV take {@link #of}, so that a whole number of cubic metres is
   * rounded once, from the plan's own figure.
   */
  public static PlanDocument canonical(Plan plan) {
    return PlanJson.read(Json.compact(of(plan)));
  }

  /** The document with the plan's numbers unrounded; JSON rounds them as it writes. */
  public static PlanDocument of(Plan plan) {
    ZoneId zone = plan.night().zone();
    NightSummary n = plan.night();
    PlanDocument.Night night = new PlanDocument.Night(n.date(), zone.getId(),
        time(n.sunset(), zone), time(n.sunrise(), zone), time(n.coldestAt(), zone), n.minAirC());
    PlanDocument.Policy policy = new PlanDocument.Policy(plan.policy().target(),
        plan.policy().startMarginC(), plan.policy().stopRule());
    List<PlanDocument.Block> blocks = new ArrayList<>();
    for (BlockPlan b : plan.blocks()) {
      blocks.add(block(b, zone));
    }
    List<PlanDocument.Water> water = new ArrayList<>();
    for (WaterEntry w : plan.water()) {
      water.add(new PlanDocument.Water(
          w.source(),
          w.peakFlowM3H(),
          w.wantedPeakFlowM3H(),
          w.maxFlowM3H(),
          w.volumeM3(),
          w.wantedVolumeM3(),
          Double.isNaN(w.availableM3()) ? null : w.availableM3(),
          w.isShortOfWater(),
          w.served(),
          w.part(),
          w.without()));
    }
    List<PlanDocument.Rule> farmRules = plan.trail().stream().filter(r -> r.blockId() == null)
        .map(r -> rule(r, zone)).toList();
    NightUpdate u = plan.update();
    PlanDocument.Inputs inputs = inputs(plan.inputs());
    if (u == null) {
      return new PlanDocument(plan.farmName(), plan.toolVersion(), night, policy, inputs, blocks,
          water, plan.cautions(), farmRules, Timeline.of(plan, blocks));
    }
    return new PlanDocument(plan.farmName(), plan.toolVersion(), night, policy, inputs, blocks,
        water, plan.cautions(), farmRules, Timeline.of(plan, blocks), time(u.now(), zone),
        NightUpdateView.readings(u, zone),
        NightUpdateView.changes(u));
  }

  static PlanDocument.Inputs inputs(PlanInputs in) {
    PlanInputs.Fetched f = in.forecast().fetched();
    PlanDocument.Fetched fetched = f == null ? null : new PlanDocument.Fetched(f.source(), f.url(),
        f.fetchedAt().toString(), f.sha256(), f.unchanged());
    return new PlanDocument.Inputs(
        new PlanDocument.Forecast(in.forecast().file(), in.forecast().format(), in.forecast().notes(), fetched),
        folder(in.cropProfiles()), folder(in.rules()));
  }

  private static PlanDocument.Folder folder(PlanInputs.Folder f) {
    return new PlanDocument.Folder(f.origin().label(), f.shown(), f.sha256());
  }

  private static PlanDocument.Block block(BlockPlan b, ZoneId zone) {
    java.util.Optional<AlarmReading> alarm = b.sprinkle().filter(s -> !s.withWater()).isPresent()
        ? java.util.Optional.empty() : b.alarm();
    List<PlanDocument.Action> actions = new ArrayList<>();
    for (Action a : b.actions()) {
      if (a instanceof Action.Sprinkle s) {
        // No water, no times: a crew must not read a start and stop as "sprinkle". That holds for
        // a run that is not advised too: its need and rates are kept for the manager to weigh.
        boolean times = s.withWater();
        actions.add(new PlanDocument.Sprinkle(
            times ? time(s.start(), zone) : null,
            times ? time(s.stop(), zone) : null,
            s.startsAtOnce(),
            s.requiredRateMmH(),
            s.designRateMmH(),
            s.runRateMmH(),
            s.flowM3H(),
            s.areaHa(),
            s.waterM3(),
            s.wantedFlowM3H(),
            s.wantedWaterM3(),
            s.source(),
            s.withWater(),
            word(s.grant()),
            s.sets(),
            s.advised()));
      } else if (a instanceof Action.Cover c) {
        actions.add(new PlanDocument.Cover(time(c.deployStart(), zone), time(c.deployBy(), zone),
            time(c.remove(), zone), c.protectionC(), c.sufficient()));
      }
    }
    return new PlanDocument.Block(
        b.blockId(),
        b.crop(),
        b.variety(),
        b.stage(),
        b.stageName(),
        b.t10C(),
        b.t90C(),
        b.thresholdSource(),
        b.targetC(),
        b.minAirC(),
        b.minBudC(),
        b.minWetBulbC(),
        time(b.coldestAt(), zone),
        b.coldestLine(),
        word(b.risk()),
        b.killPctUnprotected(),
        word(b.status()),
        b.sprinkling().flatMap(sp -> sp.requiredRateMmH().isPresent()
            ? java.util.Optional.of(sp.requiredRateMmH().getAsDouble()) : java.util.Optional.<Double>empty())
            .orElse(null),
        b.sprinkling().map(Sprinkling::installedRateMmH).orElse(null),
        b.sprinkling().flatMap(Sprinkling::advised).orElse(null),
        b.sprinkling().filter(sp -> sp.advised().isPresent())
            .map(sp -> sp.notAdvised().stream().map(Sprinkling.Reason::word).toList()).orElse(null),
        b.alarm().map(AlarmReading::startAirC).orElse(null),
        b.alarm().map(AlarmReading::startWetBulbC).orElse(null),
        // No alarm for sprinklers that stay off: it would read as "get ready to sprinkle".
        alarm.map(AlarmReading::alarmAirC).orElse(null),
        alarm.map(a -> time(a.alarmAt(), zone)).orElse(null),
        b.coldAirOffsetC(),
        actions,
        b.cautions().stream().map(FiredRule::explanation).toList(),
        b.rules().stream().map(r -> rule(r, zone)).toList(),
        b.atRisk() ? series(b.series(), zone) : List.of());
  }

  private static List<PlanDocument.Step> series(NightSeries s, ZoneId zone) {
    List<PlanDocument.Step> out = new ArrayList<>(s.size());
    for (int i = 0; i < s.size(); i++) {
      out.add(new PlanDocument.Step(time(s.timeAt(i), zone), s.lineAt(i),
          s.valueAt(Measure.AIR_C, i), s.valueAt(Measure.DRY_BUD_C, i),
          s.valueAt(Measure.WET_BUD_C, i), s.valueAt(Measure.WET_BULB_C, i),
          s.valueAt(Measure.WIND_2M_MS, i), s.valueAt(Measure.WIND_10M_MS, i),
          // The need is unknown (NaN) only where the balance cannot give it; written as null.
          Double.isNaN(s.valueAt(Measure.REQUIRED_RATE_MM_H, i)) ? null
              : s.valueAt(Measure.REQUIRED_RATE_MM_H, i)));
    }
    return out;
  }

  static PlanDocument.Rule rule(FiredRule r, ZoneId zone) {
    ObjectNode values = JsonNodeFactory.instance.objectNode();
    for (Map.Entry<String, Object> e : r.values().entrySet()) {
      values.set(e.getKey(), value(e.getValue(), zone));
    }
    return new PlanDocument.Rule(r.seq(), r.ruleId(), r.kind(), r.explanation(), values);
  }

  private static JsonNode value(Object v, ZoneId zone) {
    JsonNodeFactory f = JsonNodeFactory.instance;
    if (v == null) {
      return f.nullNode();
    }
    if (v instanceof Moment m) {
      ObjectNode o = f.objectNode();
      o.put("at", Json.time(time(m.at(), zone)));
      o.put("value", Json.round(m.value(), 2));
      o.put("forecast_line", m.line());
      return o;
    }
    if (v instanceof Instant t) {
      return f.textNode(Json.time(time(t, zone)));
    }
    if (v instanceof Stake st) {
      // Six significant figures: hectares saved per m³ are thousandths, which three decimals lose.
      ObjectNode o = f.objectNode();
      o.put("per_m3", new java.math.BigDecimal(st.perM3()).round(new java.math.MathContext(6)).doubleValue());
      o.put("by_value", st.byValue());
      return o;
    }
    if (v instanceof Integer || v instanceof Long) {
      return f.numberNode(((Number) v).longValue());
    }
    if (v instanceof Number n) {
      double d = n.doubleValue();
      return Double.isFinite(d) ? f.numberNode(Json.round(d, 3)) : f.nullNode();
    }
    if (v instanceof Boolean b) {
      return f.booleanNode(b);
    }
    if (v instanceof Enum<?> e) {
      return f.textNode(word(e));
    }
    return f.textNode(v.toString());
  }

  /** The local time of {@code t} in {@code zone}, to the minute, as the plan shows times. */
  static OffsetDateTime time(Instant t, ZoneId zone) {
    return t == null ? null : t.atZone(zone).toOffsetDateTime().truncatedTo(ChronoUnit.MINUTES);
  }

  /** An enum constant as the plan writes it: {@code SHORT_OF_WATER} as {@code short-of-water}. */
  public static String word(Enum<?> e) {
    return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }
}
