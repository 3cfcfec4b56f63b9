package org.rimeward.rules.facts;

/** Derived: the block's risk tonight without protection. */
public record Risk(String blockId, RiskLevel level, double minDryBudC, double killPct) {}
