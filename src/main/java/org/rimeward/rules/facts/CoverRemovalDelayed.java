package org.rimeward.rules.facts;

import java.time.Instant;

/** Decided: covers stay on past their own removal time, until sprinkling over them stops. */
public record CoverRemovalDelayed(String blockId, Instant remove) {}
