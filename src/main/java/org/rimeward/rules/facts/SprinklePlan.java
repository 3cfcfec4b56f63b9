package org.rimeward.rules.facts;

import java.time.Instant;
import org.rimeward.water.Demand;

/**
 * Decided: sprinkle this block from start to stop. Flow and water are at the installed rate.
 *
 * @param requiredRateMmH the rate the coldest and windiest part of the window needs
 * @param flowM3H the block's draw while running: rate × area
 * @param waterM3 the water over the whole window
 * @param killPct expected kill without protection, carried for sharing out short water
 * @param cropValuePerHa NaN when the farm gave none
 */
public record SprinklePlan(String blockId, String sourceId, Instant start, Instant stop,
    double requiredRateMmH, double installedRateMmH, double flowM3H, double waterM3,
    double killPct, double areaHa, double cropValuePerHa) {

  /** The plan for a block over the run its need was read for: 1 mm over 1 ha is 10 m³. */
  public static SprinklePlan of(BlockFact b, BlockNight n, SprinkleNeed need) {
    double hours = (need.stop().getEpochSecond() - need.start().getEpochSecond()) / 3600.0;
    double flow = b.installedRateMmH() * b.areaHa() * 10.0;
    return new SprinklePlan(b.blockId(), b.sourceId(), need.start(), need.stop(),
        need.requiredRateMmH(), b.installedRateMmH(), flow, flow * hours, n.unprotectedKillPct(),
        b.areaHa(), b.cropValuePerHa());
  }

  public double hours() {
    return (stop.getEpochSecond() - start.getEpochSecond()) / 3600.0;
  }

  Demand demand(java.util.List<org.rimeward.water.IrrigationSet> sets) {
    return new Demand(blockId, start, stop, installedRateMmH, requiredRateMmH, areaHa,
        killPct / 100.0, cropValuePerHa, sets);
  }
}
