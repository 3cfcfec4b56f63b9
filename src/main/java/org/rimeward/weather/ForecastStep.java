package org.rimeward.weather;

import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;
import org.rimeward.physics.Psychrometrics;

/**
 * One forecast time step, in canonical units.
 *
 * @param time the instant the values apply to
 * @param offset the UTC offset the time was written with, or the one it was resolved to from the
 *     farm's zone
 * @param airTempC air temperature, °C
 * @param dewPointC dew point over water, °C (never above the air temperature)
 * @param windMs wind speed, m/s, at {@code windHeightM} (not converted to 2 m here)
 * @param windHeightM height of the wind measurement or forecast, m
 * @param cloudPct cloud cover, %
 * @param solarWm2 global solar radiation, W/m², when the forecast gives it
 * @param line the CSV line the step was read from (0 when built in code)
 */
public record ForecastStep(
    Instant time,
    ZoneOffset offset,
    double airTempC,
    double dewPointC,
    double windMs,
    double windHeightM,
    double cloudPct,
    OptionalDouble solarWm2,
    int line) {

  /** Limits of the values accepted; see {@link ForecastReader} for why. */
  public static final double MIN_TEMP_C = -40;
  public static final double MAX_TEMP_C = 45;
  public static final double MAX_WIND_MS = 60;
  public static final double MAX_WIND_HEIGHT_M = 100;
  public static final double MAX_SOLAR_WM2 = 1400;

  public ForecastStep {
    Objects.requireNonNull(time, "time");
    Objects.requireNonNull(offset, "offset");
    Objects.requireNonNull(solarWm2, "solarWm2");
    check("air temperature", airTempC, MIN_TEMP_C, MAX_TEMP_C, "°C");
    check("dew point", dewPointC, MIN_TEMP_C, MAX_TEMP_C, "°C");
    if (dewPointC > airTempC + 1e-9) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "dew point %.2f °C is above the air temperature %.2f °C", dewPointC, airTempC));
    }
    check("wind speed", windMs, 0, MAX_WIND_MS, "m/s");
    if (!(windHeightM > 0 && windHeightM <= MAX_WIND_HEIGHT_M)) {
      throw new IllegalArgumentException("wind height " + windHeightM + " m is outside 0 (exclusive) to 100 m");
    }
    check("cloud cover", cloudPct, 0, 100, "%");
    if (solarWm2.isPresent()) {
      check("solar radiation", solarWm2.getAsDouble(), 0, MAX_SOLAR_WM2, "W/m²");
    }
    if (line < 0) {
      throw new IllegalArgumentException("line must be 0 or above, was " + line);
    }
  }

  private static void check(String what, double v, double min, double max, String unit) {
    if (!(v >= min && v <= max)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "%s %s %s is outside %s to %s %s", what, v, unit, min, max, unit));
    }
  }

  /** The step's time as a wall-clock time in {@code zone}. */
  public ZonedDateTime localTime(ZoneId zone) {
    return time.atZone(zone);
  }

  /** The time as it was written or resolved, with its offset. */
  public ZonedDateTime writtenTime() {
    return time.atZone(offset);
  }

  /** Relative humidity over water, %, from air temperature and dew point (Alduchov &amp; Eskridge 1996). */
  public double rhPct() {
    return Psychrometrics.rhPct(airTempC, dewPointC);
  }
}
