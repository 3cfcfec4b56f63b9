package org.rimeward.minimum;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.Random;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;

/**
 * Writes an invented station history (stated as such: no real station, no real nights) that obeys
 * a known law on its radiation nights, for testing the fit. Each night cools along a square root
 * from sunset so that the air two hours after sunset is T0 and the minimum at sunrise follows the
 * law (plus optional noise); after sunrise the air holds the minimum for half an hour, then warms.
 * Cloudy and windy nights break the law on purpose: if they were fitted, the coefficients would be
 * wrong.
 */
final class HistoryWriter {
  static final double LAT = 46.28;
  static final double LON = -119.45;
  static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");

  enum Kind { RADIATION, CLOUDY, WINDY }

  private final StringBuilder csv = new StringBuilder();
  private final Random random;
  private final double a;
  private final double b;
  private final double c;
  private final double noiseC;
  private final boolean localTimes;
  private final boolean withCloud;
  private final Duration step;

  HistoryWriter(long seed, double a, double b, double c, double noiseC, boolean localTimes,
      boolean withCloud, Duration step) {
    this.random = new Random(seed);
    this.a = a;
    this.b = b;
    this.c = c;
    this.noiseC = noiseC;
    this.localTimes = localTimes;
    this.withCloud = withCloud;
    this.step = step;
    csv.append(withCloud ? "time,air_temp_c,dew_point_c,wind_ms,cloud_pct\n"
        : "time,air_temp_c,dew_point_c,wind_ms\n");
  }

  /** What a generated night was made of. */
  record Made(LocalDate date, double t0C, double td0C, double minC) {}

  Made night(LocalDate date, Kind kind) {
    Night n = SunCalculator.night(LAT, LON, date, ZONE);
    Instant sunset = n.sunset().orElseThrow().toInstant();
    Instant sunrise = n.sunrise().orElseThrow().toInstant();
    double t0 = 2 + 8 * random.nextDouble();
    double td0 = t0 - 2 - 7 * random.nextDouble();
    double min = switch (kind) {
      case RADIATION -> a * t0 + b * td0 + c + noiseC * random.nextGaussian();
      case CLOUDY -> t0 - 1.0;
      case WINDY -> t0 - 0.5;
    };
    double wind = kind == Kind.WINDY ? 5.0 : 1.0;
    double cloud = kind == Kind.CLOUDY ? 90 : 0;
    double hours = Duration.between(sunset, sunrise).toMinutes() / 60.0;
    // T(h) = Tss - k·√h from sunset: T(2) = t0, T(hours) = min.
    double k = (t0 - min) / (Math.sqrt(hours) - Math.sqrt(2));
    double tss = t0 + k * Math.sqrt(2);
    Instant from = ceil(sunset.minus(Duration.ofHours(1)));
    Instant to = sunrise.plus(Duration.ofMinutes(90));
    for (Instant t = from; t.isBefore(to); t = t.plus(step)) {
      double h = Duration.between(sunset, t).toSeconds() / 3600.0;
      double air;
      if (h <= 0) {
        air = tss - 1.5 * h;
      } else if (!t.isAfter(sunrise)) {
        air = tss - k * Math.sqrt(h);
      } else {
        double after = Duration.between(sunrise, t).toSeconds() / 3600.0;
        air = after <= 0.5 ? min : min + 3 * (after - 0.5);
      }
      double dew = Math.min(td0, air);
      row(t, air, dew, wind, cloud);
    }
    return new Made(date, t0, td0, min);
  }

  private Instant ceil(Instant t) {
    long s = step.toSeconds();
    long e = t.getEpochSecond();
    return Instant.ofEpochSecond((e + s - 1) / s * s);
  }

  private void row(Instant t, double air, double dew, double wind, double cloud) {
    String time = localTimes
        ? ZonedDateTime.ofInstant(t, ZONE).toLocalDateTime().format(DateTimeFormatter.ISO_LOCAL_DATE_TIME)
        : ZonedDateTime.ofInstant(t, ZONE).toOffsetDateTime().toString();
    csv.append(time).append(String.format(Locale.ROOT, ",%.4f,%.4f,%.1f", air, dew, wind));
    if (withCloud) {
      csv.append(String.format(Locale.ROOT, ",%.0f", cloud));
    }
    csv.append('\n');
  }

  String text() {
    return csv.toString();
  }

  static String farmYaml() {
    return """
        # Invented farm for tests of the site-minimum fit.
        farm:
          name: Fit Test Bench
          latitude: 46.28
          longitude: -119.45
          elevation: 240 m
          timezone: America/Los_Angeles
        water_sources:
          - id: pond
            max_flow: 450 m3/h
            volume: 9000 m3
        blocks:
          - id: only
            crop: apple
            stage: full-bloom
            area: 1 ha
        """;
  }
}
