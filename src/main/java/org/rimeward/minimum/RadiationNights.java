package org.rimeward.minimum;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Function;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;
import org.rimeward.weather.Reading;

/**
 * Cuts a station history into nights and keeps the radiation nights, the only ones the FAO 2005
 * ch. 6 empirical minimum method applies to ("wind less than 2 m/s, no clouds, no fog, no rain").
 *
 * <p>Each night runs from the farm's own sunset (NOAA method) to the next sunrise. {@code t0} is
 * sunset plus two hours of elapsed time; the air temperature and dew point there are interpolated
 * linearly between the readings on either side. The minimum is the lowest reading from {@code t0}
 * to sunrise, with the value interpolated at sunrise itself.
 *
 * <p>Criteria (each stated in the output):
 * <ul>
 *   <li>coverage: readings within {@link Criteria#maxGap} of sunset, of {@code t0} and of sunrise, and
 *       no gap longer than that in between;</li>
 *   <li>calm: mean wind over the night at most {@link Criteria#maxWindMs} where the file has wind
 *       (FAO 2005: radiation frost with wind below 2 m/s);</li>
 *   <li>clear: mean cloud over the night at most {@link Criteria#maxCloudPct} where the file has
 *       cloud;</li>
 *   <li>where the file has no cloud, a proxy: the air must fall at least
 *       {@link Criteria#minEarlyCoolingC} from sunset to {@code t0} (FAO 2005 ch. 1: on a clear calm
 *       night most of the cooling happens in the first hours after net radiation turns negative; an
 *       overcast or windy evening barely cools), and the dew-point depression at {@code t0} must be
 *       at least {@link Criteria#minDepressionC} (saturated air means fog or dew-point-limited
 *       cooling, which the regression does not describe).</li>
 * </ul>
 */
public final class RadiationNights {
  /**
   * The selection criteria. Their values are set, each with its source, in the rule files (rule
   * THRESHOLDS in {@code policy/thresholds.drl}); the layers that read the rule book pass them in.
   *
   * @param maxWindMs the most mean wind over the night, as the history records it
   * @param maxCloudPct the most mean cloud over the night, where the history records cloud
   * @param minEarlyCoolingC where it does not, the least fall of the air from sunset to sunset + 2 h
   * @param minDepressionC where it does not, the least dew-point depression at sunset + 2 h
   * @param maxGap longest gap between readings across the night
   */
  public record Criteria(double maxWindMs, double maxCloudPct, double minEarlyCoolingC,
      double minDepressionC, Duration maxGap) {
    public Criteria {
      java.util.Objects.requireNonNull(maxGap, "maxGap");
    }

    public String describe() {
      return String.format(Locale.ROOT, "mean wind ≤ %.1f m/s where recorded; mean cloud ≤ %.0f %%"
          + " where recorded, otherwise air falling ≥ %.1f °C from sunset to sunset + 2 h and a"
          + " dew-point depression ≥ %.1f °C at sunset + 2 h; no gap over %d min in the readings",
          maxWindMs, maxCloudPct, minEarlyCoolingC, minDepressionC, maxGap.toMinutes());
    }
  }

  /** FAO 2005 ch. 6: the predictors are read two hours after sunset. */
  public static final Duration AFTER_SUNSET = Duration.ofHours(2);

  private RadiationNights() {}

  /** Every night the history spans, used or not, in date order; {@code readings} in time order. */
  public static List<NightSample> nights(List<Reading> readings, double latDeg, double lonDeg,
      ZoneId zone, Criteria criteria) {
    List<NightSample> out = new ArrayList<>();
    if (readings.isEmpty()) {
      return out;
    }
    LocalDate first = readings.get(0).time().atZone(zone).toLocalDate().minusDays(1);
    LocalDate last = readings.get(readings.size() - 1).time().atZone(zone).toLocalDate();
    for (LocalDate d = first; !d.isAfter(last); d = d.plusDays(1)) {
      Night n = SunCalculator.night(latDeg, lonDeg, d, zone);
      if (n.sunset().isEmpty() || n.sunrise().isEmpty()) {
        continue;
      }
      Instant sunset = n.sunset().map(ZonedDateTime::toInstant).get();
      Instant sunrise = n.sunrise().map(ZonedDateTime::toInstant).get();
      if (sunset.isBefore(readings.get(0).time())
          || sunrise.isAfter(readings.get(readings.size() - 1).time())) {
        continue;
      }
      int lo = Math.max(0, indexAtOrAfter(readings, sunset) - 1);
      int hi = Math.min(readings.size(), indexAtOrAfter(readings, sunrise.plusNanos(1)) + 1);
      out.add(sample(readings.subList(lo, hi), d, sunset, sunrise, criteria));
    }
    return out;
  }

