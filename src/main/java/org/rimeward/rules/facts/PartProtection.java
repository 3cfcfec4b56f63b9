package org.rimeward.rules.facts;

import org.rimeward.water.Grant;

/** Decided: the source protects only part of this block tonight; the rest stays dry. */
public record PartProtection(String blockId, String sourceId, Grant grant) {}
