package org.rimeward.physics;

import java.util.Locale;

/** Validity ranges of the physics functions: out-of-range input is an error, never clamped. */
final class Ranges {
  private Ranges() {}

  static double check(String what, double value, double min, double max, String unit) {
    if (!(value >= min && value <= max)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "%s %s %s is outside the range this method is valid for (%s to %s %s)",
          what, fmt(value), unit, fmt(min), fmt(max), unit));
    }
    return value;
  }

  private static String fmt(double v) {
    return Double.isNaN(v) ? "NaN" : String.format(Locale.ROOT, "%.4g", v);
  }
}
