package org.rimeward.farm;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * A pond, reservoir or well that feeds sprinklers.
 *
 * @param id the name blocks use to refer to it
 * @param maxFlowM3H the most it can deliver, m³/h
 * @param volumeM3 the water stored, m³; empty for a source with no volume limit (a well)
 */
public record WaterSource(String id, double maxFlowM3H, OptionalDouble volumeM3) {
  public WaterSource {
    Ids.check("water source id", id);
    Objects.requireNonNull(volumeM3, "volumeM3");
    if (!(maxFlowM3H > 0 && Double.isFinite(maxFlowM3H))) {
      throw new IllegalArgumentException("water source " + id + ": max flow must be above 0 m³/h, was " + maxFlowM3H);
    }
    if (volumeM3.isPresent() && !(volumeM3.getAsDouble() > 0 && Double.isFinite(volumeM3.getAsDouble()))) {
      throw new IllegalArgumentException("water source " + id + ": volume must be above 0 m³, was " + volumeM3.getAsDouble());
    }
  }

  /** Whether the source holds a limited volume. */
  public boolean limited() {
    return volumeM3.isPresent();
  }
}
