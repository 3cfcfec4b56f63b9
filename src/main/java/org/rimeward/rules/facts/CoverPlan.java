package org.rimeward.rules.facts;

import java.time.Instant;

/**
 * Decided: covers go on this block. {@code sufficient} when they alone keep the coldest bud above
 * the target by the cover margin; the rules decide that and the removal temperature.
 *
 * @param remove when they can come off; null when the forecast ends before it is warm enough
 * @param removeAtC the air temperature above which they can come off
 * @param protectionC the protection credited tonight (the published one, less in wind or cloud)
 * @param coveredMinBudC the coldest bud under the covers
 */
public record CoverPlan(String blockId, Instant deployStart, Instant deployBy, Instant remove,
    double removeAtC, boolean sufficient, double protectionC, double coveredMinBudC) {}
