package org.rimeward.farm;

import java.util.regex.Pattern;

/** Block and water source ids: typed on the command line and stored in the audit, so kept plain. */
final class Ids {
  static final Pattern ID = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._-]*");
  static final String RULE = "letters, digits, '.', '_' or '-', starting with a letter or digit (e.g. north-gala)";

  private Ids() {}

  static String check(String what, String id) {
    if (id == null || !ID.matcher(id).matches()) {
      throw new IllegalArgumentException(what + " '" + id + "' must be " + RULE);
    }
    return id;
  }
}
