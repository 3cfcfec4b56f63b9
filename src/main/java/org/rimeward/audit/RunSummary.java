package org.rimeward.audit;

import java.time.Instant;
import java.time.LocalDate;

/** One line of the run list: which run, when, for which night, how many blocks needed protection. */
public record RunSummary(String runId, Instant ranAt, LocalDate night, String farmName,
    int blockCount, int protectionNeededCount) {}
