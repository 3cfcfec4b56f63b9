package org.rimeward.watch;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.List;
import java.util.Locale;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastReader;

/**
 * A copy of the demo farm with invented station readings that follow its forecast exactly, every
 * 10 minutes (dew point held at or below -5 °C, wind 1 m/s): a watched night with no surprise in
 * it, for tests that need readings without a bias of their own.
 */
final class DemoNight {
  static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");

  private DemoNight() {}

  /** The farm folder under {@code parent}, with {@code readings.csv} from {@code from} to {@code to}. */
  static Path farmWithReadings(Path parent, Instant from, Instant to) throws IOException {
    Path farm = Files.createDirectory(parent.resolve("farm"));
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    Forecast forecast = ForecastReader.read(farm.resolve("forecast.csv"), ZONE);
    StringBuilder csv = new StringBuilder("time,air_temp_c,dew_point_c,wind_ms\n");
    for (Instant t = from; !t.isAfter(to); t = t.plus(Duration.ofMinutes(10))) {
      double air = ForecastCorrection.forecastAirC(forecast, t);
      csv.append(OffsetDateTime.ofInstant(t, ZONE)).append(String.format(Locale.ROOT,
          ",%.2f,%.2f,1.0%n", air, Math.min(air, -5.0)));
    }
    Files.writeString(farm.resolve("readings.csv"), csv.toString());
    return farm;
  }
}
