package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.List;

/**
 * Decided: covers go on this block. {@code sufficient} when they alone keep the coldest bud
 * above the target.
 *
 * @param remove when they can come off; null when the forecast ends before it is warm enough
 * @param removeAtC the air temperature above which they can come off
 * @param coveredMinBudC the coldest bud under the covers
 */
public record CoverPlan(String blockId, Instant deployStart, Instant deployBy, Instant remove,
    double removeAtC, boolean sufficient, double protectionC, double coveredMinBudC) {

  /**
   * Covers go on by sunset to hold the day's soil heat, starting the crew's deploy time earlier;
   * they come off after sunrise once the air stays above both the target plus the margin and 0 °C.
   */
  public static CoverPlan of(NightFact night, PolicyFact policy, BlockFact b, Target t, BlockNight n) {
    double covered = n.minDryBudC() + b.coverProtectionC();
    double removeAt = Math.max(t.targetC() + policy.startMarginC(), 0.0);
    List<Moment> off = n.series().firstStaysAtOrAbove(Measure.AIR_C, removeAt, night.sunrise());
    return new CoverPlan(b.blockId(), Times.hoursBefore(night.sunset(), b.deployHours()),
        night.sunset(), off.isEmpty() ? null : off.get(0).at(), removeAt, covered > t.targetC(),
        b.coverProtectionC(), covered);
  }
}
