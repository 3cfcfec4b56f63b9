package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.Objects;

/**
 * What the physics computed for one block over the night, summarised, with the step-by-step
 * series behind it. Temperatures are at the block (the forecast plus its cold-air offset).
 *
 * @param minDryBudC the coldest a dry, unprotected bud gets (air less radiative cooling)
 * @param minWetBudC the coldest a wetted bud would get (wet bulb less radiative cooling)
 * @param maxDepressionC the largest radiative depression of a bud below air
 * @param unprotectedKillPct expected share of buds killed without protection, from the kill curve
 * @param maxWindBelowFreezingMs the strongest 2 m wind while the air is at or below 0 °C
 */
public record BlockNight(String blockId, NightSeries series, double minAirC, double minDryBudC,
    double minWetBulbC, double minWetBudC, double maxDepressionC, Instant coldestAt,
    int coldestLine, double unprotectedKillPct, double maxWindBelowFreezingMs) {
  public BlockNight {
    Objects.requireNonNull(blockId, "blockId");
    Objects.requireNonNull(series, "series");
    Objects.requireNonNull(coldestAt, "coldestAt");
  }
}
