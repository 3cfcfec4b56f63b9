package org.rimeward.rules.facts;

import java.time.Instant;

/** Found: the forecast ends before it is safe to stop sprinkling this block. */
public record StopBeyondForecast(String blockId, Instant forecastEnd, double thresholdC) {}
