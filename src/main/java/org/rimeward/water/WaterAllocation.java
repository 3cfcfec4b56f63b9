package org.rimeward.water;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.TreeSet;

/**
 * Shares a water source among the blocks that want it tonight, never below the rate a block's
 * night needs: a block watered below its need can end colder than one left dry (NC State
 * Extension start/stop guide; FAO 2005, ch. 7).
 *
 * <p>When the source carries every block at its installed rate, all run so. When it does not,
 * blocks are taken in order of the loss that each m³ of the least water protecting them avoids.
 * In that order each block first gets its floor: the whole block at its need plus the margin (or
 * at its installed rate when that is lower). A block whose floor no longer fits gets whole
 * irrigation sets at the installed rate when it declares sets, else a share of its area at the
 * installed rate, else nothing. What is left then raises, in the same order, the reduced rates
 * toward the installed rate and the parts toward the whole. Flow is honoured at every moment of
 * every run and volume over the whole night; a run is never planned to stop early for want of
 * water. A greedy order is not always the best packing, but it is one a manager can check by hand
 * and explain to an insurer.
 */
public final class WaterAllocation {
  private static final double EPS = 1e-9;

  private WaterAllocation() {}

  /**
   * @param maxFlowM3H the most the source delivers at once
   * @param availableM3 what the source holds; NaN for no volume limit
   */
  public static Allocation allocate(double maxFlowM3H, double availableM3, List<Demand> demands,
      Terms terms) {
    boolean byValue = !demands.isEmpty() && demands.stream().allMatch(Demand::hasValue);
    List<Demand> order = new ArrayList<>(demands);
    order.sort(Comparator.comparingDouble((Demand d) -> -stakePerM3(d, byValue, terms))
        .thenComparing(Demand::blockId));
    Ledger ledger = new Ledger(maxFlowM3H, availableM3, demands);
    double wantedVolume = demands.stream().mapToDouble(Demand::fullVolumeM3).sum();
    double wantedPeak = ledger.peakOf(demands.stream().map(d -> new Run(d, d.fullFlowM3H())).toList());
    boolean fits = wantedPeak <= maxFlowM3H + EPS
        && (ledger.unlimited() || wantedVolume <= availableM3 + EPS);

    List<Grant> grants = new ArrayList<>();
    for (Demand d : order) {
      double spareFlow = ledger.spareFlow(d);
      double spareVolume = ledger.spareVolume();
      Grant g = fits ? grant(d, GrantKind.FULL, d.installedRateMmH(), d.areaHa(), d.fullFlowM3H(),
          List.of(), byValue, terms, spareFlow, spareVolume) : floor(d, spareFlow, spareVolume, byValue, terms);
      ledger.take(d, g.flowM3H());
      grants.add(g);
    }
    if (!fits) {
      for (int i = 0; i < grants.size(); i++) {
        Grant g = grants.get(i);
        if (g.kind() == GrantKind.REDUCED_RATE || g.kind() == GrantKind.SETS
            || g.kind() == GrantKind.PART_AREA) {
          Demand d = demandOf(order, g.blockId());
          ledger.take(d, -g.flowM3H());
          Grant raised = raise(d, g, ledger.spareFlow(d), ledger.spareVolume(), byValue, terms);
          ledger.take(d, raised.flowM3H());
          grants.set(i, raised);
        }
      }
    }
    return new Allocation(wantedPeak, wantedVolume, byValue, grants, ledger.draws());
  }

  /** Pass one: the least that protects the block whole, else a part at full rate, else nothing. */
  private static Grant floor(Demand d, double spareFlow, double spareVolume, boolean byValue, Terms terms) {
    double cap = cap(d, spareFlow, spareVolume);
    double floorFlow = d.floorFlowM3H(terms);
    if (floorFlow <= cap + EPS) {
      double rate = d.floorRateMmH(terms);
      GrantKind kind = rate >= d.installedRateMmH() - EPS ? GrantKind.FULL : GrantKind.REDUCED_RATE;
      return grant(d, kind, rate, d.areaHa(), floorFlow, List.of(), byValue, terms, spareFlow, spareVolume);
    }
    return part(d, cap, byValue, terms, spareFlow, spareVolume);
  }

