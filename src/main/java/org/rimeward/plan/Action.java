package org.rimeward.plan;

import java.time.Instant;
import java.util.List;
import org.rimeward.water.GrantKind;

/** Something to do on a block tonight. */
public sealed interface Action permits Action.Sprinkle, Action.Cover {
  /** When the action begins, for sorting blocks by start time. */
  Instant begins();

  /**
   * Over-plant sprinkling from start to stop, as its water source can carry it.
   *
   * @param designRateMmH the sprinklers' installed (design) rate
   * @param runRateMmH the rate it actually runs at: the design rate, or lower when the source is
   *     short; 0 when it gets no water
   * @param waterM3 the water it is granted over the run
   * @param flowM3H its granted draw while running
   * @param areaHa the area protected
   * @param startsAtOnce the forecast already starts below the start threshold
   * @param grant how much of its call it gets; {@link GrantKind#NONE} means its sprinklers stay off
   * @param sets the irrigation sets that run, when only some do
   * @param wantedFlowM3H the draw at the design rate over the whole block
   * @param wantedWaterM3 the water at the design rate over the whole block
   * @param advised false when the rules advise against sprinkling this block tonight (wind, a
   *     rate short of the need): the run it would be is shown so the manager can weigh it, but
   *     it is left out of the water budget and granted nothing
   */
  record Sprinkle(Instant start, Instant stop, double requiredRateMmH, double designRateMmH,
      double runRateMmH, double waterM3, double flowM3H, double areaHa, String source,
      boolean startsAtOnce, GrantKind grant, List<String> sets, double wantedFlowM3H,
      double wantedWaterM3, boolean advised) implements Action {
    public Sprinkle {
      sets = List.copyOf(sets);
    }

    @Override
    public Instant begins() {
      return start;
    }

    /** Whether the block gets any water: false means the sprinklers stay off tonight. */
    public boolean withWater() {
      return grant != GrantKind.NONE;
    }
  }

  /**
   * Covers on by sunset, off after sunrise.
   *
   * @param remove null when the forecast ends before it is warm enough to take them off
   * @param sufficient covers alone keep the coldest bud above the target
   */
  record Cover(Instant deployStart, Instant deployBy, Instant remove, double protectionC,
      boolean sufficient) implements Action {
    @Override
    public Instant begins() {
      return deployStart;
    }
  }
}
