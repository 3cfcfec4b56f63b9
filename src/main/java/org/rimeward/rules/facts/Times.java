package org.rimeward.rules.facts;

import java.time.Instant;

/** Small time arithmetic for rule files, where casts and branches read poorly. */
public final class Times {
  private Times() {}

  public static Instant later(Instant a, Instant b) {
    return a.isAfter(b) ? a : b;
  }

  public static Instant hoursBefore(Instant t, double hours) {
    return t.minusSeconds(Math.round(hours * 3600));
  }
}