  /**
   * Tonight so far, for the site model: T0 and Td0 at sunset + 2 h when the readings reach past
   * it, and why the night does not look like a radiation night if it does not (judged on the
   * readings from sunset to {@code now}, by the same criteria as the fit).
   */
  public static Optional<NightSample> tonight(List<Reading> readings, LocalDate date, Instant sunset,
      Instant now, Criteria k) {
    Instant t0 = sunset.plus(AFTER_SUNSET);
    if (now.isBefore(t0) || readings.isEmpty()) {
      return Optional.empty();
    }
    double air0 = interpolate(readings, t0, Reading::airTempC, k.maxGap());
    double dew0 = interpolate(readings, t0, r -> r.dewPointC().isPresent()
        ? r.dewPointC().getAsDouble() : Double.NaN, k.maxGap());
    if (Double.isNaN(air0) || Double.isNaN(dew0)) {
      return Optional.empty();
    }
    List<Reading> night = readings.stream().filter(r -> !r.time().isBefore(sunset)
        && !r.time().isAfter(now)).toList();
    double wind = mean(night, Reading::windMs);
    double cloud = mean(night, Reading::cloudPct);
    double early = interpolate(readings, sunset, Reading::airTempC, k.maxGap()) - air0;
    Optional<String> why = Optional.empty();
    if (!Double.isNaN(wind) && wind > k.maxWindMs()) {
      why = Optional.of(String.format(Locale.ROOT, "windy: mean %.1f m/s > %.1f m/s", wind, k.maxWindMs()));
    } else if (!Double.isNaN(cloud) && cloud > k.maxCloudPct()) {
      why = Optional.of(String.format(Locale.ROOT, "cloudy: mean %.0f %% > %.0f %%", cloud, k.maxCloudPct()));
    } else if (Double.isNaN(cloud) && !(early >= k.minEarlyCoolingC())) {
      why = Optional.of(String.format(Locale.ROOT, "not a radiation night by the cooling proxy:"
          + " %.1f °C fall from sunset to sunset + 2 h", early));
    } else if (Double.isNaN(cloud) && air0 - dew0 < k.minDepressionC()) {
      why = Optional.of("near saturation at sunset + 2 h (fog or dew)");
    }
    return Optional.of(new NightSample(date, t0, air0, dew0, Double.NaN, wind, cloud, early, why));
  }

  /** The index of the first reading at or after {@code t} (the size when there is none). */
  private static int indexAtOrAfter(List<Reading> readings, Instant t) {
    int lo = 0;
    int hi = readings.size();
    while (lo < hi) {
      int mid = (lo + hi) >>> 1;
      if (readings.get(mid).time().isBefore(t)) {
        lo = mid + 1;
      } else {
        hi = mid;
      }
    }
    return lo;
  }

