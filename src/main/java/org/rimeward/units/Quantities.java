package org.rimeward.units;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads quantities written with their unit ({@code -2.2C}, {@code 7 mph}, {@code 0.15 in/h}) and
 * converts them to the canonical unit of their {@link Dimension}. This is the one place where
 * units are converted on the way in.
 */
public final class Quantities {
  private static final Pattern QUANTITY =
      Pattern.compile("^\\s*([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*(.*?)\\s*$");

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
   * metric, °F for US) and is an error for every other dimension unless {@code bareAs} is given
   * and the dimension is a percentage.
   */
  public static double parse(String text, Dimension dim, String field, UnitSystem bareAs) {
    if (text == null || text.isBlank()) {
      throw new QuantityException(field + ": a value is required, for example " + dim.examples());
    }
    Matcher m = QUANTITY.matcher(text);
    if (!m.matches()) {
      throw new QuantityException(
          field + ": '" + text + "' is not a quantity; write it as " + dim.examples());
    }
    double number = Double.parseDouble(m.group(1));
    String symbol = m.group(2);
    Dimension.Unit unit;
    if (symbol.isEmpty()) {
      unit = bareUnit(dim, bareAs, text, field);
    } else {
      unit = dim.unitFor(symbol).orElseThrow(() -> new QuantityException(field + ": unit '"
          + symbol + "' in '" + text + "' is not known here; write it as " + dim.examples()));
    }
    double v = unit.toCanonical(number);
    if (!Double.isFinite(v)) {
      throw new QuantityException(field + ": '" + text + "' is not a finite number");
    }
    return v;
  }

  private static Dimension.Unit bareUnit(Dimension dim, UnitSystem bareAs, String text, String field) {
    if (dim == Dimension.PERCENT) {
      return dim.canonicalUnit();
    }
    boolean temperature = dim == Dimension.TEMPERATURE || dim == Dimension.TEMPERATURE_DELTA;
    if (temperature && bareAs != null) {
      return bareAs == UnitSystem.US ? dim.usUnit() : dim.canonicalUnit();
    }
    throw new QuantityException(field + ": '" + text + "' has no unit; write it as "
        + dim.examples());
  }

  /** The value, given in the canonical unit, expressed in the display unit of {@code system}. */
  public static double display(double canonical, Dimension dim, UnitSystem system) {
    Dimension.Unit u = system == UnitSystem.US ? dim.usUnit() : dim.canonicalUnit();
    return (canonical - u.offset()) / u.factor();
  }

  /** The display symbol of {@code dim} in {@code system}. */
  public static String symbol(Dimension dim, UnitSystem system) {
    if (system == UnitSystem.METRIC) {
      return dim.canonical();
    }
    return switch (dim) {
      case TEMPERATURE, TEMPERATURE_DELTA -> "°F";
      case SPEED -> "mph";
      case RATE -> "in/h";
      case LENGTH -> "ft";
      case AREA -> "ac";
      case FLOW -> "gpm";
      case VOLUME -> "gal";
      case AREAL_MASS -> "oz/yd2";
      default -> dim.canonical();
    };
  }

  /** Formats a canonical value for a person, with its unit, in {@code system}. */
  public static String format(double canonical, Dimension dim, UnitSystem system, int decimals) {
    String sym = symbol(dim, system);
    String num = String.format(Locale.ROOT, "%." + decimals + "f", display(canonical, dim, system));
    if (num.matches("-0(\\.0*)?")) {
      num = num.substring(1);
    }
    return sym.startsWith("°") || sym.equals("%") ? num + " " + sym : num + " " + sym;
  }
}
