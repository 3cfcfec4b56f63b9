package org.rimeward.rules.facts;

/** Derived: the coldest bud reaches the target, so the block needs protection tonight. */
public record NeedsProtection(String blockId, double minDryBudC, double targetC) {}
