package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.Objects;

/**
 * Decided: over-plant sprinkling is not advised on this block tonight, and why, with the numbers
 * the manager weighs against the expected kill unprotected.
 *
 * @param at the hour the reason holds (the windiest or the neediest hour of the run)
 * @param wind10mMs wind at 10 m at that hour
 */
public record SprinklingNotAdvised(String blockId, NotAdvisedReason reason, double requiredRateMmH,
    double installedRateMmH, double wind10mMs, Instant at) {
  public SprinklingNotAdvised {
    Objects.requireNonNull(reason, "reason");
  }
}
