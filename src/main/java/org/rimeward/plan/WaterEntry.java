package org.rimeward.plan;

import java.util.List;

/**
 * One water source against what tonight asks of it.
 *
 * @param availableM3 NaN for a source with no volume limit
 */
public record WaterEntry(String source, double peakFlowM3H, double maxFlowM3H, double volumeM3,
    double availableM3, boolean isShortOfWater, List<String> served, List<String> without) {
  public WaterEntry {
    served = List.copyOf(served);
    without = List.copyOf(without);
  }
}
