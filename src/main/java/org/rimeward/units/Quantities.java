package org.rimeward.units;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.io.Numbers;
import org.rimeward.io.Text;

/**
 * Reads quantities written with their unit ({@code -2.2C}, {@code 7 mph}, {@code 0.15 in/h}) and
 * converts them to the canonical unit of their {@link Dimension}; shows canonical values in a
 * unit system. Units are converted here and nowhere else, by the one table in {@link Dimension}.
 */
public final class Quantities {
  /** Absolute zero, °C: no temperature is below it, whatever unit it was written in. */
  public static final double ABSOLUTE_ZERO_C = -273.15;

  private static final Pattern QUANTITY =
      Pattern.compile("^\\s*(" + Numbers.PATTERN + ")\\s*(.*?)\\s*$");

  private static final Pattern DECIMAL_COMMA = Pattern.compile("^[+-]?\\d+,\\d");

  private Quantities() {}

  /**
   * Parses a quantity that must carry its unit. {@code field} names where it came from for the
   * error message (an option, or a file and field).
   */
  public static double parse(String text, Dimension dim, String field) {
    return parse(text, dim, field, null);
  }

  /**
   * Parses a quantity; a bare number is taken in {@code bareAs}'s unit for temperatures (°C for
   * metric, °F for US) and is an error for every other dimension unless the dimension is a
   * percentage.
   */
  public static double parse(String text, Dimension dim, String field, UnitSystem bareAs) {
    if (text == null || text.isBlank()) {
      throw new QuantityException(field + ": a value is required, for example " + dim.examples());
    }
    String normalized = Numbers.normalize(text);
    if (DECIMAL_COMMA.matcher(normalized).find()) {
      throw new QuantityException(field + ": " + Text.quote(text) + " has a comma in the number;"
          + " use a decimal point and no thousands separator, e.g. -2.5C instead of -2,5C");
    }
    Matcher m = QUANTITY.matcher(normalized);
    if (!m.matches()) {
      throw new QuantityException(field + ": " + Text.quote(text) + " is not a quantity; write it"
          + " as " + dim.examples());
    }
    double number = Double.parseDouble(m.group(1));
    String symbol = m.group(2);
    Dimension.Unit unit;
    if (symbol.isEmpty()) {
      unit = bareUnit(dim, bareAs, text, field);
    } else {
      unit = dim.unitFor(symbol).orElseThrow(() -> new QuantityException(field + ": unit "
          + Text.quote(symbol) + " in " + Text.quote(text) + " is not known here; write it as "
          + dim.examples()));
    }
    double v = unit.toCanonical(number);
    if (!Double.isFinite(v)) {
      throw new QuantityException(field + ": " + Text.quote(text) + " is not a finite number");
    }
    if (dim == Dimension.TEMPERATURE && v < ABSOLUTE_ZERO_C) {
      throw new QuantityException(field + ": " + Text.quote(text) + " is below absolute zero"
          + " (-273.15 °C, -459.67 °F, 0 K); check the number and its unit");
    }
    return v;
  }

  /** {@code value} written in the unit {@code symbol} of {@code dim}, in the canonical unit. */
  public static double toCanonical(double value, Dimension dim, String symbol) {
    return dim.unitFor(symbol).orElseThrow(() -> new IllegalArgumentException(
        "no unit '" + symbol + "' for " + dim)).toCanonical(value);
  }

  private static Dimension.Unit bareUnit(Dimension dim, UnitSystem bareAs, String text, String field) {
    if (dim == Dimension.PERCENT) {
      return dim.canonicalUnit();
    }
    boolean temperature = dim == Dimension.TEMPERATURE || dim == Dimension.TEMPERATURE_DELTA;
    if (temperature && bareAs != null) {
      return dim.displayUnit(bareAs);
    }
    throw new QuantityException(field + ": " + Text.quote(text) + " has no unit; write it as "
        + dim.examples());
  }

  /** The value, given in the canonical unit, expressed in the display unit of {@code system}. */
  public static double display(double canonical, Dimension dim, UnitSystem system) {
    Dimension.Unit u = dim.displayUnit(system);
    return (canonical - u.offset()) / u.factor();
  }

  /** The display symbol of {@code dim} in {@code system}. */
  public static String symbol(Dimension dim, UnitSystem system) {
    return dim.displayUnit(system).display();
  }

  /** Formats a canonical value for a person, with its unit, in {@code system}. */
  public static String format(double canonical, Dimension dim, UnitSystem system, int decimals) {
    // Gallons run to six and seven digits: grouped, so 1,250,000 gal reads at a glance.
    boolean grouped = system == UnitSystem.US && (dim == Dimension.VOLUME || dim == Dimension.FLOW);
    String num = String.format(Locale.ROOT, "%" + (grouped ? "," : "") + "." + decimals + "f",
        display(canonical, dim, system));
    if (num.matches("-0(\\.0*)?")) {
      num = num.substring(1);
    }
    return num + " " + symbol(dim, system);
  }
}