  /** Pass two: a reduced rate or a part grows with what is left, up to the installed rate on all of it. */
  private static Grant raise(Demand d, Grant g, double spareFlow, double spareVolume, boolean byValue,
      Terms terms) {
    double cap = cap(d, spareFlow, spareVolume);
    if (g.kind() == GrantKind.REDUCED_RATE) {
      double flow = Math.min(d.fullFlowM3H(), cap);
      if (flow >= d.fullFlowM3H() - EPS) {
        return grant(d, GrantKind.FULL, d.installedRateMmH(), d.areaHa(), d.fullFlowM3H(), List.of(),
            byValue, terms, g.spareFlowM3H(), g.spareVolumeM3());
      }
      return grant(d, GrantKind.REDUCED_RATE, flow / (d.areaHa() * Demand.M3_PER_MM_HA), d.areaHa(),
          flow, List.of(), byValue, terms, g.spareFlowM3H(), g.spareVolumeM3());
    }
    Grant grown = part(d, cap, byValue, terms, g.spareFlowM3H(), g.spareVolumeM3());
    return grown.areaHa() >= g.areaHa() ? grown : g;
  }

  /** Whole sets, or a share of the area, at the installed rate within {@code cap}. */
  private static Grant part(Demand d, double cap, boolean byValue, Terms terms, double spareFlow,
      double spareVolume) {
    if (!d.sets().isEmpty()) {
      List<IrrigationSet> best = bestSets(d.sets(), cap);
      if (best.isEmpty()) {
        return none(d, byValue, terms, spareFlow, spareVolume);
      }
      double area = best.stream().mapToDouble(IrrigationSet::areaHa).sum();
      double flow = best.stream().mapToDouble(IrrigationSet::flowM3H).sum();
      GrantKind kind = area >= d.areaHa() - EPS ? GrantKind.FULL : GrantKind.SETS;
      return grant(d, kind, d.installedRateMmH(), area, flow,
          best.stream().map(IrrigationSet::id).toList(), byValue, terms, spareFlow, spareVolume);
    }
    double share = Math.min(1.0, cap / d.fullFlowM3H());
    if (share * 100 < terms.minPartPct() - EPS) {
      return none(d, byValue, terms, spareFlow, spareVolume);
    }
    GrantKind kind = share >= 1 - EPS ? GrantKind.FULL : GrantKind.PART_AREA;
    return grant(d, kind, d.installedRateMmH(), d.areaHa() * share, d.fullFlowM3H() * share,
        List.of(), byValue, terms, spareFlow, spareVolume);
  }

