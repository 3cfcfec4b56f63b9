package org.rimeward.water;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

/**
 * Shares a water source among the blocks that want it tonight. When the source can carry every
 * block, all are served. When it cannot, blocks are taken in order of the loss each cubic metre
 * avoids, and a block is served only if the source can still carry it together with those already
 * served, both in flow at every moment and in volume over the night. A greedy order is not always
 * the best packing, but it is the order a manager can check by hand and explain to an insurer.
 */
public final class WaterAllocation {
  private WaterAllocation() {}

  /**
   * @param maxFlowM3H the most the source delivers at once
   * @param availableM3 what the source holds; NaN for no volume limit
   */
  public static Allocation allocate(double maxFlowM3H, double availableM3, List<Demand> demands) {
    double peak = peakFlow(demands);
    double volume = demands.stream().mapToDouble(Demand::volumeM3).sum();
    boolean byValue = !demands.isEmpty() && demands.stream().allMatch(Demand::hasValue);
    List<Demand> order = new ArrayList<>(demands);
    order.sort(Comparator.comparingDouble((Demand d) -> -stakePerM3(d, byValue))
        .thenComparing(Demand::blockId));
    boolean unlimited = Double.isNaN(availableM3);
    List<Demand> served = new ArrayList<>();
    List<Allocation.Ranked> ranking = new ArrayList<>();
    double usedVolume = 0;
    for (Demand d : order) {
      List<Demand> trial = new ArrayList<>(served);
      trial.add(d);
      boolean fits = peakFlow(trial) <= maxFlowM3H + 1e-9
          && (unlimited || usedVolume + d.volumeM3() <= availableM3 + 1e-9);
      if (fits) {
        served.add(d);
        usedVolume += d.volumeM3();
      }
      ranking.add(new Allocation.Ranked(d.blockId(), stakePerM3(d, byValue), fits));
    }
    return new Allocation(peak, volume, byValue, List.copyOf(ranking), peakFlow(served), usedVolume);
  }

  /** Loss avoided per m³: crop value saved, or hectares of buds saved when values are missing. */
  static double stakePerM3(Demand d, boolean byValue) {
    double perHa = byValue ? d.cropValuePerHa() : 1.0;
    return d.killFraction() * d.areaHa() * perHa / d.volumeM3();
  }

  /** The largest total draw at any moment; a block stopping as another starts does not overlap. */
  static double peakFlow(List<Demand> demands) {
    record Event(Instant at, double delta) {}
    List<Event> events = new ArrayList<>();
    for (Demand d : demands) {
      events.add(new Event(d.start(), d.flowM3H()));
      events.add(new Event(d.stop(), -d.flowM3H()));
    }
    events.sort(Comparator.comparing(Event::at).thenComparingDouble(Event::delta));
    double now = 0;
    double peak = 0;
    for (Event e : events) {
      now += e.delta();
      peak = Math.max(peak, now);
    }
    return peak;
  }
}
