package org.rimeward.rules.facts;

import java.time.Instant;

/**
 * Decided: when sprinkling starts.
 *
 * @param atOnce the start threshold is already reached at the first forecast step
 * @param line the forecast line of the step the start was read from
 */
public record SprinkleStart(String blockId, Instant at, boolean atOnce, double thresholdC, int line) {}
