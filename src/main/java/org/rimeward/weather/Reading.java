package org.rimeward.weather;

import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One reading of a farm's own weather station or block thermometer, in canonical units. Only the
 * time and the air temperature are always there; a logger may record no humidity, wind or cloud.
 *
 * @param time when the reading was taken
 * @param offset the UTC offset the time was written with, or resolved to in the farm's zone
 * @param station the station's id from the file's {@code station} column; empty when the file has
 *     none (the farm's default station)
 * @param airTempC air temperature, °C
 * @param dewPointC dew point over water, °C, when the logger records humidity
 * @param windMs wind speed, m/s, at {@code windHeightM}, when recorded
 * @param windHeightM height of the wind sensor, m
 * @param cloudPct cloud cover, %, when the file has it
 * @param wetBulbC a psychrometer's wet bulb, °C, when recorded
 * @param line the CSV line the reading came from (0 when built in code)
 */
public record Reading(Instant time, ZoneOffset offset, String station, double airTempC,
    OptionalDouble dewPointC, OptionalDouble windMs, double windHeightM, OptionalDouble cloudPct,
    OptionalDouble wetBulbC, int line) {
  public Reading {
    Objects.requireNonNull(time, "time");
    Objects.requireNonNull(offset, "offset");
    Objects.requireNonNull(station, "station");
    Objects.requireNonNull(dewPointC, "dewPointC");
    Objects.requireNonNull(windMs, "windMs");
    Objects.requireNonNull(cloudPct, "cloudPct");
    Objects.requireNonNull(wetBulbC, "wetBulbC");
    if (!(airTempC >= ForecastStep.MIN_TEMP_C && airTempC <= ForecastStep.MAX_TEMP_C)) {
      throw new IllegalArgumentException("air temperature " + airTempC + " °C is outside -40 to 45 °C");
    }
    if (dewPointC.isPresent() && dewPointC.getAsDouble() > airTempC + 1e-9) {
      throw new IllegalArgumentException("dew point " + dewPointC.getAsDouble()
          + " °C is above the air temperature " + airTempC + " °C");
    }
    if (!(windHeightM > 0 && windHeightM <= ForecastStep.MAX_WIND_HEIGHT_M)) {
      throw new IllegalArgumentException("wind height " + windHeightM + " m is outside 0 to 100 m");
    }
  }

  /** A reading of air temperature and dew point only, for code and tests. */
  public static Reading of(Instant time, ZoneOffset offset, double airTempC, double dewPointC) {
    return new Reading(time, offset, "", airTempC, OptionalDouble.of(dewPointC),
        OptionalDouble.empty(), ReadingsReader.DEFAULT_WIND_HEIGHT_M, OptionalDouble.empty(),
        OptionalDouble.empty(), 0);
  }
}
