package org.rimeward.audit;

import java.time.Instant;
import java.time.LocalDate;

/**
 * One line of the run list: which run, when, for which night, how many blocks needed protection.
 *
 * @param protectionNeededCount blocks that needed protection, whether or not the plan could give
 *     it
 * @param unprotectedCount of those, the blocks left unprotected or short of water
 * @param zoneId the farm's time zone, in which the run's time is shown
 */
public record RunSummary(String runId, Instant ranAt, LocalDate night, String farmName,
    int blockCount, int protectionNeededCount, int unprotectedCount, String zoneId) {}
