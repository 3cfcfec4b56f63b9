package org.rimeward.water;

import java.time.Instant;
import java.util.Objects;

/**
 * One block's call on a water source: it draws {@code flowM3H} from start to stop.
 *
 * @param killFraction the share of buds expected to die without protection, 0 to 1
 * @param cropValuePerHa the crop's value per hectare; NaN when the farm did not give it
 */
public record Demand(String blockId, Instant start, Instant stop, double flowM3H, double volumeM3,
    double killFraction, double areaHa, double cropValuePerHa) {
  public Demand {
    Objects.requireNonNull(blockId, "blockId");
    if (!stop.isAfter(start)) {
      throw new IllegalArgumentException(blockId + ": stop " + stop + " must follow start " + start);
    }
    if (!(flowM3H > 0) || !(volumeM3 > 0)) {
      throw new IllegalArgumentException(blockId + ": flow and volume must be above 0");
    }
    if (!(killFraction >= 0 && killFraction <= 1)) {
      throw new IllegalArgumentException(blockId + ": kill fraction must be 0 to 1, was " + killFraction);
    }
  }

  boolean hasValue() {
    return !Double.isNaN(cropValuePerHa);
  }
}
