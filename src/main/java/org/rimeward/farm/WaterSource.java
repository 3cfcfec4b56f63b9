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
  /**
   * Largest flow accepted, m³/h: about 5.6 m³/s, a large river pumping station; enough to sprinkle
   * some 5000 ha at 4 mm/h (40 m³/h per ha). Above it a unit or a digit is surely wrong.
   */
  public static final double MAX_FLOW_M3_H = 20_000;
  /**
   * Largest volume accepted, m³: 50 million m³ (50 GL), a large irrigation reservoir, hundreds
   * of frost nights for a big farm. Above it a unit or a digit is surely wrong.
   */
  public static final double MAX_VOLUME_M3 = 50_000_000;

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
