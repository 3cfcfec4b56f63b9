package org.rimeward.units;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The one unit table: the kinds of quantity Rimeward reads, each with its canonical unit, the
 * unit it is shown in under {@code --units us}, and the spellings it accepts. Every value is
 * converted to the canonical unit once, where it is read, and carried as a plain double whose
 * name says the unit ({@code airTempC}, {@code windMs}, {@code rateMmH}).
 *
 * <p>Spellings are compared without regard to case, except megalitres: {@code ML} only, since
 * {@code ml} is a millilitre to most people and a volume a million times smaller.
 */
public enum Dimension {
  TEMPERATURE("-2.2C or 28F", 1,
      unit("°C", 1, 0, "c", "°c", "degc"), unit("°F", 1 / 1.8, -32 / 1.8, "f", "°f", "degf"),
      unit("K", 1, -273.15, "k")),
  /** A temperature difference (margins, offsets, protection): 1 °F of difference is 1/1.8 °C. */
  TEMPERATURE_DELTA("1.0C or 2F", 1,
      unit("°C", 1, 0, "c", "°c", "degc", "k"), unit("°F", 1 / 1.8, 0, "f", "°f", "degf")),
  SPEED("3 m/s, 7 mph, 11 km/h or 6 kn", 1,
      unit("m/s", 1, 0, "m/s", "ms"), unit("mph", 0.44704, 0, "mph"),
      unit("km/h", 1 / 3.6, 0, "km/h", "kmh", "kph"), unit("kn", 1852.0 / 3600, 0, "kn", "kt", "knots")),
  RATE("3.8 mm/h or 0.15 in/h", 1,
      unit("mm/h", 1, 0, "mm/h", "mm/hr"), unit("in/h", 25.4, 0, "in/h", "in/hr")),
  LENGTH("240 m or 800 ft", 1,
      unit("m", 1, 0, "m"), unit("ft", 0.3048, 0, "ft", "feet"), unit("km", 1000, 0, "km")),
  AREA("4.5 ha or 11 ac", 1,
      unit("ha", 1, 0, "ha"), unit("ac", 0.40468564224, 0, "ac", "acre", "acres"),
      unit("m²", 1e-4, 0, "m2", "m²")),
  FLOW("450 m3/h, 125 L/s or 600 gpm", 1,
      unit("m3/h", 1, 0, "m3/h", "m³/h"), unit("gpm", 0.003785411784 * 60, 0, "gpm"),
      unit("L/s", 3.6, 0, "l/s")),
  VOLUME("9000 m3, 2.4 acre-ft, 9 ML or 500000 gal", 1,
      unit("m3", 1, 0, "m3", "m³"), unit("gal", 0.003785411784, 0, "gal"),
      unit("acre-ft", 1233.48183754752, 0, "acre-ft", "af"), caseSensitive("ML", 1000, "ML")),
  PRESSURE("98.5 kPa, 985 hPa or 29.1 inHg", 0,
      unit("kPa", 1, 0, "kpa"), unit("hPa", 0.1, 0, "hpa", "mbar", "mb"), unit("Pa", 0.001, 0, "pa"),
      unit("inHg", 3.386389, 0, "inhg")),
  AREAL_MASS("50 g/m2 or 1.5 oz/yd2", 1,
      unit("g/m2", 1, 0, "g/m2", "g/m²", "gsm"), unit("oz/yd2", 33.905747, 0, "oz/yd2", "oz/yd²", "oz")),
  PERCENT("80% or 80", 0,
      unit("%", 1, 0, "%", "pct"));

  private final String examples;
  private final int usIndex;
  private final List<Unit> units;

  Dimension(String examples, int usIndex, Unit... units) {
    this.examples = examples;
    this.usIndex = usIndex;
    this.units = List.of(units);
  }

  /** The canonical unit's symbol, the one all values of this dimension are converted to. */
  public String canonical() {
    return canonicalUnit().display();
  }

  /** Example spellings shown in error messages. */
  public String examples() {
    return examples;
  }

  Optional<Unit> unitFor(String symbol) {
    String exact = symbol.replace(" ", "");
    String s = exact.toLowerCase(Locale.ROOT);
    return units.stream()
        .filter(u -> u.caseSensitive() ? u.symbols().contains(exact) : u.symbols().contains(s))
        .findFirst();
  }

  Unit canonicalUnit() {
    return units.get(0);
  }

  /** The unit values are shown in under {@code system}. */
  Unit displayUnit(UnitSystem system) {
    return system == UnitSystem.US ? units.get(usIndex) : units.get(0);
  }

  private static Unit unit(String display, double factor, double offset, String... symbols) {
    return new Unit(display, factor, offset, List.of(symbols), false);
  }

  private static Unit caseSensitive(String display, double factor, String... symbols) {
    return new Unit(display, factor, 0, List.of(symbols), true);
  }

  /** value in canonical unit = value × factor + offset. */
  record Unit(String display, double factor, double offset, List<String> symbols,
      boolean caseSensitive) {
    double toCanonical(double v) {
      return v * factor + offset;
    }
  }
}
