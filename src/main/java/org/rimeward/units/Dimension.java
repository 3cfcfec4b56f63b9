package org.rimeward.units;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The kinds of quantity Rimeward reads, each with its canonical unit and the spellings it accepts.
 * Every value is converted to the canonical unit once, where it is read, and carried as a plain
 * double whose name says the unit ({@code airTempC}, {@code windMs}, {@code rateMmH}).
 */
public enum Dimension {
  TEMPERATURE("°C", "-2.2C or 28F",
      unit(1, 0, "c", "°c", "degc"), unit(1 / 1.8, -32 / 1.8, "f", "°f", "degf"),
      unit(1, -273.15, "k")),
  /** A temperature difference (margins, offsets, protection): 1 °F of difference is 1/1.8 °C. */
  TEMPERATURE_DELTA("°C", "1.0C or 2F",
      unit(1, 0, "c", "°c", "degc", "k"), unit(1 / 1.8, 0, "f", "°f", "degf")),
  SPEED("m/s", "3 m/s, 7 mph, 11 km/h or 6 kn",
      unit(1, 0, "m/s", "ms"), unit(0.44704, 0, "mph"), unit(1 / 3.6, 0, "km/h", "kmh", "kph"),
      unit(0.514444, 0, "kn", "kt", "knots")),
  RATE("mm/h", "3.8 mm/h or 0.15 in/h",
      unit(1, 0, "mm/h", "mm/hr"), unit(25.4, 0, "in/h", "in/hr")),
  LENGTH("m", "240 m or 800 ft",
      unit(1, 0, "m"), unit(0.3048, 0, "ft", "feet"), unit(1000, 0, "km")),
  AREA("ha", "4.5 ha or 11 ac",
      unit(1, 0, "ha"), unit(0.40468564224, 0, "ac", "acre", "acres"), unit(1e-4, 0, "m2", "m²")),
  FLOW("m3/h", "450 m3/h, 125 L/s or 600 gpm",
      unit(1, 0, "m3/h", "m³/h"), unit(0.003785411784 * 60, 0, "gpm"), unit(3.6, 0, "l/s")),
  VOLUME("m3", "9000 m3, 2.4 acre-ft or 500000 gal",
      unit(1, 0, "m3", "m³"), unit(0.003785411784, 0, "gal"),
      unit(1233.48183754752, 0, "acre-ft", "af"), unit(1000, 0, "ml")),
  PRESSURE("kPa", "98.5 kPa, 985 hPa or 29.1 inHg",
      unit(1, 0, "kpa"), unit(0.1, 0, "hpa", "mbar", "mb"), unit(0.001, 0, "pa"),
      unit(3.386389, 0, "inhg")),
  AREAL_MASS("g/m2", "50 g/m2 or 1.5 oz/yd2",
      unit(1, 0, "g/m2", "g/m²", "gsm"), unit(33.905747, 0, "oz/yd2", "oz/yd²", "oz")),
  PERCENT("%", "80% or 80",
      unit(1, 0, "%", "pct"));

  private final String canonical;
  private final String examples;
  private final List<Unit> units;

  Dimension(String canonical, String examples, Unit... units) {
    this.canonical = canonical;
    this.examples = examples;
    this.units = List.of(units);
  }

  /** The canonical unit's symbol, the one all values of this dimension are converted to. */
  public String canonical() {
    return canonical;
  }

  /** Example spellings shown in error messages. */
  public String examples() {
    return examples;
  }

  Optional<Unit> unitFor(String symbol) {
    String s = symbol.toLowerCase(Locale.ROOT).replace(" ", "");
    return units.stream().filter(u -> u.symbols().contains(s)).findFirst();
  }

  Unit canonicalUnit() {
    return units.get(0);
  }

  Unit usUnit() {
    return units.size() > 1 && this != PRESSURE && this != PERCENT ? units.get(1) : units.get(0);
  }

  private static Unit unit(double factor, double offset, String... symbols) {
    return new Unit(factor, offset, List.of(symbols));
  }

  /** value in canonical unit = value × factor + offset. */
  record Unit(double factor, double offset, List<String> symbols) {
    double toCanonical(double v) {
      return v * factor + offset;
    }
  }
}
