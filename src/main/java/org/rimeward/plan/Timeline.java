package org.rimeward.plan;

import java.time.Instant;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;
import org.rimeward.water.Allocation;

/**
 * The night at a glance: every moment a crew or a pump has to act, in time order. Built once
 * from the plan, kept in its document, and put in words for the units a reader asks for.
 */
public final class Timeline {
  private Timeline() {}

  /** What happens at a moment; the order is the order of things done at one minute. */
  public enum Event {
    NOT_COVERED, COVER_CREW_OUT, COVERS_ON_BY, ALARM, PUMP_ON, SPRINKLERS_ON, SPRINKLERS_OFF,
    PUMP_OFF, COVERS_OFF
  }

  private record Draft(Instant at, Event event, String blockId, String sourceId, boolean past,
      Instant until, double flowM3H, Double airC) {}

  /**
   * Every entry of the plan in time order; at one minute, in the order a crew does them. An entry
   * due before the forecast starts is {@code past}: the plan cannot have it done on time.
   */
  static List<PlanDocument.TimelineEntry> of(Plan plan, List<PlanDocument.Block> blocks) {
    ZoneId zone = plan.night().zone();
    // Due before the forecast starts, or before the moment a re-plan was made, is past.
    Instant forecastStart = plan.update() != null && plan.update().now().isAfter(plan.night().forecastStart())
        ? plan.update().now() : plan.night().forecastStart();
    List<Draft> out = new ArrayList<>();
    if (plan.night().forecastStart().isAfter(plan.night().sunset())) {
      out.add(new Draft(plan.night().sunset(), Event.NOT_COVERED, null, null, true,
          plan.night().forecastStart(), 0, null));
    }
    for (BlockPlan b : plan.blocks()) {
      // The alarm of a block whose sprinklers stay off (no water, or not advised) would read as
      // "get ready to sprinkle": it is left out, and the block's row says what to do instead.
      b.alarm().filter(a -> a.alarmAt() != null && sprinklesIfAny(b)).ifPresent(a -> out.add(
          new Draft(a.alarmAt(), Event.ALARM, b.blockId(), null, a.alarmAt().isBefore(forecastStart),
              null, 0, a.alarmAirC())));
      for (Action a : b.actions()) {
        if (a instanceof Action.Cover c) {
          out.add(draft(c.deployStart(), Event.COVER_CREW_OUT, b.blockId(), null, forecastStart));
          out.add(draft(c.deployBy(), Event.COVERS_ON_BY, b.blockId(), null, forecastStart));
          if (c.remove() != null) {
            out.add(draft(c.remove(), Event.COVERS_OFF, b.blockId(), null, forecastStart));
          }
        } else if (a instanceof Action.Sprinkle s && s.withWater()) {
          out.add(draft(s.start(), Event.SPRINKLERS_ON, b.blockId(), s.source(), forecastStart));
          out.add(draft(s.stop(), Event.SPRINKLERS_OFF, b.blockId(), s.source(), forecastStart));
        }
      }
    }
    for (WaterEntry w : plan.water()) {
      List<Allocation.Draw> draws = w.draws();
      int i = 0;
      while (i < draws.size()) {
        int j = i;
        double peak = draws.get(i).flowM3H();
        while (j + 1 < draws.size() && draws.get(j + 1).from().equals(draws.get(j).to())) {
          j++;
          peak = Math.max(peak, draws.get(j).flowM3H());
        }
        out.add(new Draft(draws.get(i).from(), Event.PUMP_ON, null, w.source(),
            draws.get(i).from().isBefore(forecastStart), null, peak, null));
        out.add(new Draft(draws.get(j).to(), Event.PUMP_OFF, null, w.source(), false, null, 0, null));
        i = j + 1;
      }
    }
    out.sort(Comparator.comparing(Draft::at).thenComparing(Draft::event)
        .thenComparing(e -> e.blockId() == null ? "" : e.blockId())
        .thenComparing(e -> e.sourceId() == null ? "" : e.sourceId()));
    Map<String, PlanDocument.Block> byId = blocks.stream()
        .collect(Collectors.toMap(PlanDocument.Block::block, Function.identity()));
    UnitFormat metric = UnitFormat.of(UnitSystem.METRIC);
    List<PlanDocument.TimelineEntry> entries = new ArrayList<>();
    for (Draft d : out) {
      PlanDocument.TimelineEntry e = new PlanDocument.TimelineEntry(
          PlanDocuments.time(d.at(), zone), PlanDocuments.word(d.event()), null, d.blockId(),
          d.sourceId(), d.past(), d.event() == Event.PUMP_ON ? d.flowM3H() : null,
          PlanDocuments.time(d.until(), zone), d.airC());
      entries.add(e.withWhat(what(e, Optional.ofNullable(d.blockId()).map(byId::get), metric)));
    }
    return List.copyOf(entries);
  }

