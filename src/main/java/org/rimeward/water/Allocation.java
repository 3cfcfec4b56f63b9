package org.rimeward.water;

import java.util.List;

/**
 * How a source's water is shared out tonight.
 *
 * @param peakFlowM3H the largest total draw if every block ran as asked
 * @param volumeM3 the total water if every block ran as asked
 * @param rankedByValue blocks were ranked by crop value saved per m³; false when some block had no
 *     crop value and they were ranked by hectares of buds saved per m³ instead
 * @param ranking every block, best first, with its stake per m³ and whether it is served
 * @param servedPeakFlowM3H the largest total draw of the served blocks
 * @param servedVolumeM3 the water the served blocks use
 */
public record Allocation(double peakFlowM3H, double volumeM3, boolean rankedByValue,
    List<Ranked> ranking, double servedPeakFlowM3H, double servedVolumeM3) {

  /** A block's place in the ranking. */
  public record Ranked(String blockId, double stakePerM3, boolean served) {}

  public List<String> served() {
    return ranking.stream().filter(Ranked::served).map(Ranked::blockId).sorted().toList();
  }

  public List<String> dropped() {
    return ranking.stream().filter(r -> !r.served()).map(Ranked::blockId).sorted().toList();
  }

  public double stakePerM3(String blockId) {
    return ranking.stream().filter(r -> r.blockId().equals(blockId)).mapToDouble(Ranked::stakePerM3)
        .findFirst().orElse(Double.NaN);
  }
}
