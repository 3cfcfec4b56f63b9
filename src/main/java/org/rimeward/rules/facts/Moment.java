package org.rimeward.rules.facts;

import java.time.Instant;

/**
 * A moment found in a night series, with the value there and the forecast step it came from.
 *
 * @param atStart true when the condition already held at the first step of the forecast
 * @param line the forecast file line of the step at or after the moment
 */
public record Moment(Instant at, double value, boolean atStart, int line) {}
