package org.rimeward.rules.facts;

import java.time.Instant;

/** Decided: when sprinkling may stop, and the wet-bulb threshold that allowed it. */
public record SprinkleStop(String blockId, Instant at, double thresholdC, int line) {}
