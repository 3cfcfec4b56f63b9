package org.rimeward.rules.facts;

import java.time.Instant;

/** Times of a cover plan the rules decided: on by sunset, off once the air stays warm enough. */
public final class CoverPlanning {
  private CoverPlanning() {}

  /**
   * The plan the rules decided: deploying starts the crew's deploy hours before sunset; the
   * covers come off at the first moment after sunrise from which the air stays at or above
   * {@code removeAtC} (null when the forecast ends first).
   */
  public static CoverPlan plan(NightFact night, BlockFact b, BlockNight n, CoverCredit credit,
      double removeAtC, boolean sufficient) {
    Instant off = n.series().firstStaysAtOrAboveAt(Measure.AIR_C, removeAtC, night.sunrise());
    return new CoverPlan(b.blockId(), Times.hoursBefore(night.sunset(), b.deployHours()),
        night.sunset(), off, removeAtC, sufficient, credit.protectionC(),
        n.minDryBudC() + credit.protectionC());
  }
}
