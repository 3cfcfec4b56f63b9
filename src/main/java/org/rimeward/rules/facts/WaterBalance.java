package org.rimeward.rules.facts;

import java.util.List;
import org.rimeward.water.Allocation;
import org.rimeward.water.WaterAllocation;

/** Decided: what a water source is asked for tonight, what it can give, and to whom. */
public record WaterBalance(String sourceId, double maxFlowM3H, double availableM3,
    Allocation allocation) {

  /** Balances a source against the sprinkling plans that draw on it. */
  public static WaterBalance of(WaterSourceFact source, List<?> plans) {
    List<org.rimeward.water.Demand> demands = plans.stream()
        .map(p -> ((SprinklePlan) p).demand()).toList();
    return new WaterBalance(source.sourceId(), source.maxFlowM3H(), source.volumeM3(),
        WaterAllocation.allocate(source.maxFlowM3H(), source.volumeM3(), demands));
  }

  public double peakFlowM3H() {
    return allocation.peakFlowM3H();
  }

  public double volumeM3() {
    return allocation.volumeM3();
  }

  public boolean flowShort() {
    return allocation.peakFlowM3H() > maxFlowM3H + 1e-9;
  }

  public boolean volumeShort() {
    return !Double.isNaN(availableM3) && allocation.volumeM3() > availableM3 + 1e-9;
  }

  public boolean shortOfWater() {
    return flowShort() || volumeShort();
  }

  public boolean isDropped(String blockId) {
    // A scan, not dropped(): the rules ask this once per plan, and dropped() sorts every time.
    return allocation.ranking().stream().anyMatch(r -> !r.served() && r.blockId().equals(blockId));
  }

  public String served() {
    List<String> s = allocation.served();
    return s.isEmpty() ? "none" : String.join(", ", s);
  }

  public String dropped() {
    List<String> d = allocation.dropped();
    return d.isEmpty() ? "none" : String.join(", ", d);
  }

  /** How blocks were ranked, in words. */
  public String basis() {
    return allocation.rankedByValue() ? "crop value saved per m³" : "hectares of buds saved per m³";
  }
}
