package org.rimeward.plan;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Function;
import org.rimeward.BuildInfo;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.farm.WaterSource;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.facts.Alarm;
import org.rimeward.rules.facts.BlockFact;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.BlockStatus;
import org.rimeward.rules.facts.CoverPlan;
import org.rimeward.rules.facts.CoverRemovalDelayed;
import org.rimeward.rules.facts.Measure;
import org.rimeward.rules.facts.NightFact;
import org.rimeward.rules.facts.NightSeries;
import org.rimeward.rules.facts.Risk;
import org.rimeward.rules.facts.RiskLevel;
import org.rimeward.rules.facts.SprinkleNeed;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.SprinkleStart;
import org.rimeward.rules.facts.SprinklingNotAdvised;
import org.rimeward.rules.facts.StartMargin;
import org.rimeward.rules.facts.Target;
import org.rimeward.rules.facts.WaterBalance;
import org.rimeward.water.Grant;
import org.rimeward.water.GrantKind;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastStep;

/** Turns what the rules concluded into the plan a manager reads. */
final class PlanAssembly {
  private PlanAssembly() {}

  static Plan assemble(Farm farm, Forecast forecast, NightFact night, List<ForecastStep> window,
      Map<String, BlockFact> blockFacts, Map<String, BlockNight> nights, RuleBook.Outcome outcome,
      PlanInputs inputs) {
    // Indexed by block once: a region of thousands of blocks must not scan every conclusion
    // for every block.
    Map<String, Risk> risks = byId(outcome.all(Risk.class), Risk::blockId);
    Map<String, BlockStatus> statuses = byId(outcome.all(BlockStatus.class), BlockStatus::blockId);
    Map<String, Target> targets = byId(outcome.all(Target.class), Target::blockId);
    Map<String, CoverPlan> covers = byId(outcome.all(CoverPlan.class), CoverPlan::blockId);
    Map<String, SprinklePlan> sprinkles = byId(outcome.all(SprinklePlan.class), SprinklePlan::blockId);
    Map<String, SprinkleStart> starts = byId(outcome.all(SprinkleStart.class), SprinkleStart::blockId);
    Map<String, WaterBalance> balances = byId(outcome.all(WaterBalance.class), WaterBalance::sourceId);
    Map<String, CoverRemovalDelayed> delayed =
        byId(outcome.all(CoverRemovalDelayed.class), CoverRemovalDelayed::blockId);
    Map<String, SprinkleNeed> needs = byId(outcome.all(SprinkleNeed.class), SprinkleNeed::blockId);
    Map<String, Alarm> alarms = byId(outcome.all(Alarm.class), Alarm::blockId);
    Map<String, List<SprinklingNotAdvised>> notAdvised = new HashMap<>();
    for (SprinklingNotAdvised x : outcome.all(SprinklingNotAdvised.class)) {
      notAdvised.computeIfAbsent(x.blockId(), k -> new ArrayList<>()).add(x);
    }
    List<FiredRule> trail = outcome.trail();
    Map<String, List<FiredRule>> trailByBlock = new HashMap<>();
    for (FiredRule f : trail) {
      if (f.blockId() != null) {
        trailByBlock.computeIfAbsent(f.blockId(), k -> new ArrayList<>()).add(f);
      }
    }

    List<BlockPlan> blocks = new ArrayList<>();
    for (Block b : farm.blocks()) {
      String id = b.id();
      BlockFact bf = blockFacts.get(id);
      BlockNight bn = nights.get(id);
      List<Action> actions = new ArrayList<>();
      first(covers, id).ifPresent(c -> actions.add(new Action.Cover(
          c.deployStart(), c.deployBy(),
          first(delayed, id).map(CoverRemovalDelayed::remove).orElse(c.remove()),
          c.protectionC(), c.sufficient())));
      boolean atOnce = first(starts, id).map(SprinkleStart::atOnce).orElse(false);
      first(sprinkles, id).ifPresent(s -> actions.add(sprinkle(s, atOnce,
          first(balances, s.sourceId()).flatMap(w -> w.allocation().grant(id)))));
      List<SprinklingNotAdvised> against = notAdvised.getOrDefault(id, List.of());
      Optional<SprinkleNeed> need = first(needs, id);
      if (!against.isEmpty() && need.isPresent()) {
        // The run it would be, shown beside the reason so that the manager can weigh it; it is
        // granted no water.
        SprinkleNeed n = need.get();
        double flow = bf.installedRateMmH() * bf.areaHa() * 10.0;
        double hours = (n.stop().getEpochSecond() - n.start().getEpochSecond()) / 3600.0;
        actions.add(new Action.Sprinkle(n.start(), n.stop(), n.requiredRateMmH(),
            n.installedRateMmH(), 0.0, 0.0, 0.0, bf.areaHa(), bf.sourceId(), atOnce,
            GrantKind.NONE, List.of(), flow, flow * hours, false));
      }
      Optional<Sprinkling> sprinkling = bf.hasSprinklers()
          ? Optional.of(sprinkling(bf, bn, need, against)) : Optional.empty();
      Optional<AlarmReading> alarm = first(alarms, id).map(a -> new AlarmReading(a.startAirC(),
          a.startWetBulbC(), a.alarmAirC(), a.alarmAt(), a.referenceAt()));
      List<FiredRule> rules = List.copyOf(trailByBlock.getOrDefault(id, List.of()));
      blocks.add(new BlockPlan(id, bf.crop(), bf.variety(), bf.stage(), bf.stageName(), bf.t10C(),
          bf.t90C(), bf.thresholdSource(),
          first(targets, id).map(Target::targetC).orElse(bf.t10C()),
          bn.minAirC(), bn.minDryBudC(), bn.minWetBulbC(), bn.coldestAt(), bn.coldestLine(),
          first(risks, id).map(Risk::level).orElse(RiskLevel.NONE),
          bn.unprotectedKillPct(),
          first(statuses, id).map(BlockStatus::status).orElseThrow(
              () -> new IllegalStateException("no status rule fired for block " + id
                  + "; every block needs one STATUS rule")),
          actions, sprinkling, alarm, rules.stream().filter(FiredRule::isCaution).toList(), rules,
          bn.series(), bf.coldAirOffsetC()));
    }
    blocks.sort(Comparator.comparing((BlockPlan p) -> p.firstAction().orElse(Instant.MAX))
        .thenComparing(BlockPlan::blockId));

    List<WaterEntry> water = new ArrayList<>();
    for (WaterSource w : farm.waterSources()) {
      double available = w.volumeM3().orElse(Double.NaN);
      water.add(first(balances, w.id())
          .map(wb -> new WaterEntry(w.id(), wb.peakFlowM3H(), wb.wantedPeakFlowM3H(), w.maxFlowM3H(),
              wb.volumeM3(), wb.wantedVolumeM3(), available, wb.shortOfWater(),
              wb.allocation().served(), wb.allocation().part(), wb.allocation().dropped(),
              wb.allocation().draws()))
          .orElse(new WaterEntry(w.id(), 0, 0, w.maxFlowM3H(), 0, 0, available, false, List.of(),
              List.of(), List.of(), List.of())));
    }
    water.sort(Comparator.comparing(WaterEntry::source));

    List<String> cautions = new ArrayList<>(StandingCautions.ALL);
    trail.stream().filter(f -> f.isCaution() && f.blockId() == null)
        .forEach(f -> cautions.add(f.explanation()));

    int coldest = 0;
    for (int i = 1; i < window.size(); i++) {
      if (window.get(i).airTempC() < window.get(coldest).airTempC()) {
        coldest = i;
      }
    }
    NightSummary summary = new NightSummary(night.date(), night.zone(), night.sunset(),
        night.sunrise(), window.get(coldest).time(), window.get(coldest).airTempC(),
        forecast.start(), forecast.end());
    StartMargin margin = outcome.all(StartMargin.class).stream().findFirst().orElseThrow(
        () -> new IllegalStateException("no START-MARGIN rule fired; the rules must set one"));
    PlanPolicy policy = new PlanPolicy(farm.policy().target().toString(),
        margin.marginC(), farm.policy().stopRule().yamlName());
    return new Plan(farm.name(), BuildInfo.version(), summary, policy, blocks, water, cautions,
        trail, inputs);
  }

