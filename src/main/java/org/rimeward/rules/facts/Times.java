package org.rimeward.rules.facts;

import java.time.Instant;

/** Small time arithmetic for rule files, where casts and branches read poorly. */
public final class Times {
  private Times() {}

  public static Instant later(Instant a, Instant b) {
    return a.isAfter(b) ? a : b;
  }

  /** One minute after {@code t}: the earliest a run that starts at {@code t} can end. */
  public static Instant minuteAfter(Instant t) {
    return t.plusSeconds(60);
  }

  public static Instant hoursBefore(Instant t, double hours) {
    return t.minusSeconds(Math.round(hours * 3600));
  }
}