  /**
   * The sets that protect the most area within {@code cap}; among equal areas, the one that
   * draws least, then the first in the farm file's order. Every subset is tried up to 16 sets;
   * beyond that, sets are taken largest area first while they fit.
   */
  static List<IrrigationSet> bestSets(List<IrrigationSet> sets, double cap) {
    int n = sets.size();
    if (n > 16) {
      List<IrrigationSet> bySize = new ArrayList<>(sets);
      bySize.sort(Comparator.comparingDouble(IrrigationSet::areaHa).reversed());
      List<IrrigationSet> out = new ArrayList<>();
      double flow = 0;
      for (IrrigationSet s : bySize) {
        if (flow + s.flowM3H() <= cap + EPS) {
          out.add(s);
          flow += s.flowM3H();
        }
      }
      return sets.stream().filter(out::contains).toList();
    }
    int bestMask = 0;
    double bestArea = 0;
    double bestFlow = 0;
    for (int mask = 1; mask < (1 << n); mask++) {
      double area = 0;
      double flow = 0;
      for (int i = 0; i < n; i++) {
        if ((mask & (1 << i)) != 0) {
          area += sets.get(i).areaHa();
          flow += sets.get(i).flowM3H();
        }
      }
      if (flow <= cap + EPS && (area > bestArea + EPS || Math.abs(area - bestArea) <= EPS && flow < bestFlow - EPS)) {
        bestMask = mask;
        bestArea = area;
        bestFlow = flow;
      }
    }
    List<IrrigationSet> out = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      if ((bestMask & (1 << i)) != 0) {
        out.add(sets.get(i));
      }
    }
    return out;
  }

  /** The most a block can draw for its whole run: the spare flow, and the spare volume spread over the run. */
  private static double cap(Demand d, double spareFlow, double spareVolume) {
    double byVolume = Double.isNaN(spareVolume) ? Double.POSITIVE_INFINITY : spareVolume / d.hours();
    return Math.max(0, Math.min(spareFlow, byVolume));
  }

  private static Grant none(Demand d, boolean byValue, Terms terms, double spareFlow, double spareVolume) {
    return grant(d, GrantKind.NONE, 0, 0, 0, List.of(), byValue, terms, spareFlow, spareVolume);
  }

  private static Grant grant(Demand d, GrantKind kind, double rate, double area, double flow,
      List<String> sets, boolean byValue, Terms terms, double spareFlow, double spareVolume) {
    return new Grant(d.blockId(), kind, rate, area, flow, flow * d.hours(), sets,
        stakePerM3(d, byValue, terms), byValue, d.floorRateMmH(terms), d.floorFlowM3H(terms),
        d.fullFlowM3H(), d.fullVolumeM3(), Math.max(0, spareFlow), spareVolume);
  }

  private static Demand demandOf(List<Demand> demands, String blockId) {
    return demands.stream().filter(d -> d.blockId().equals(blockId)).findFirst().orElseThrow();
  }

  /**
   * Loss avoided per m³ of the least water that protects the whole block: crop value saved, or
   * hectares of buds saved when some block has no crop value.
   */
  static double stakePerM3(Demand d, boolean byValue, Terms terms) {
    double perHa = byValue ? d.cropValuePerHa() : 1.0;
    return d.killFraction() * d.areaHa() * perHa / (d.floorFlowM3H(terms) * d.hours());
  }

  private record Run(Demand demand, double flowM3H) {}

  /** What the source has given so far, piece by piece between the moments any run starts or stops. */
  private static final class Ledger {
    private final double maxFlowM3H;
    private final double availableM3;
    private final List<Instant> cuts;
    private final double[] used;
    private double usedVolumeM3;

    Ledger(double maxFlowM3H, double availableM3, List<Demand> demands) {
      this.maxFlowM3H = maxFlowM3H;
      this.availableM3 = availableM3;
      TreeSet<Instant> t = new TreeSet<>();
      demands.forEach(d -> {
        t.add(d.start());
        t.add(d.stop());
      });
      cuts = List.copyOf(t);
      used = new double[Math.max(0, cuts.size() - 1)];
    }

    boolean unlimited() {
      return Double.isNaN(availableM3);
    }

    double spareFlow(Demand d) {
      double spare = maxFlowM3H;
      for (int i = first(d); i < last(d); i++) {
        spare = Math.min(spare, maxFlowM3H - used[i]);
      }
      return spare;
    }

    double spareVolume() {
      return unlimited() ? Double.NaN : availableM3 - usedVolumeM3;
    }

    void take(Demand d, double flowM3H) {
      for (int i = first(d); i < last(d); i++) {
        used[i] += flowM3H;
      }
      usedVolumeM3 += flowM3H * d.hours();
    }

    double peakOf(List<Run> runs) {
      double[] sum = new double[used.length];
      for (Run r : runs) {
        for (int i = first(r.demand()); i < last(r.demand()); i++) {
          sum[i] += r.flowM3H();
        }
      }
      double peak = 0;
      for (double s : sum) {
        peak = Math.max(peak, s);
      }
      return peak;
    }

    List<Allocation.Draw> draws() {
      List<Allocation.Draw> out = new ArrayList<>();
      for (int i = 0; i < used.length; i++) {
        if (used[i] > EPS) {
          Allocation.Draw prev = out.isEmpty() ? null : out.get(out.size() - 1);
          if (prev != null && prev.to().equals(cuts.get(i)) && Math.abs(prev.flowM3H() - used[i]) <= EPS) {
            out.set(out.size() - 1, new Allocation.Draw(prev.from(), cuts.get(i + 1), prev.flowM3H()));
          } else {
            out.add(new Allocation.Draw(cuts.get(i), cuts.get(i + 1), used[i]));
          }
        }
      }
      return out;
    }

    private int first(Demand d) {
      return java.util.Collections.binarySearch(cuts, d.start());
    }

    private int last(Demand d) {
      return java.util.Collections.binarySearch(cuts, d.stop());
    }
  }
}
