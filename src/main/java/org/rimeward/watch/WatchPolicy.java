package org.rimeward.watch;

import java.time.Duration;
import java.util.Objects;

/**
 * When the watch raises an alarm.
 *
 * @param lead how long before a planned start "start due" is raised (the default, 30 min:
 *     time to walk to the pump house and open valves; common practice)
 * @param colderMarginC readings colder than forecast by more than this over the last hour raise an
 *     alarm, and again at each further multiple (1 °C: common practice, the size of FAO 2005's
 *     alarm margin)
 * @param alarmMarginC the alarm temperature is the air at the planned start plus this (FAO 2005
 *     ch. 7: "set the alarm about 1 °C higher than the starting air temperature", SEEN-2nd)
 * @param staleAfter no reading for longer than this is an alarm (60 min: the "no usable row
 *     in the last hour")
 * @param windLimitMs wind at 2 m above this while sprinkling or under covers (4.5 m/s, 10 mph: a
 *     wind-borne freeze, as the wind rules say; NC State Extension, SEEN)
 * @param commandTimeout how long the grower's command may run before it is stopped
 */
public record WatchPolicy(Duration lead, double colderMarginC, double alarmMarginC,
    Duration staleAfter, double windLimitMs, Duration commandTimeout) {
  public static final WatchPolicy STANDARD = new WatchPolicy(Duration.ofMinutes(30), 1.0, 1.0,
      Duration.ofMinutes(60), 4.5, Duration.ofSeconds(10));

  public WatchPolicy {
    Objects.requireNonNull(lead, "lead");
    Objects.requireNonNull(staleAfter, "staleAfter");
    Objects.requireNonNull(commandTimeout, "commandTimeout");
    if (!(colderMarginC > 0) || !(alarmMarginC >= 0) || !(windLimitMs > 0)) {
      throw new IllegalArgumentException("margins and the wind limit must be positive");
    }
  }
}
