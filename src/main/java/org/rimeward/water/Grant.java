package org.rimeward.water;

import java.util.List;

/**
 * What a block gets from its source tonight.
 *
 * @param rateMmH the rate it runs at; 0 when it gets nothing
 * @param areaHa the area protected
 * @param flowM3H the draw while it runs
 * @param volumeM3 the water over its run
 * @param setIds the irrigation sets that run, for {@link GrantKind#SETS}
 * @param stakePerM3 the loss avoided per m³ of the least water that protects it, which ranked it
 * @param stakeByValue the loss is crop value; false: hectares of buds
 * @param spareFlowM3H the flow the source still had, while this block would run, when its turn came
 * @param spareVolumeM3 the volume the source still held when its turn came; NaN for no limit
 */
public record Grant(String blockId, GrantKind kind, double rateMmH, double areaHa,
    double flowM3H, double volumeM3, List<String> setIds, double stakePerM3, boolean stakeByValue,
    double floorRateMmH, double floorFlowM3H, double wantedFlowM3H, double wantedVolumeM3,
    double spareFlowM3H, double spareVolumeM3) {
  public Grant {
    setIds = List.copyOf(setIds);
  }

  public boolean granted() {
    return kind != GrantKind.NONE;
  }

  /** The loss avoided per m³, with its basis. */
  public Stake stake() {
    return new Stake(stakePerM3, stakeByValue);
  }

  /** The sets that run, in words. */
  public String sets() {
    return setIds.isEmpty() ? "none" : String.join(", ", setIds);
  }

  /** The share of the block protected, 0 to 100. */
  public double areaPct(double blockAreaHa) {
    return 100.0 * areaHa / blockAreaHa;
  }
}
