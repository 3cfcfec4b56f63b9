package org.rimeward.weather;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;

/**
 * Fills a forecast coarser than hourly with hourly steps, linear in time between the steps
 * around them: air temperature, dew point, wind, cloud and (where both ends have it) solar
 * radiation. Linear is the stated shape: between steps at most 3 h apart it keeps the forecast's
 * own values at its own times. The FAO 2005 frost book's square-root trend (ch. 5,
 * T(t) = T0 + b'·√(t − t0) from two hours after sunset, fitted to the night's minimum; the form
 * seen quoted, the notation from memory) needs a site minimum and holds only on clear calm
 * nights, so it is not used to fill a general forecast. A dew point linear between two dew points
 * at or below the air stays at or below the air between them.
 */
public final class Interpolation {
  /** Steps up to this far apart are filled; a minute of slack for times written to the minute. */
  public static final Duration MAX_STEP = Duration.ofHours(3).plusMinutes(1);
  /** Steps closer than this are used as they are. */
  public static final Duration HOURLY = Duration.ofMinutes(61);
  private static final Duration HOUR = Duration.ofHours(1);

  private Interpolation() {}

  /** The result: the steps, and the longest step the source had (zero if none was filled). */
  public record Hourly(List<ForecastStep> steps, Duration filledFrom) {
    public Hourly {
      steps = List.copyOf(steps);
    }

    public boolean interpolated() {
      return !filledFrom.isZero();
    }
  }

  /**
   * {@code steps} with an hourly step added between any two further apart than {@link #HOURLY}.
   * The caller refuses steps further apart than {@link #MAX_STEP} first.
   */
  public static Hourly toHourly(List<ForecastStep> steps, ZoneId zone) {
    List<ForecastStep> out = new ArrayList<>();
    Duration coarsest = Duration.ZERO;
    for (int i = 0; i < steps.size(); i++) {
      ForecastStep a = steps.get(i);
      out.add(a);
      if (i + 1 == steps.size()) {
        break;
      }
      ForecastStep b = steps.get(i + 1);
      Duration gap = Duration.between(a.time(), b.time());
      if (gap.compareTo(HOURLY) <= 0) {
        continue;
      }
      if (gap.compareTo(MAX_STEP) > 0) {
        throw new IllegalArgumentException("steps " + a.time() + " and " + b.time() + " are "
            + gap.toMinutes() + " minutes apart, more than " + MAX_STEP.toMinutes());
      }
      if (gap.compareTo(coarsest) > 0) {
        coarsest = gap;
      }
      for (Instant t = a.time().plus(HOUR); Duration.between(t, b.time()).compareTo(Duration.ofMinutes(30)) >= 0;
          t = t.plus(HOUR)) {
        out.add(between(a, b, t, zone));
      }
    }
    return new Hourly(out, coarsest);
  }

  /** The step at {@code t}, linear between {@code a} and {@code b}. */
  static ForecastStep between(ForecastStep a, ForecastStep b, Instant t, ZoneId zone) {
    double f = (double) Duration.between(a.time(), t).toMillis()
        / Duration.between(a.time(), b.time()).toMillis();
    double air = lerp(a.airTempC(), b.airTempC(), f);
    double dew = Math.min(air, lerp(a.dewPointC(), b.dewPointC(), f));
    OptionalDouble solar = a.solarWm2().isPresent() && b.solarWm2().isPresent()
        ? OptionalDouble.of(lerp(a.solarWm2().getAsDouble(), b.solarWm2().getAsDouble(), f))
        : OptionalDouble.empty();
    return new ForecastStep(t, zone.getRules().getOffset(t), air, dew,
        lerp(a.windMs(), b.windMs(), f), lerp(a.windHeightM(), b.windHeightM(), f),
        lerp(a.cloudPct(), b.cloudPct(), f), solar, a.line());
  }

  private static double lerp(double x, double y, double f) {
    return x + f * (y - x);
  }
}
