package org.rimeward.report;

import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanText;
import org.rimeward.plan.StandingCautions;
import org.rimeward.plan.Timeline;
import org.rimeward.units.UnitFormat;

/**
 * The night as a page: the model the {@code night} template shows, made from a plan document,
 * tonight's or a recorded one. Everything a person reads is already in words and in the chosen
 * units here; the template only lays it out.
 */
public final class NightPage {
  /** What a filed copy needs to be checked against the trail later. */
  public record Footer(String runId, String recordedAt, String toolVersion, List<Input> inputs,
      long headSeq, String headHash, String madeAt) {
    public Footer {
      inputs = List.copyOf(inputs);
    }
  }

  /** One input of a recorded run, by its hash. */
  public record Input(String kind, String name, String sha256) {}

  /** The page. */
  public record Model(String title, String farm, String night, String zone, String sunset,
      String sunrise, String coldest, String readings, String units, List<String> cautions,
      List<TimelineRow> timeline, List<BlockView> atRisk,
      List<BlockView> quiet, List<WaterView> water, Footer footer) {
    public boolean hasFooter() {
      return footer != null;
    }

    public boolean hasTimeline() {
      return !timeline.isEmpty();
    }

    public boolean hasQuiet() {
      return !quiet.isEmpty();
    }
  }

  /**
   * One block: its decision in words, its chart when at risk, its rules folded.
   *
   * @param start the start of sprinkling as a clock time, or empty
   * @param done what the crew recorded as done for the block, marked as such
   */
  public record BlockView(String id, String crop, String risk, String status,
      List<String> actions, String start, String svg, List<RuleView> rules,
      List<String> cautions, List<String> done) {
    public boolean hasChart() {
      return svg != null && !svg.isEmpty();
    }

    public boolean hasDone() {
      return !done.isEmpty();
    }

    public int ruleCount() {
      return rules.size();
    }
  }

  /**
   * One moment of the night at a glance: its clock time (marked when it was due before the
   * forecast starts or the re-plan was made), the block or water source, and what to do.
   */
  public record TimelineRow(String at, String who, String what, boolean past, String event) {}

  /** One rule that fired, in words with its numbers. */
  public record RuleView(String id, String kind, String words) {}

  /** One water source: its figures in words and its chart. */
  public record WaterView(String source, String summary, String svg) {}

  private NightPage() {}

  /**
   * The page of {@code plan}.
   *
   * @param words each rule's explanation in the page's units
   * @param done what the crew recorded for each block, in words; empty when nothing
   * @param footer the recorded run's facts; null for tonight's plan, not yet recorded
   */
  public static Model of(PlanDocument plan, UnitFormat fmt, Function<PlanDocument.Rule, String> words,
      Map<String, List<String>> done, Footer footer) {
    ZoneId zone = plan.zone();
    PlanDocument.Night n = plan.night();
    List<String> cautions = new ArrayList<>();
    for (PlanDocument.Block b : plan.blocks()) {
      b.cautionRules().forEach(c -> cautions.add(b.block() + ": " + words.apply(c)));
    }
    plan.farmRules().stream().filter(PlanDocument.Rule::isCaution)
        .forEach(c -> cautions.add(words.apply(c)));
    cautions.addAll(StandingCautions.ALL);
    List<BlockView> atRisk = new ArrayList<>();
    List<BlockView> quiet = new ArrayList<>();
    for (PlanDocument.Block b : plan.blocks()) {
      boolean chart = b.atRisk() && !b.series().isEmpty();
      BlockView v = new BlockView(b.block(),
          b.crop() + (b.variety() != null ? " " + b.variety() : "") + ", "
              + (b.stageName() != null ? b.stageName() : b.stage()),
          b.risk() + (b.killPctUnprotected() >= 1
              ? String.format(Locale.ROOT, " (%.0f %% kill if unprotected)", b.killPctUnprotected())
              : ""),
          PlanText.statusWord(b),
          b.actions().stream().map(a -> PlanText.action(a, fmt)).toList(),
          b.sprinkle().filter(s -> s.waterGranted() && s.start() != null)
              .map(s -> fmt.clock(s.start())).orElse(""),
          chart ? blockChart(plan, b, fmt, zone) : "",
          b.rules().stream().map(r -> new RuleView(r.id(), r.kind(), words.apply(r))).toList(),
          b.cautionRules().stream().map(words).toList(),
          done.getOrDefault(b.block(), List.of()));
      (b.atRisk() ? atRisk : quiet).add(v);
    }
    List<WaterView> water = new ArrayList<>();
    for (PlanDocument.Water w : plan.water()) {
      String summary = "peak " + fmt.flow(w.peakFlowM3H()) + " of " + fmt.flow(w.maxFlowM3H())
          + "; " + fmt.volume(w.volumeM3()) + " of "
          + (w.availableM3() == null ? "no volume limit" : fmt.volume(w.availableM3()))
          + (w.shortOfWater() ? "; SHORT" + (w.without().isEmpty() ? ""
              : ", without water: " + String.join(", ", w.without())) : "; enough");
      water.add(new WaterView(w.source(), summary, NightCharts.water(plan, w, fmt, zone)));
    }
    return new Model("Frost plan: " + plan.farm() + ", night of " + n.date(), plan.farm(),
        n.date().toString(), n.zone(), fmt.dayClock(n.sunset()), fmt.dayClock(n.sunrise()),
        fmt.temp(n.minAirC()) + " at " + fmt.dayClock(n.coldestAt()), readings(plan, fmt),
        fmt.symbol(org.rimeward.units.Dimension.TEMPERATURE), cautions, timeline(plan, fmt),
        atRisk, quiet, water, footer);
  }

