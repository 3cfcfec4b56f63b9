package org.rimeward.rules.facts;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.Objects;

/**
 * The night being planned: the evening's date, the farm's zone, sunset and next sunrise, and the
 * site's air pressure (for wet bulbs computed by the rules' questions).
 */
public record NightFact(LocalDate date, ZoneId zone, Instant sunset, Instant sunrise,
    double pressureKPa) {
  public NightFact {
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(zone, "zone");
    Objects.requireNonNull(sunset, "sunset");
    Objects.requireNonNull(sunrise, "sunrise");
    if (!sunrise.isAfter(sunset)) {
      throw new IllegalArgumentException("sunrise " + sunrise + " must follow sunset " + sunset);
    }
    if (!(pressureKPa >= 50 && pressureKPa <= 110)) {
      throw new IllegalArgumentException("site pressure must be 50 to 110 kPa, was " + pressureKPa);
    }
  }
}
