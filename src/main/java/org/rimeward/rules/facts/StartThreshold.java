package org.rimeward.rules.facts;

/** Derived: the wet-bud temperature at which sprinkling on this block starts. */
public record StartThreshold(String blockId, double thresholdC) {}
