package org.rimeward.rules.facts;

/** Decided: the block's status in tonight's plan. */
public record BlockStatus(String blockId, Status status) {}
