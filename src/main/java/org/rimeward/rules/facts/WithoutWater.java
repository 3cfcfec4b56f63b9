package org.rimeward.rules.facts;

/** Decided: this block gets no water from its source tonight, because the source is short. */
public record WithoutWater(String blockId, String sourceId, double valuePerM3) {}
