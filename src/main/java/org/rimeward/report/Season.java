package org.rimeward.report;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.TreeSet;
import org.rimeward.plan.PlanDocument;

/**
 * The season from the audit trail: each night once, from its latest run, summed per block and per
 * water source. Expected kills over the season combine night by night as independent chances
 * (a bud that survives one night faces the next): 1 − Π(1 − k).
 *
 * <p>Kill with the plan assumes the plan is carried out: a block protected whole keeps its buds
 * at or above its target, taken as no kill; a block protected in part keeps the unprotected share
 * of its kill; every other block keeps its kill unprotected.
 */
public final class Season {
  /** One recorded run, with the hours the crew recorded sprinkling for each block, if any. */
  public record Run(String runId, Instant ranAt, PlanDocument plan,
      Map<String, Double> doneSprinkleHours) {
    public Run {
      doneSprinkleHours = Map.copyOf(doneSprinkleHours);
    }
  }

  /** A block as the farm file has it: its area and crop value, when set. */
  public record FarmBlock(String id, double areaHa, Double cropValuePerHa) {}

  /** One block over the season. {@code lossAvoided} is null where no crop value is set. */
  public record BlockTotal(String block, int nightsPlanned, int nightsAtRisk, int nightsProtected,
      double hoursSprinkled, Double hoursSprinkledDone, double waterM3, int coverNights,
      double killUnprotectedPct, double killWithPlanPct, Double lossAvoided) {}

  /** One water source on one night, from that night's latest run. */
  public record SourceNight(String source, LocalDate night, String runId, double waterM3,
      double peakFlowM3H) {}

  /** One water source over the season. */
  public record SourceTotal(String source, int nights, double waterM3, double peakFlowM3H) {}

  /** One night of the season: the run it counts from and its worst risk. */
  public record Night(LocalDate night, String runId, String worstRisk, int blocksAtRisk) {}

  /** The whole season. */
  public record Totals(String farm, LocalDate from, LocalDate to, List<Night> nights,
      List<BlockTotal> blocks, List<SourceNight> sourceNights, List<SourceTotal> sources) {}

  private static final List<String> RISKS = List.of("none", "watch", "damage", "severe");

  private Season() {}

  /**
   * The season of {@code runs} between {@code from} and {@code to} (both inclusive, either null
   * for open), with a row for every block of the farm file even if no run planned it.
   */
  public static Totals of(String farm, List<Run> runs, List<FarmBlock> farmBlocks,
      LocalDate from, LocalDate to) {
    Map<LocalDate, Run> latest = new TreeMap<>();
    for (Run r : runs) {
      LocalDate d = r.plan().night().date();
      if ((from != null && d.isBefore(from)) || (to != null && d.isAfter(to))) {
        continue;
      }
      latest.merge(d, r, (a, b) -> Comparator.comparing(Run::ranAt)
          .thenComparing(Run::runId).compare(a, b) >= 0 ? a : b);
    }
    Map<String, FarmBlock> farmById = new LinkedHashMap<>();
    farmBlocks.forEach(b -> farmById.put(b.id(), b));
    TreeSet<String> ids = new TreeSet<>(farmById.keySet());
    latest.values().forEach(r -> r.plan().blocks().forEach(b -> ids.add(b.block())));

    List<Night> nights = new ArrayList<>();
    List<SourceNight> sourceNights = new ArrayList<>();
    for (Run r : latest.values()) {
      String worst = r.plan().blocks().stream().map(PlanDocument.Block::risk)
          .max(Comparator.comparingInt(RISKS::indexOf)).orElse("none");
      int atRisk = (int) r.plan().blocks().stream().filter(PlanDocument.Block::atRisk).count();
      nights.add(new Night(r.plan().night().date(), r.runId(), worst, atRisk));
      for (PlanDocument.Water w : r.plan().water()) {
        sourceNights.add(new SourceNight(w.source(), r.plan().night().date(), r.runId(),
            w.volumeM3(), w.peakFlowM3H()));
      }
    }
    List<BlockTotal> blocks = new ArrayList<>();
    for (String id : ids) {
      blocks.add(block(id, latest.values(), farmById.get(id)));
    }
    Map<String, List<SourceNight>> bySource = new TreeMap<>();
    sourceNights.forEach(s -> bySource.computeIfAbsent(s.source(), k -> new ArrayList<>()).add(s));
    List<SourceTotal> sources = new ArrayList<>();
    bySource.forEach((source, list) -> sources.add(new SourceTotal(source, list.size(),
        list.stream().mapToDouble(SourceNight::waterM3).sum(),
        list.stream().mapToDouble(SourceNight::peakFlowM3H).max().orElse(0))));
    sourceNights.sort(Comparator.comparing(SourceNight::source).thenComparing(SourceNight::night));
    return new Totals(farm, from, to, nights, blocks, sourceNights, sources);
  }

  private static BlockTotal block(String id, Iterable<Run> runs, FarmBlock farm) {
    int planned = 0;
    int atRisk = 0;
    int protectedNights = 0;
    int coverNights = 0;
    double hours = 0;
    double water = 0;
    double survivesUnprotected = 1;
    double survivesWithPlan = 1;
    double doneHours = 0;
    boolean anyDone = false;
    for (Run r : runs) {
      PlanDocument.Block b = r.plan().block(id).orElse(null);
      if (b == null) {
        continue;
      }
      planned++;
      if (b.atRisk()) {
        atRisk++;
      }
      if (b.status().equals("protected") || b.status().equals("partly-protected")) {
        protectedNights++;
      }
      if (b.cover().isPresent()) {
        coverNights++;
      }
      var sprinkle = b.sprinkle().filter(s -> s.waterGranted() && s.start() != null
          && s.stop() != null);
      if (sprinkle.isPresent()) {
        hours += Duration.between(sprinkle.get().start(), sprinkle.get().stop()).toMinutes() / 60.0;
        water += sprinkle.get().waterM3();
      }
      Double done = r.doneSprinkleHours().get(id);
      if (done != null) {
        anyDone = true;
        doneHours += done;
      }
      double kill = b.killPctUnprotected() / 100.0;
      survivesUnprotected *= 1 - kill;
      survivesWithPlan *= 1 - killWithPlan(b, kill);
    }
    double killUnprotected = 100 * (1 - survivesUnprotected);
    double killWithPlan = 100 * (1 - survivesWithPlan);
    Double loss = farm == null || farm.cropValuePerHa() == null ? null
        : farm.cropValuePerHa() * farm.areaHa() * (killUnprotected - killWithPlan) / 100;
    return new BlockTotal(id, planned, atRisk, protectedNights, hours, anyDone ? doneHours : null,
        water, coverNights, killUnprotected, killWithPlan, loss);
  }

  /** A night's expected kill if the plan is carried out, as the class comment says. */
  static double killWithPlan(PlanDocument.Block b, double killUnprotected) {
    if (b.status().equals("protected")) {
      return 0;
    }
    if (b.status().equals("partly-protected")) {
      var s = b.sprinkle().orElse(null);
      if (s != null && s.designRateMmH() > 0 && s.wantedFlowM3H() > 0) {
        double blockHa = s.wantedFlowM3H() / (s.designRateMmH() * 10.0);
        return killUnprotected * Math.max(0, 1 - s.areaHa() / blockHa);
      }
    }
    return killUnprotected;
  }
}
