package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.Objects;

/**
 * What the physics computed for one block over the night, summarised, with the step-by-step
 * series behind it. Temperatures are at the block (the forecast plus its cold-air offset).
 *
 * @param minDryBudC the coldest a dry, unprotected bud gets (air less radiative cooling)
 * @param unprotectedKillPct expected share of buds killed without protection, from the kill curve
 */
public record BlockNight(String blockId, NightSeries series, double minAirC, double minDryBudC,
    double minWetBulbC, Instant coldestAt, int coldestLine, double unprotectedKillPct) {
  public BlockNight {
    Objects.requireNonNull(blockId, "blockId");
    Objects.requireNonNull(series, "series");
    Objects.requireNonNull(coldestAt, "coldestAt");
  }

  /** A block's night summarised from its series: the one way the planner and tests build it. */
  public static BlockNight of(String blockId, NightSeries s, double unprotectedKillPct) {
    int cold = s.indexOfMin(Measure.DRY_BUD_C);
    return new BlockNight(blockId, s, s.valueAt(Measure.AIR_C, s.indexOfMin(Measure.AIR_C)),
        s.valueAt(Measure.DRY_BUD_C, cold),
        s.valueAt(Measure.WET_BULB_C, s.indexOfMin(Measure.WET_BULB_C)), s.timeAt(cold),
        s.lineAt(cold), unprotectedKillPct);
  }
}