  /** The plan's timeline in the page's units, as the text plan gives it first. */
  static List<TimelineRow> timeline(PlanDocument plan, UnitFormat fmt) {
    List<String> words = Timeline.words(plan, fmt);
    List<TimelineRow> rows = new ArrayList<>();
    for (int i = 0; i < plan.timeline().size(); i++) {
      PlanDocument.TimelineEntry e = plan.timeline().get(i);
      rows.add(new TimelineRow(fmt.clock(e.at()), e.block() != null ? e.block()
          : e.source() != null ? e.source() : "", words.get(i), e.past(), e.event()));
    }
    return rows;
  }

  /** A re-plan's readings in one line; empty for a plan made at dusk. */
  static String readings(PlanDocument plan, UnitFormat fmt) {
    PlanDocument.Readings r = plan.readings();
    if (r == null || plan.now() == null) {
      return "";
    }
    List<org.rimeward.plan.StationReadings> several = r.stations().stream()
        .filter(st -> !st.blocks().isEmpty()).toList();
    if (several.size() > 1) {
      // Each station corrected its own blocks: say each one's offset and whether it went quiet.
      return "Re-planned at " + fmt.dayClock(plan.now()) + " from the stations' readings ("
          + r.file() + "; " + String.join("; ", several.stream().map(st -> "station " + st.id()
              + " last " + fmt.clock(st.lastAt()) + (st.biasC() != null ? ", air "
              + fmt.tempDelta(st.biasC()) + " against the forecast" : "") + (st.stale()
              ? ", NO reading in the last hour" : "")).toList()) + ")";
    }
    return "Re-planned at " + fmt.dayClock(plan.now()) + " from the station's readings ("
        + r.file() + (r.station() != null ? ", station " + r.station() : "") + "; last reading "
        + fmt.clock(r.lastAt()) + (r.biasC() != null ? "; air " + fmt.tempDelta(r.biasC())
        + " against the forecast over the last hour" : "") + (r.stale() ? "; NO reading in the"
        + " last hour" : "") + ")";
  }

  /** The page as one self-contained HTML file. */
  public static String html(Model model) {
    return Pages.render("night", model);
  }

  /**
   * A block's chart with the readings of its own station in a re-plan: those of the station that
   * stands for the block, else the main station's (a plan recorded before stations were kept).
   */
  private static String blockChart(PlanDocument plan, PlanDocument.Block b, UnitFormat fmt,
      ZoneId zone) {
    PlanDocument.Readings r = plan.readings();
    if (r == null) {
      return NightCharts.block(b, fmt, zone, plan.now(), List.of(), false);
    }
    return r.stations().stream().filter(st -> st.blocks().contains(b.block())
            && !st.points().isEmpty()).findFirst()
        .map(st -> NightCharts.block(b, fmt, zone, plan.now(), st.points(),
            st.hangsIn().contains(b.block())))
        .orElseGet(() -> NightCharts.block(b, fmt, zone, plan.now(),
            r.points() == null ? List.of() : r.points(), false));
  }
}
