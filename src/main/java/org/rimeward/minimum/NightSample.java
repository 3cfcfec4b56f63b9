package org.rimeward.minimum;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;
import java.util.Optional;

/**
 * One night of a station history, as the site-minimum method reads it: the air temperature and
 * dew point two hours after sunset, the minimum before sunrise, what the night was like, and
 * whether it counts as a radiation night.
 *
 * @param date the evening's local date
 * @param t0 sunset plus two hours (elapsed time, so a daylight-saving change does not move it)
 * @param airC air temperature at {@code t0}, interpolated, °C (NaN when not known)
 * @param dewC dew point at {@code t0}, interpolated, °C (NaN when not known)
 * @param minAirC lowest air temperature from {@code t0} to sunrise, °C (NaN when not known)
 * @param meanWindMs mean wind from sunset to sunrise, m/s (NaN when the file has no wind)
 * @param meanCloudPct mean cloud cover from sunset to sunrise, % (NaN when the file has none)
 * @param earlyCoolingC fall of the air from sunset to {@code t0}, °C (NaN when not known)
 * @param excluded why the night is left out; empty for a radiation night that is used
 */
public record NightSample(LocalDate date, Instant t0, double airC, double dewC, double minAirC,
    double meanWindMs, double meanCloudPct, double earlyCoolingC, Optional<String> excluded) {
  public NightSample {
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(t0, "t0");
    Objects.requireNonNull(excluded, "excluded");
  }

  public boolean used() {
    return excluded.isEmpty();
  }
}
