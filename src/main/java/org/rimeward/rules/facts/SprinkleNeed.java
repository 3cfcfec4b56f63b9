package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.List;

/**
 * Derived: what the hours sprinkling would run ask of a block's sprinklers.
 *
 * @param requiredRateMmH the largest need over the run at the hours the water balance could
 *     compute it; 0 when it computed none
 * @param peakAt the hour of that need
 * @param unknownAt the first hour of the run whose need the balance could not compute; null
 *     when it computed every hour
 */
public record SprinkleNeed(String blockId, Instant start, Instant stop, double requiredRateMmH,
    Instant peakAt, double installedRateMmH, Instant unknownAt) {

  /** The need between two moments: the largest computed rate, and the first hour without one. */
  public static SprinkleNeed of(BlockFact b, BlockNight n, Instant start, Instant stop) {
    NightSeries s = n.series();
    List<Moment> peak = s.maxKnown(Measure.REQUIRED_RATE_MM_H, start, stop);
    List<Moment> unknown = s.firstUnknown(Measure.REQUIRED_RATE_MM_H, start, stop);
    return new SprinkleNeed(b.blockId(), start, stop,
        peak.isEmpty() ? 0.0 : peak.get(0).value(), peak.isEmpty() ? start : peak.get(0).at(),
        b.installedRateMmH(), unknown.isEmpty() ? null : unknown.get(0).at());
  }

}
