package org.rimeward.rules.facts;

import java.time.Instant;

/**
 * Derived: the wind band over the hours sprinkling would run while the air is below freezing,
 * judged on the forecast's wind at 10 m as extension guidance states its limits.
 *
 * @param maxWind10mMs the strongest such wind at 10 m
 * @param wind2mMs the same hour's wind at 2 m
 * @param at the hour of the strongest such wind
 */
public record WindExposure(String blockId, WindLevel level, double maxWind10mMs, double wind2mMs,
    Instant at) {}
