package org.rimeward.physics;

import java.time.Duration;
import java.time.Instant;
import java.util.Objects;

/**
 * The square-root night cooling trend of FAO 2005 (Snyder &amp; de Melo-Abreu, <i>Frost
 * Protection: fundamentals, practice and economics</i>, ch. 6, after Reuter's empirical law): from
 * a temperature {@code T0} at {@code t0} (about two hours after sunset, once net radiation has
 * turned negative and the steep first cooling is over), air on a clear calm night falls as
 * {@code T(t) = T0 + b'·√(t − t0)} to the minimum {@code Tp} at sunrise, with
 * {@code b' = (Tp − T0)/√h} and {@code h} the hours from {@code t0} to sunrise.
 *
 * <p>Valid on radiation nights only (clear, calm: FAO 2005 ch. 1); between {@code t0} and sunrise.
 * Temperatures in °C (any linear scale works: the curve is affine in the temperature).
 *
 * @param startC temperature at {@code t0}, °C
 * @param minC the minimum expected at sunrise, °C
 * @param t0 start of the curve
 * @param sunrise end of the curve, when the minimum is reached
 */
public record CoolingCurve(double startC, double minC, Instant t0, Instant sunrise) {
  public CoolingCurve {
    Objects.requireNonNull(t0, "t0");
    Objects.requireNonNull(sunrise, "sunrise");
    if (!Double.isFinite(startC) || !Double.isFinite(minC)) {
      throw new OutOfRangeException("cooling curve temperatures must be finite, were " + startC
          + " °C and " + minC + " °C");
    }
    if (!sunrise.isAfter(t0)) {
      throw new OutOfRangeException("the cooling curve needs its start (" + t0
          + ") before sunrise (" + sunrise + ")");
    }
  }

  /** Hours from {@code t0} to sunrise, {@code h}. */
  public double hours() {
    return hoursBetween(t0, sunrise);
  }

  /** The coefficient {@code b' = (Tp − T0)/√h}, °C per √hour. */
  public double slopePerRootHour() {
    return (minC - startC) / Math.sqrt(hours());
  }

  /**
   * The trend's temperature at {@code t}: {@code T0} before {@code t0}, the minimum after sunrise
   * (the curve says nothing about the morning warming, so it is not extended past its end).
   */
  public double tempAtC(Instant t) {
    if (!t.isAfter(t0)) {
      return startC;
    }
    if (!t.isBefore(sunrise)) {
      return minC;
    }
    return startC + slopePerRootHour() * Math.sqrt(hoursBetween(t0, t));
  }

  private static double hoursBetween(Instant a, Instant b) {
    return Duration.between(a, b).toNanos() / 3.6e12;
  }
}
