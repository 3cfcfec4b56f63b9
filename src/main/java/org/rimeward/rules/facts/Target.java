package org.rimeward.rules.facts;

/** Derived: the bud temperature this block is protected to tonight. */
public record Target(String blockId, double targetC, String basis) {}
