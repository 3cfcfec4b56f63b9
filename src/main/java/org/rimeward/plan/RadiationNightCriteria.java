package org.rimeward.plan;

import java.time.Duration;
import org.rimeward.minimum.RadiationNights;
import org.rimeward.rules.facts.Thresholds;

/**
 * The radiation-night criteria as the rule files set them (rule THRESHOLDS): the package
 * {@code minimum} sits below the rules and cannot read them, so the fit ({@code minimum fit}) and
 * the re-plan that uses the fitted model take their criteria from here, one and the same.
 */
public final class RadiationNightCriteria {
  private RadiationNightCriteria() {}

  public static RadiationNights.Criteria of(Thresholds t) {
    return new RadiationNights.Criteria(t.radiationNightMaxWindMs(), t.radiationNightMaxCloudPct(),
        t.radiationNightMinCoolingDeltaC(), t.radiationNightMinDepressionC(),
        Duration.ofMinutes(t.radiationNightMaxGapMin()));
  }
}
