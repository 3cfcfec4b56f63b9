package org.rimeward.rules.facts;

import java.time.Instant;

/**
 * Derived: the protection a block's covers are credited with tonight. Published fabric figures
 * are radiation-night figures; on a breezy or overcast night the rules credit a share of them.
 *
 * @param wind10mMs wind at 10 m at the coldest hour
 * @param cloudPct cloud at the coldest hour
 * @param at the coldest hour
 */
public record CoverCredit(String blockId, double publishedProtectionC, double protectionC,
    double wind10mMs, double cloudPct, Instant at) {}
