package org.rimeward.weather;

import java.time.Duration;
import java.time.Instant;
import java.util.Objects;

/**
 * A stretch where the source gave one value of a property for longer than an hour, which the
 * reader spread over hourly steps.
 *
 * @param property the property as the source names it, e.g. {@code skyCover}
 * @param from the start of the source's interval
 * @param length how long the source's one value covers
 * @param interpolated whether the hourly values were interpolated in time (temperature, dew
 *     point) rather than held over the interval
 */
public record CoarseSpan(String property, Instant from, Duration length, boolean interpolated) {
  public CoarseSpan {
    Objects.requireNonNull(property, "property");
    Objects.requireNonNull(from, "from");
    Objects.requireNonNull(length, "length");
  }

  public Instant to() {
    return from.plus(length);
  }

  /** Whether the span overlaps [{@code start}, {@code end}]. */
  public boolean overlaps(Instant start, Instant end) {
    return from.isBefore(end) && to().isAfter(start);
  }
}
