package org.rimeward.rules.facts;

import java.util.Objects;

/**
 * A water source: the most it can deliver at once and, for a pond, how much it holds.
 *
 * @param volumeM3 the usable volume; NaN for a well with no volume limit
 */
public record WaterSourceFact(String sourceId, double maxFlowM3H, double volumeM3) {
  public WaterSourceFact {
    Objects.requireNonNull(sourceId, "sourceId");
    if (!(maxFlowM3H > 0)) {
      throw new IllegalArgumentException(sourceId + ": max flow must be above 0 m3/h, was " + maxFlowM3H);
    }
  }
}
