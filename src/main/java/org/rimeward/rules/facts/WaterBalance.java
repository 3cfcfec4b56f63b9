package org.rimeward.rules.facts;

import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.rimeward.water.Allocation;
import org.rimeward.water.Demand;
import org.rimeward.water.Grant;
import org.rimeward.water.GrantKind;
import org.rimeward.water.IrrigationSet;
import org.rimeward.water.Terms;
import org.rimeward.water.WaterAllocation;

/** Decided: what a water source is asked for tonight, what it can give, and to whom. */
public record WaterBalance(String sourceId, double maxFlowM3H, double availableM3, Terms terms,
    Allocation allocation) {

  /** Balances a source against the sprinkling plans that draw on it. */
  public static WaterBalance of(WaterSourceFact source, List<?> plans, List<?> sets, Terms terms) {
    Map<String, List<IrrigationSet>> setsByBlock = sets.stream().map(BlockSets.class::cast)
        .collect(Collectors.toMap(BlockSets::blockId, BlockSets::sets));
    List<Demand> demands = plans.stream().map(p -> ((SprinklePlan) p).demand(
        setsByBlock.getOrDefault(((SprinklePlan) p).blockId(), List.of()))).toList();
    return new WaterBalance(source.sourceId(), source.maxFlowM3H(), source.volumeM3(), terms,
        WaterAllocation.allocate(source.maxFlowM3H(), source.volumeM3(), demands, terms));
  }

  /** The largest draw if every block ran at its installed rate. */
  public double wantedPeakFlowM3H() {
    return allocation.wantedPeakFlowM3H();
  }

  /** The water if every block ran at its installed rate. */
  public double wantedVolumeM3() {
    return allocation.wantedVolumeM3();
  }

  /** The largest draw the plan runs: never above the source's max flow. */
  public double peakFlowM3H() {
    return allocation.peakFlowM3H();
  }

  /** The water the plan uses. */
  public double volumeM3() {
    return allocation.volumeM3();
  }

  public boolean flowShort() {
    return allocation.wantedPeakFlowM3H() > maxFlowM3H + 1e-9;
  }

  public boolean volumeShort() {
    return !Double.isNaN(availableM3) && allocation.wantedVolumeM3() > availableM3 + 1e-9;
  }

  public boolean shortOfWater() {
    return flowShort() || volumeShort();
  }

  /** What the block gets; every block that draws on this source has one. */
  public Grant grant(String blockId) {
    return allocation.grant(blockId).orElseThrow(
        () -> new IllegalArgumentException(blockId + " does not draw on " + sourceId));
  }

  public boolean isGranted(String blockId, GrantKind kind) {
    return allocation.grants().stream().anyMatch(g -> g.kind() == kind && g.blockId().equals(blockId));
  }

  public String served() {
    return words(allocation.served());
  }

  public String part() {
    return words(allocation.part());
  }

  public String dropped() {
    return words(allocation.dropped());
  }

  private static String words(List<String> ids) {
    return ids.isEmpty() ? "none" : String.join(", ", ids);
  }

  /** How blocks were ranked, in words. */
  public String basis() {
    // No unit here: the words are read in either unit system.
    return allocation.rankedByValue() ? "crop value saved" : "area of buds saved";
  }
}
