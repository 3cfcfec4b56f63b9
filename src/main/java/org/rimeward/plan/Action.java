package org.rimeward.plan;

import java.time.Instant;

/** Something to do on a block tonight. */
public sealed interface Action permits Action.Sprinkle, Action.Cover {
  /** When the action begins, for sorting blocks by start time. */
  Instant begins();

  /**
   * Over-plant sprinkling from start to stop.
   *
   * @param startsAtOnce the forecast already starts below the start threshold
   * @param withWater false when the source is short and this block goes without
   */
  record Sprinkle(Instant start, Instant stop, double requiredRateMmH, double installedRateMmH,
      double waterM3, double flowM3H, String source, boolean startsAtOnce, boolean withWater)
      implements Action {
    @Override
    public Instant begins() {
      return start;
    }
  }

  /**
   * Covers on by sunset, off after sunrise.
   *
   * @param remove null when the forecast ends before it is warm enough to take them off
   * @param sufficient covers alone keep the coldest bud above the target
   */
  record Cover(Instant deployStart, Instant deployBy, Instant remove, double protectionC,
      boolean sufficient) implements Action {
    @Override
    public Instant begins() {
      return deployStart;
    }
  }
}