  static NightSample sample(List<Reading> all, LocalDate date, Instant sunset, Instant sunrise,
      Criteria k) {
    Instant t0 = sunset.plus(AFTER_SUNSET);
    List<Reading> night = new ArrayList<>();
    Reading before = null;
    Reading after = null;
    for (Reading r : all) {
      if (r.time().isBefore(sunset)) {
        before = r;
      } else if (!r.time().isAfter(sunrise)) {
        night.add(r);
      } else if (after == null) {
        after = r;
      }
    }
    List<Reading> span = new ArrayList<>();
    if (before != null) {
      span.add(before);
    }
    span.addAll(night);
    if (after != null) {
      span.add(after);
    }
    double air0 = interpolate(span, t0, Reading::airTempC, k.maxGap());
    double dew0 = interpolate(span, t0, r -> r.dewPointC().isPresent() ? r.dewPointC().getAsDouble()
        : Double.NaN, k.maxGap());
    double airSunset = interpolate(span, sunset, Reading::airTempC, k.maxGap());
    double airSunrise = interpolate(span, sunrise, Reading::airTempC, k.maxGap());
    double min = airSunrise;
    for (Reading r : night) {
      if (!r.time().isBefore(t0)) {
        min = Math.min(min, r.airTempC());
      }
    }
    double wind = mean(night, Reading::windMs);
    double cloud = mean(night, Reading::cloudPct);
    double early = airSunset - air0;
    Optional<String> why = Optional.empty();
    Duration gap = longestGap(span, sunset, sunrise);
    if (gap.compareTo(k.maxGap()) > 0) {
      why = Optional.of("readings missing: " + gap.toMinutes() + " min without a reading");
    } else if (Double.isNaN(dew0)) {
      why = Optional.of("no dew point at sunset + 2 h");
    } else if (!Double.isNaN(wind) && wind > k.maxWindMs()) {
      why = Optional.of(String.format(Locale.ROOT, "windy: mean %.1f m/s > %.1f m/s", wind,
          k.maxWindMs()));
    } else if (!Double.isNaN(cloud) && cloud > k.maxCloudPct()) {
      why = Optional.of(String.format(Locale.ROOT, "cloudy: mean %.0f %% > %.0f %%", cloud,
          k.maxCloudPct()));
    } else if (Double.isNaN(cloud) && early < k.minEarlyCoolingC()) {
      why = Optional.of(String.format(Locale.ROOT, "not a radiation night by the cooling proxy:"
          + " %.1f °C fall from sunset to sunset + 2 h < %.1f °C", early, k.minEarlyCoolingC()));
    } else if (Double.isNaN(cloud) && air0 - dew0 < k.minDepressionC()) {
      why = Optional.of(String.format(Locale.ROOT, "near saturation (fog or dew): dew-point"
          + " depression %.1f °C < %.1f °C", air0 - dew0, k.minDepressionC()));
    }
    return new NightSample(date, t0, air0, dew0, min, wind, cloud, early, why);
  }

  /** Linear in time between the readings either side; NaN when they are too far apart. */
  static double interpolate(List<Reading> span, Instant t, Function<Reading, Double> value,
      Duration maxGap) {
    Reading lo = null;
    Reading hi = null;
    for (Reading r : span) {
      if (!r.time().isAfter(t)) {
        lo = r;
      }
      if (hi == null && !r.time().isBefore(t)) {
        hi = r;
      }
    }
    if (lo == null || hi == null) {
      return Double.NaN;
    }
    double a = value.apply(lo);
    double b = value.apply(hi);
    if (lo == hi) {
      return a;
    }
    long total = Duration.between(lo.time(), hi.time()).toMillis();
    if (total > maxGap.toMillis()) {
      return Double.NaN;
    }
    double f = Duration.between(lo.time(), t).toMillis() / (double) total;
    return a + (b - a) * f;
  }

  private static double mean(List<Reading> night, Function<Reading, OptionalDouble> value) {
    return night.stream().map(value).filter(OptionalDouble::isPresent)
        .mapToDouble(OptionalDouble::getAsDouble).average().orElse(Double.NaN);
  }

  private static Duration longestGap(List<Reading> span, Instant from, Instant to) {
    Duration max = Duration.ZERO;
    Instant prev = null;
    boolean coveredFrom = false;
    for (Reading r : span) {
      if (prev != null) {
        Duration d = Duration.between(prev, r.time());
        if (d.compareTo(max) > 0) {
          max = d;
        }
      }
      if (!r.time().isAfter(from)) {
        coveredFrom = true;
      }
      prev = r.time();
    }
    if (span.isEmpty() || !coveredFrom || prev.isBefore(to)) {
      Duration whole = Duration.between(from, to);
      return whole.compareTo(max) > 0 ? whole : max;
    }
    return max;
  }
}
