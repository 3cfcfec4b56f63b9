package org.rimeward.rules.facts;

/** Decided: over-plant sprinkling alone is not to be used on this block tonight. */
public record SprinklingUnsafe(String blockId, double maxWindMs) {}
