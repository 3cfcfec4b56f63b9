package org.rimeward.rules.facts;

/** Decided: the installed rate is below what the coldest, windiest hour needs. */
public record RateShortfall(String blockId, double requiredRateMmH, double installedRateMmH) {}
