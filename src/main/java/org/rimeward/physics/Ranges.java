package org.rimeward.physics;

import java.util.Locale;

/** Validity ranges of the physics functions: out-of-range input is an error, never clamped. */
final class Ranges {
  private Ranges() {}

  static double check(String what, double value, double min, double max, String unit) {
    if (!(value >= min && value <= max)) {
      throw new OutOfRangeException(String.format(Locale.ROOT,
          "%s %s %s is outside the range this method is valid for (%s to %s %s)",
          what, fmt(value), unit, fmt(min), fmt(max), unit));
    }
    return value;
  }

  /** A dew point above the air temperature is impossible (supersaturated air is not measured). */
  static void checkDewPoint(double airTempC, double dewPointC) {
    if (!Double.isFinite(airTempC) || !Double.isFinite(dewPointC)) {
      throw new OutOfRangeException("air temperature and dew point must be finite numbers, were "
          + fmt(airTempC) + " °C and " + fmt(dewPointC) + " °C");
    }
    // A dew point computed from RH = 100 % may exceed the air temperature by rounding only.
    if (dewPointC > airTempC + 1e-9) {
      throw new OutOfRangeException(String.format(Locale.ROOT,
          "dew point %s °C is above the air temperature %s °C; the dew point cannot exceed the air"
              + " temperature, so check both readings", fmt(dewPointC), fmt(airTempC)));
    }
  }

  static String fmt(double v) {
    if (!Double.isFinite(v)) {
      return Double.toString(v);
    }
    // Four significant digits, without the trailing zeros that make "2" read as "2.000".
    return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
  }
}