  /** A block that sprinkles tonight with water, or has no sprinkling planned (a near miss). */
  private static boolean sprinklesIfAny(BlockPlan b) {
    return b.sprinkle().map(Action.Sprinkle::withWater).orElse(true);
  }

  private static Draft draft(Instant at, Event event, String blockId, String sourceId,
      Instant forecastStart) {
    return new Draft(at, event, blockId, sourceId, at.isBefore(forecastStart), null, 0, null);
  }

  /** The entries of a plan document in words, in {@code fmt}'s units. */
  public static List<String> words(PlanDocument plan, UnitFormat fmt) {
    return plan.timeline().stream()
        .map(e -> what(e, plan.block(e.block() == null ? "" : e.block()), fmt))
        .toList();
  }

  /** One entry in words; {@code block} is the block it concerns, for its rates and readings. */
  static String what(PlanDocument.TimelineEntry e, Optional<PlanDocument.Block> block, UnitFormat fmt) {
    String at = fmt.clock(e.at());
    Optional<PlanDocument.Sprinkle> sprinkle = block.flatMap(PlanDocument.Block::sprinkle);
    return switch (e.event()) {
      case "not-covered" -> "the forecast starts at " + fmt.clock(e.until())
          + ": the hours from sunset " + at + " to then are not covered; check thermometers at bud height now";
      case "cover-crew-out" -> e.past() ? "cover crew was due out at " + at : "cover crew starts putting covers on";
      case "covers-on-by" -> e.past() ? "covers were due on by " + at : "covers must be on by now";
      case "alarm" -> alarm(e, block, fmt);
      case "pump-on" -> "pump on, up to " + fmt.flow(e.flowM3H() == null ? 0 : e.flowM3H());
      case "sprinklers-on" -> sprinkle.map(s -> sprinklersOn(s, fmt)).orElse("sprinklers on");
      case "sprinklers-off" -> "sprinklers off";
      case "pump-off" -> "pump off";
      case "covers-off" -> "covers off";
      default -> e.event().replace('-', ' ');
    };
  }

  /**
   * The frost alarm: the air the alarm is set at, which the forecast reaches at this time, and
   * the start reading it warns of (FAO 2005 ch. 7: alarm about 1 °C above the start).
   */
  private static String alarm(PlanDocument.TimelineEntry e, Optional<PlanDocument.Block> block,
      UnitFormat fmt) {
    Double airC = e.airC() != null ? e.airC() : block.map(PlanDocument.Block::alarmAirC).orElse(null);
    String set = "frost alarm" + (airC == null ? "" : ": air " + fmt.temp(airC) + " expected");
    Optional<PlanDocument.Block> b = block.filter(x -> x.startAirC() != null);
    if (b.isEmpty()) {
      return set;
    }
    String start = fmt.temp(b.get().startAirC()) + " air (wet bulb " + fmt.temp(b.get().startWetBulbC()) + ")";
    return set + (b.get().sprinkle().isPresent() ? "; sprinklers on at " + start
        : "; near miss: sprinkle only if the air falls to " + start);
  }

  private static String sprinklersOn(PlanDocument.Sprinkle s, UnitFormat fmt) {
    String on = (s.startsAtOnce() ? "sprinklers on at once, " : "sprinklers on, ") + fmt.rate(s.installedRateMmH());
    return on + switch (s.grant()) {
      case "reduced-rate" -> " (installed " + fmt.rate(s.designRateMmH()) + ")";
      case "sets" -> ", sets " + String.join(", ", s.sets()) + " only (" + fmt.area(s.areaHa()) + ")";
      case "part-area" -> ", " + fmt.area(s.areaHa()) + " of the block only";
      default -> "";
    };
  }
}
