package org.rimeward.plan;

import java.util.List;
import org.rimeward.water.Allocation;

/**
 * One water source against what tonight asks of it.
 *
 * @param peakFlowM3H the largest draw the plan runs; never above {@code maxFlowM3H}
 * @param wantedPeakFlowM3H the largest draw if every block ran at its installed rate
 * @param volumeM3 the water the plan uses
 * @param wantedVolumeM3 the water if every block ran at its installed rate
 * @param availableM3 NaN for a source with no volume limit
 * @param served blocks protected whole; {@code part} blocks protected in part; {@code without}
 *     blocks that get no water
 * @param draws the source's total draw through the night, for the pump's on and off times
 */
public record WaterEntry(String source, double peakFlowM3H, double wantedPeakFlowM3H,
    double maxFlowM3H, double volumeM3, double wantedVolumeM3, double availableM3,
    boolean isShortOfWater, List<String> served, List<String> part, List<String> without,
    List<Allocation.Draw> draws) {
  public WaterEntry {
    served = List.copyOf(served);
    part = List.copyOf(part);
    without = List.copyOf(without);
    draws = List.copyOf(draws);
  }
}
