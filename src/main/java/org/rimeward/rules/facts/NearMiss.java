package org.rimeward.rules.facts;

/**
 * Derived: the coldest bud stays above the target, but within the watch band of it; a forecast
 * that misses by that much would bring the frost.
 */
public record NearMiss(String blockId, double minDryBudC, double targetC, double marginC) {}
