package org.rimeward.units;

import java.util.Locale;

/** How bare numbers on the command line are read and how results are shown. */
public enum UnitSystem {
  METRIC,
  US;

  /** Parses {@code metric} or {@code us}, as given to {@code --units}. */
  public static UnitSystem parse(String text) {
    return switch (text.trim().toLowerCase(Locale.ROOT)) {
      case "metric", "si" -> METRIC;
      case "us", "imperial" -> US;
      default -> throw new QuantityException(
          "--units: '" + text + "' is not a unit system; use metric or us");
    };
  }
}