  /** A block's sprinkling as its source grants it; every run at full rate when no balance was struck. */
  private static Action.Sprinkle sprinkle(SprinklePlan s, boolean atOnce, Optional<Grant> grant) {
    double hours = s.hours();
    double fullFlow = s.flowM3H();
    return grant.map(g -> new Action.Sprinkle(s.start(), s.stop(), s.requiredRateMmH(),
            s.installedRateMmH(), g.rateMmH(), g.volumeM3(), g.flowM3H(), g.areaHa(), s.sourceId(),
            atOnce, g.kind(), g.setIds(), fullFlow, fullFlow * hours, true))
        .orElse(new Action.Sprinkle(s.start(), s.stop(), s.requiredRateMmH(), s.installedRateMmH(),
            s.installedRateMmH(), s.waterM3(), fullFlow, s.areaHa(), s.sourceId(), atOnce,
            GrantKind.FULL, List.of(), fullFlow, s.waterM3(), true));
  }

  /** What the night asks of a sprinkled block: its need over the run and hour by hour. */
  private static Sprinkling sprinkling(BlockFact bf, BlockNight bn, Optional<SprinkleNeed> need,
      List<SprinklingNotAdvised> against) {
    NightSeries s = bn.series();
    List<Sprinkling.Reason> reasons = against.stream()
        .sorted(java.util.Comparator.comparing(SprinklingNotAdvised::reason))
        .map(x -> new Sprinkling.Reason(
            x.reason().name().toLowerCase(java.util.Locale.ROOT).replace('_', '-'), x.at(),
            x.wind10mMs(), s.valueAtTime(Measure.WIND_2M_MS, x.at())))
        .toList();
    return new Sprinkling(bf.installedRateMmH(),
        need.filter(n -> n.unknownAt() == null).map(n -> OptionalDouble.of(n.requiredRateMmH()))
            .orElse(OptionalDouble.empty()),
        need.map(n -> against.isEmpty()), reasons);
  }

  /** Each id's first item in list order, as a scan for the first match would find it. */
  private static <T> Map<String, T> byId(List<T> items, Function<T, String> id) {
    Map<String, T> out = new HashMap<>();
    for (T item : items) {
      String key = id.apply(item);
      if (key != null) {
        out.putIfAbsent(key, item);
      }
    }
    return out;
  }

  private static <T> Optional<T> first(Map<String, T> byId, String wanted) {
    return Optional.ofNullable(byId.get(wanted));
  }
}
