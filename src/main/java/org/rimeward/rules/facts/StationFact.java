package org.rimeward.rules.facts;

import java.util.Objects;

/**
 * Given: a thermometer farm.yaml declares, whose readings correct the forecast of the blocks it
 * stands for during the night.
 *
 * @param stationId the station's id
 * @param heightM height of the thermometer above the ground, m
 * @param budHeightM height of the lowest buds of its blocks, m; NaN when farm.yaml gives none
 * @param blocks the blocks it stands for, as text (ids separated by commas)
 */
public record StationFact(String stationId, double heightM, double budHeightM, String blocks) {
  public StationFact {
    Objects.requireNonNull(stationId, "stationId");
    Objects.requireNonNull(blocks, "blocks");
    if (!(heightM > 0)) {
      throw new IllegalArgumentException("station " + stationId + ": height must be above 0 m");
    }
  }

  /** Whether farm.yaml gives the height of the buds, so that the two can be compared. */
  public boolean budHeightKnown() {
    return !Double.isNaN(budHeightM);
  }
}
