package org.rimeward.weather;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The rest of the night from the forecast corrected by the farm's own readings.
 *
 * <p>Up to {@code now}, readings replace the forecast: each forecast step the readings cover (a
 * reading within {@link #MAX_READING_GAP} on either side) takes the air temperature and dew
 * point interpolated from them, and the latest reading becomes a step of its own.
 *
 * <p>After {@code now}, the forecast is shifted by the recent offset, {@code bias = mean(observed −
 * forecast)} over the readings of the last hour, carried forward unchanged until sunrise and fading
 * linearly to nothing over {@link #FADE_AFTER_SUNRISE} after it. Why carried, not faded, through
 * the night: on a clear calm night the difference between a block and the forecast's grid point is
 * mostly the site's own (a cold pocket, a slope, the station's height), and FAO 2005 ch. 4 reports
 * differences of 1 °C or more within a couple of hundred metres on flat ground that last as long as
 * the inversion does; after sunrise the sun mixes the air and the site's offset goes with it (a
 * Rimeward choice, stated in the plan). The dew point is shifted the same way by its own offset
 * where the readings have humidity, and never above the corrected air.
 */
public final class ForecastCorrection {
  /** The bias is the mean offset over this span before {@code now}. */
  public static final Duration BIAS_WINDOW = Duration.ofHours(1);
  /** After sunrise the offset fades to nothing over this span. */
  public static final Duration FADE_AFTER_SUNRISE = Duration.ofHours(3);
  /** A forecast step counts as observed only with a reading this close on both sides. */
  public static final Duration MAX_READING_GAP = Duration.ofMinutes(40);

  public static final String METHOD = "offset-carried-to-sunrise";
  public static final String METHOD_TEXT = "readings replace the forecast up to now; after now the"
      + " forecast is shifted by the mean offset (observed − forecast) of the last hour, carried"
      + " to sunrise and fading to nothing over 3 h after it";

  private ForecastCorrection() {}

  /**
   * The corrected forecast and what was done to it.
   *
   * @param biasC mean observed − forecast air temperature over the last hour, °C (NaN when no
   *     reading falls in that hour)
   * @param dewBiasC the same for the dew point (NaN when not known)
   * @param lastAt the latest reading at or before now
   * @param readingsUsed the readings at or before now
   */
  public record Corrected(Forecast forecast, double biasC, double dewBiasC, Optional<Instant> lastAt,
      int readingsUsed, int readingsInBiasWindow) {}

  /** {@code readings} of one station, in time order. */
  public static Corrected apply(Forecast forecast, List<Reading> readings, Instant now,
      Instant sunrise) {
    Objects.requireNonNull(now, "now");
    List<Reading> past = readings.stream().filter(r -> !r.time().isAfter(now)).toList();
    List<Reading> recent = past.stream()
        .filter(r -> r.time().isAfter(now.minus(BIAS_WINDOW))).toList();
    double bias = recent.stream().filter(r -> inside(forecast, r.time()))
        .mapToDouble(r -> r.airTempC() - forecastAirC(forecast, r.time())).average().orElse(Double.NaN);
    double dewBias = recent.stream().filter(r -> r.dewPointC().isPresent() && inside(forecast, r.time()))
        .mapToDouble(r -> r.dewPointC().getAsDouble() - forecastDewC(forecast, r.time()))
        .average().orElse(Double.NaN);
    Optional<Reading> last = past.isEmpty() ? Optional.empty() : Optional.of(past.get(past.size() - 1));

    List<ForecastStep> steps = new ArrayList<>();
    for (ForecastStep s : forecast.steps()) {
      if (!s.time().isAfter(now)) {
        steps.add(observed(s, past).orElse(s));
      } else {
        if (last.isPresent() && (steps.isEmpty() || steps.get(steps.size() - 1).time()
            .isBefore(last.get().time())) && last.get().time().isAfter(previousTime(forecast, s))) {
          steps.add(fromReading(last.get(), s));
        }
        steps.add(shifted(s, bias, dewBias, sunrise));
      }
    }
    return new Corrected(new Forecast(forecast.file(), steps), bias, dewBias,
        last.map(Reading::time), past.size(), recent.size());
  }

  /** How much of the offset applies at {@code t}: all of it until sunrise, then fading. */
  public static double weight(Instant t, Instant sunrise) {
    if (!t.isAfter(sunrise)) {
      return 1.0;
    }
    double f = Duration.between(sunrise, t).toSeconds() / (double) FADE_AFTER_SUNRISE.toSeconds();
    return Math.max(0.0, 1.0 - f);
  }

  private static Instant previousTime(Forecast f, ForecastStep s) {
    Instant prev = Instant.MIN;
    for (ForecastStep x : f.steps()) {
      if (x.time().isBefore(s.time())) {
        prev = x.time();
      }
    }
    return prev;
  }

  private static ForecastStep shifted(ForecastStep s, double bias, double dewBias, Instant sunrise) {
    if (Double.isNaN(bias)) {
      return s;
    }
    double w = weight(s.time(), sunrise);
    double air = s.airTempC() + w * bias;
    double dew = s.dewPointC() + (Double.isNaN(dewBias) ? 0 : w * dewBias);
    return new ForecastStep(s.time(), s.offset(), air, Math.min(dew, air), s.windMs(), s.windHeightM(),
        s.cloudPct(), s.solarWm2(), s.line());
  }

  private static Optional<ForecastStep> observed(ForecastStep s, List<Reading> past) {
    Reading lo = null;
    Reading hi = null;
    for (Reading r : past) {
      if (!r.time().isAfter(s.time())) {
        lo = r;
      }
      if (hi == null && !r.time().isBefore(s.time())) {
        hi = r;
      }
    }
    if (lo == null || hi == null || Duration.between(lo.time(), s.time()).compareTo(MAX_READING_GAP) > 0
        || Duration.between(s.time(), hi.time()).compareTo(MAX_READING_GAP) > 0) {
      return Optional.empty();
    }
    double f = lo == hi ? 0 : Duration.between(lo.time(), s.time()).toMillis()
        / (double) Duration.between(lo.time(), hi.time()).toMillis();
    double air = lo.airTempC() + f * (hi.airTempC() - lo.airTempC());
    double dew = s.dewPointC();
    if (lo.dewPointC().isPresent() && hi.dewPointC().isPresent()) {
      dew = lo.dewPointC().getAsDouble() + f * (hi.dewPointC().getAsDouble() - lo.dewPointC().getAsDouble());
    }
    return Optional.of(new ForecastStep(s.time(), s.offset(), air, Math.min(dew, air), s.windMs(),
        s.windHeightM(), s.cloudPct(), s.solarWm2(), s.line()));
  }

  /** The latest reading as a step, with the forecast's wind, cloud and sun of the step after. */
  private static ForecastStep fromReading(Reading r, ForecastStep next) {
    double dew = r.dewPointC().isPresent() ? r.dewPointC().getAsDouble() : next.dewPointC();
    return new ForecastStep(r.time(), r.offset(), r.airTempC(), Math.min(dew, r.airTempC()),
        next.windMs(), next.windHeightM(), next.cloudPct(), OptionalDouble.empty(), next.line());
  }

  private static boolean inside(Forecast f, Instant t) {
    return !t.isBefore(f.start()) && !t.isAfter(f.end());
  }

  /** The forecast's air temperature at {@code t}, linear between its steps. */
  public static double forecastAirC(Forecast f, Instant t) {
    return interpolate(f, t, true);
  }

  static double forecastDewC(Forecast f, Instant t) {
    return interpolate(f, t, false);
  }

  private static double interpolate(Forecast f, Instant t, boolean air) {
    ForecastStep lo = null;
    ForecastStep hi = null;
    for (ForecastStep s : f.steps()) {
      if (!s.time().isAfter(t)) {
        lo = s;
      }
      if (hi == null && !s.time().isBefore(t)) {
        hi = s;
      }
    }
    if (lo == null || hi == null) {
      throw new IllegalArgumentException(t + " is outside the forecast");
    }
    double a = air ? lo.airTempC() : lo.dewPointC();
    double b = air ? hi.airTempC() : hi.dewPointC();
    if (lo == hi) {
      return a;
    }
    double frac = Duration.between(lo.time(), t).toMillis() / (double) Duration.between(lo.time(), hi.time()).toMillis();
    return a + frac * (b - a);
  }
}
