package org.rimeward.weather;

import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.time.zone.ZoneOffsetTransition;
import java.time.zone.ZoneRules;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * Reads the time of a forecast step or a station reading. A time with an offset is taken as written. A local time is placed
 * in the farm's zone: a time in the spring-forward gap does not exist and is refused; a time in
 * the autumn overlap happens twice, and rows in time order settle which: the first occurrence
 * takes the earlier offset, and a repeat that would not come after the previous row takes the
 * later one.
 */
final class ForecastTimes {
  private static final Pattern SPACE_SEPARATED = Pattern.compile("\\d{4}-\\d{2}-\\d{2} \\d.*");

  private ForecastTimes() {}

  /** A resolved time and the offset it was written with or placed at. */
  record Resolved(Instant instant, ZoneOffset offset) {}

  /**
   * Resolves {@code text}; {@code previous} is the time of the row before it (of the same
   * station, for readings), or null.
   *
   * @throws IllegalArgumentException saying why the time cannot be used and what to write
   */
  static Resolved resolve(String text, ZoneId zone, Instant previous) {
    String t = text;
    if (SPACE_SEPARATED.matcher(t).matches()) {
      t = t.replaceFirst(" ", "T");
    }
    try {
      OffsetDateTime odt = OffsetDateTime.parse(t);
      return new Resolved(odt.toInstant(), odt.getOffset());
    } catch (DateTimeParseException notWithOffset) {
      // a local time, then
    }
    LocalDateTime ldt;
    try {
      ldt = LocalDateTime.parse(t);
    } catch (DateTimeParseException e) {
      throw new IllegalArgumentException("is not an ISO-8601 time; write it with its offset,"
          + " e.g. 2024-04-12T22:00-07:00, or as local time in " + zone + ", e.g. 2024-04-12T22:00");
    }
    ZoneRules rules = zone.getRules();
    List<ZoneOffset> valid = rules.getValidOffsets(ldt);
    if (valid.isEmpty()) {
      ZoneOffsetTransition gap = rules.getTransition(ldt);
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "does not exist in %s: clocks jump from %s to %s on %s (%s to %s); remove the row or write"
              + " the time with its offset",
          zone, gap.getDateTimeBefore().toLocalTime(), gap.getDateTimeAfter().toLocalTime(),
          gap.getDateTimeBefore().toLocalDate(), gap.getOffsetBefore(), gap.getOffsetAfter()));
    }
    if (valid.size() == 1) {
      return new Resolved(ldt.toInstant(valid.get(0)), valid.get(0));
    }
    ZoneOffsetTransition overlap = rules.getTransition(ldt);
    ZoneOffset first = overlap.getOffsetBefore();
    ZoneOffset second = overlap.getOffsetAfter();
    Instant early = ldt.toInstant(first);
    if (previous != null && !early.isAfter(previous)) {
      return new Resolved(ldt.toInstant(second), second);
    }
    return new Resolved(early, first);
  }
}
