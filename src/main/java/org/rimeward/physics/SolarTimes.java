package org.rimeward.physics;

import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.util.Objects;
import java.util.Optional;

/**
 * Sun events of one local date. An event that does not happen that day is empty.
 *
 * @param date the local calendar date asked for
 * @param zone the time zone the times are expressed in
 * @param civilDawn Sun centre 6° below the horizon, morning
 * @param sunrise upper limb on the horizon (centre at −0.833°), morning
 * @param sunset upper limb on the horizon, evening
 * @param civilDusk Sun centre 6° below the horizon, evening
 * @param polar {@link Polar#DAY} when the Sun does not set that day, {@link Polar#NIGHT} when it
 *     does not rise, null otherwise
 */
public record SolarTimes(LocalDate date, ZoneId zone, Optional<ZonedDateTime> civilDawn,
    Optional<ZonedDateTime> sunrise, Optional<ZonedDateTime> sunset, Optional<ZonedDateTime> civilDusk,
    Polar polar) {

  /** Polar day (midnight sun) or polar night. */
  public enum Polar { DAY, NIGHT }

  public SolarTimes {
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(zone, "zone");
    Objects.requireNonNull(civilDawn, "civilDawn");
    Objects.requireNonNull(sunrise, "sunrise");
    Objects.requireNonNull(sunset, "sunset");
    Objects.requireNonNull(civilDusk, "civilDusk");
  }
}
