package org.rimeward.physics;

import java.time.Duration;
import java.time.LocalDate;
import java.util.Objects;
import java.util.Optional;
import java.time.ZonedDateTime;

/**
 * The night that starts on a local date: sunset of that date and sunrise of the next. Each is empty
 * under polar day or night; each carries its own UTC offset, so a daylight-saving change in the
 * night shows as two different offsets.
 *
 * @param date the local date on whose evening the night starts
 * @param sunset sunset of {@code date}
 * @param sunrise sunrise of {@code date + 1}
 */
public record Night(LocalDate date, Optional<ZonedDateTime> sunset, Optional<ZonedDateTime> sunrise) {
  public Night {
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(sunset, "sunset");
    Objects.requireNonNull(sunrise, "sunrise");
  }

  /** Elapsed time from sunset to sunrise (real elapsed time, DST-safe), when both happen. */
  public Optional<Duration> length() {
    return sunset.flatMap(s -> sunrise.map(r -> Duration.between(s, r)));
  }
}
