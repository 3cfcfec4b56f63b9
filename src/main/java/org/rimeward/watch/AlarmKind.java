package org.rimeward.watch;

import java.util.Locale;

/** The night watch's alarms; each {@link #word()} is stable: growers wire commands to it. */
public enum AlarmKind {
  /** The air at the block reached the alarm temperature: start plus the alarm margin. */
  ALARM_TEMPERATURE,
  /** Sprinkling is due within the lead time (level 1), or overdue (level 2). */
  START_DUE,
  /** The readings run colder than the forecast by more than the margin (level per margin). */
  COLDER_THAN_FORECAST,
  /** Wind above the limit while sprinkling or while covers are on. */
  WIND,
  /** No reading for longer than the stale time: the station or its logger has failed. */
  STALE,
  /** The morning's stop condition is met: sprinklers may stop. */
  STOP_ALLOWED;

  public String word() {
    return name().toLowerCase(Locale.ROOT).replace('_', '-');
  }
}
