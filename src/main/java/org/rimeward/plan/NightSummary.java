package org.rimeward.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;

/** The night as a whole, at the forecast point. */
public record NightSummary(LocalDate date, ZoneId zone, Instant sunset, Instant sunrise,
    Instant coldestAt, double minAirC, Instant forecastStart, Instant forecastEnd) {}
