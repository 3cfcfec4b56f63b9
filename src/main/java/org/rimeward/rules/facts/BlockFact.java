package org.rimeward.rules.facts;

import java.util.Objects;

/**
 * A block as the rules see it: what grows there, its critical temperatures tonight, and the
 * protection it has.
 *
 * @param flowering the stage has open flowers (the profile says so), which covers keep from pollinators
 * @param thresholdSource where T10 and T90 came from (table, variety offset or override)
 * @param cropValuePerHa the crop's value per hectare in the farm's currency; NaN when not given
 * @param installedRateMmH the sprinklers' application rate; 0 without sprinklers
 * @param coverProtectionC how much warmer buds stay under the covers; 0 without covers
 */
public record BlockFact(String blockId, String crop, String variety, String stage, String stageName,
    boolean flowering, double areaHa, double t10C, double t90C, String thresholdSource,
    double coldAirOffsetC, double cropValuePerHa, boolean hasSprinklers, double installedRateMmH,
    String sourceId, boolean hasCovers, double coverProtectionC, String coverSource,
    double deployHours) {
  public BlockFact {
    Objects.requireNonNull(blockId, "blockId");
    if (!(t90C < t10C)) {
      throw new IllegalArgumentException(blockId + ": T90 " + t90C + " must be colder than T10 " + t10C);
    }
    if (!(areaHa > 0)) {
      throw new IllegalArgumentException(blockId + ": area must be above 0 ha, was " + areaHa);
    }
    if (hasSprinklers && (!(installedRateMmH > 0) || sourceId == null)) {
      throw new IllegalArgumentException(blockId + ": sprinklers need a rate above 0 and a source");
    }
  }
}
