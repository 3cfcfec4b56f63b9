package org.rimeward.io;

/**
 * How a value a person wrote is shown back in a message: quoted, with control characters
 * escaped (an ANSI escape in a farm name must not repaint the terminal) and a long value cut to a
 * few dozen characters (a multi-megabyte cell must not flood it).
 */
public final class Text {
  /** The most characters of a value a message repeats. */
  public static final int MAX_QUOTED = 40;

  private Text() {}

  /** {@code 'value'}, escaped and cut to {@link #MAX_QUOTED} characters. */
  public static String quote(String value) {
    if (value == null) {
      return "(none)";
    }
    String shown = value.length() > MAX_QUOTED ? value.substring(0, MAX_QUOTED) : value;
    String cut = value.length() > MAX_QUOTED
        ? "'... (" + value.length() + " characters)" : "'";
    return "'" + escape(shown) + cut;
  }

  /** The text with every control character except a line break written as {@code \\uXXXX}. */
  public static String escape(String s) {
    StringBuilder b = null;
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      boolean control = Character.isISOControl(c) && c != '\n' || c == '\u2028' || c == '\u2029'
          || Character.getType(c) == Character.FORMAT && c != '\u200D';
      if (control) {
        if (b == null) {
          b = new StringBuilder(s.length() + 8).append(s, 0, i);
        }
        b.append(String.format("\\u%04X", (int) c));
      } else if (b != null) {
        b.append(c);
      }
    }
    return b == null ? s : b.toString();
  }

  /** The first control character in {@code s} as {@code U+XXXX}, or null when there is none. */
  public static String firstControl(String s) {
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (Character.isISOControl(c)) {
        return String.format("U+%04X", (int) c);
      }
    }
    return null;
  }
}
