package org.rimeward.io;

import java.util.regex.Pattern;

/**
 * The one reading of a number a person wrote: digits with an optional sign, decimal point and
 * exponent. A typographic minus (U+2212, what word processors and many spreadsheets put in front
 * of a negative number) counts as a minus. A decimal comma is refused with "use a decimal point",
 * unless the caller knows the file uses decimal commas (a semicolon-separated export). Infinite
 * and not-a-number values are never numbers here.
 */
public final class Numbers {
  /** A plain number as Java and every data format here write it. */
  public static final String PATTERN = "[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?";
  private static final Pattern NUMBER = Pattern.compile(PATTERN);
  private static final Pattern DECIMAL_COMMA = Pattern.compile("[+-]?\\d+,\\d+(?:[eE][+-]?\\d+)?");

  private Numbers() {}

  /** {@code text} with typographic minus signs made ASCII and outer blanks removed. */
  public static String normalize(String text) {
    return text.strip().replace('\u2212', '-');
  }

  /**
   * The number in {@code text}; {@code decimalComma} accepts {@code 2,5} as 2.5.
   *
   * @throws NotANumberException saying what is wrong and what to write
   */
  public static double parse(String text, boolean decimalComma) {
    String s = normalize(text);
    if (decimalComma && DECIMAL_COMMA.matcher(s).matches()) {
      s = s.replace(',', '.');
    }
    if (!NUMBER.matcher(s).matches()) {
      throw new NotANumberException(Text.quote(text) + " is not a number; " + hint(s));
    }
    double v = Double.parseDouble(s);
    if (!Double.isFinite(v)) {
      throw new NotANumberException(Text.quote(text) + " is too large to be a measured value;"
          + " check the digits");
    }
    return v;
  }

  /** What to write instead of {@code s}, which is not a plain number. */
  public static String hint(String s) {
    if (DECIMAL_COMMA.matcher(s.replaceAll("[^0-9,eE+-].*$", "")).matches()
        || s.matches("[+-]?\\d+,\\d+.*")) {
      return "use a decimal point, e.g. 2.5 instead of 2,5";
    }
    String lower = s.toLowerCase(java.util.Locale.ROOT);
    if (lower.contains("inf") || lower.contains("nan")) {
      return "give a finite value";
    }
    return "write a plain number, e.g. 2.5";
  }

  /** A number that could not be read; the message says why and what to write. */
  public static final class NotANumberException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    public NotANumberException(String message) {
      super(message);
    }
  }
}
