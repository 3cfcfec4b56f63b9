package org.rimeward.water;

import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * One block's call on a water source tonight: sprinkling from start to stop at its installed
 * rate over its whole area, which the night needs at no less than {@code needRateMmH}.
 *
 * @param installedRateMmH the sprinklers' design rate
 * @param needRateMmH the rate the coldest, windiest part of the run needs
 * @param killFraction the share of buds expected to die without protection, 0 to 1
 * @param cropValuePerHa the crop's value per hectare; NaN when the farm did not give it
 * @param sets the block's irrigation sets; empty when the farm declares none
 */
public record Demand(String blockId, Instant start, Instant stop, double installedRateMmH,
    double needRateMmH, double areaHa, double killFraction, double cropValuePerHa,
    List<IrrigationSet> sets) {
  /** 1 mm over 1 ha is 10 m³. */
  static final double M3_PER_MM_HA = 10.0;

  public Demand {
    Objects.requireNonNull(blockId, "blockId");
    if (!stop.isAfter(start)) {
      throw new IllegalArgumentException(blockId + ": stop " + stop + " must follow start " + start);
    }
    if (!(installedRateMmH > 0) || !(areaHa > 0)) {
      throw new IllegalArgumentException(blockId + ": installed rate and area must be above 0");
    }
    if (!(needRateMmH >= 0)) {
      throw new IllegalArgumentException(blockId + ": need must be a rate of 0 or more, was " + needRateMmH);
    }
    if (!(killFraction >= 0 && killFraction <= 1)) {
      throw new IllegalArgumentException(blockId + ": kill fraction must be 0 to 1, was " + killFraction);
    }
    sets = List.copyOf(sets);
  }

  public double hours() {
    return (stop.getEpochSecond() - start.getEpochSecond()) / 3600.0;
  }

  /** The draw at the installed rate over the whole block. */
  public double fullFlowM3H() {
    return installedRateMmH * areaHa * M3_PER_MM_HA;
  }

  public double fullVolumeM3() {
    return fullFlowM3H() * hours();
  }

  /**
   * The lowest rate that still protects the whole block: the need plus the margin, never above
   * the installed rate. A block whose installed rate is already below that runs as installed or
   * not at all.
   */
  public double floorRateMmH(Terms terms) {
    return Math.min(installedRateMmH, needRateMmH * (1 + terms.rateMarginPct() / 100.0));
  }

  public double floorFlowM3H(Terms terms) {
    return floorRateMmH(terms) * areaHa * M3_PER_MM_HA;
  }

  boolean hasValue() {
    return !Double.isNaN(cropValuePerHa);
  }
}
