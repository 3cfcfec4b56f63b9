package org.rimeward.crop;

import java.util.Locale;
import java.util.regex.Pattern;
import org.rimeward.io.Fields;
import org.rimeward.io.Text;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * How the parts of a crop file read the values they share: kebab-case ids, temperatures and
 * temperature differences as the source prints them, and yes/no flags. Each is a
 * {@link Fields.Parser}, so a bad value is one problem at its line and the reading goes on.
 */
final class CropFields {
  /** Stage and variety ids: kebab-case trade names, typed on the command line. */
  static final Pattern ID = Pattern.compile("[a-z][a-z0-9]*(-[a-z0-9]+)*");

  private CropFields() {}

  /** The mapping's {@code id}; null (and a problem) when missing or not kebab-case. */
  static String id(Fields f, String hint) {
    return f.value("id", CropFields::kebab, hint);
  }

  private static String kebab(String id) {
    if (!ID.matcher(id).matches()) {
      throw new IllegalArgumentException(Text.quote(id) + " is not a kebab-case id; use lower case"
          + " letters, digits and single hyphens, e.g. tight-cluster");
    }
    return id;
  }

  /**
   * A critical temperature (°C) within {@link Limits}, so a dropped minus or a °F/°C mix-up is
   * caught.
   */
  static Fields.Parser<Double> temperature(Fields f, String key) {
    return t -> {
      double c = quantity(t, Dimension.TEMPERATURE, f.field(key));
      if (c < Limits.MIN_C || c > Limits.MAX_C) {
        throw new IllegalArgumentException(Text.quote(t) + String.format(Locale.ROOT, " (%.1f °C)",
            c) + " is outside the plausible " + Limits.MIN_C + " to +" + Limits.MAX_C + " °C for"
            + " a spring bud or flower; check the number and its unit");
      }
      return c;
    };
  }

  /** A temperature difference (°C): an offset or a margin. */
  static Fields.Parser<Double> delta(Fields f, String key) {
    return t -> quantity(t, Dimension.TEMPERATURE_DELTA, f.field(key));
  }

  private static double quantity(String text, Dimension dim, String field) {
    try {
      return Quantities.parse(text, dim, field);
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException(e.getMessage() + ", with the unit the source prints", e);
    }
  }

  /** A yes/no flag as YAML writes it: true or false. */
  static Fields.Parser<Boolean> flag(String what) {
    return t -> switch (t) {
      case "true", "True", "TRUE" -> true;
      case "false", "False", "FALSE" -> false;
      default -> throw new IllegalArgumentException(Text.quote(t) + " is not true or false; "
          + what);
    };
  }
}
