package org.rimeward.watch;

import java.time.Duration;
import java.util.Objects;
import org.rimeward.rules.facts.Thresholds;

/**
 * When the watch raises an alarm. The numbers are the rule files' (rule THRESHOLDS in
 * {@code policy/thresholds.drl}, each with its source there), read through {@link #from}; the
 * watch's options may override the first three. The alarm temperature is no margin of the
 * watch's own: it is the plan's, per block (rule ALARM-START).
 *
 * @param lead how long before a planned start "start due" is raised
 * @param colderMarginC readings colder than forecast by more than this over the last hour raise an
 *     alarm, and again at each further multiple
 * @param staleAfter no reading for longer than this is an alarm
 * @param windyWind10mMs wind at 10 m above this while sprinkling or under covers is an alarm: the
 *     wind rules' windy limit, the same number
 * @param commandTimeout how long the grower's command may run before it is stopped
 */
public record WatchPolicy(Duration lead, double colderMarginC, Duration staleAfter,
    double windyWind10mMs, Duration commandTimeout) {
  public WatchPolicy {
    Objects.requireNonNull(lead, "lead");
    Objects.requireNonNull(staleAfter, "staleAfter");
    Objects.requireNonNull(commandTimeout, "commandTimeout");
    if (!(colderMarginC > 0) || !(windyWind10mMs > 0)) {
      throw new IllegalArgumentException("the colder margin and the wind limit must be positive: "
          + colderMarginC + " °C, " + windyWind10mMs + " m/s");
    }
  }

  /** The rule files' numbers, with the grower's command stopped after {@code commandTimeout}. */
  public static WatchPolicy from(Thresholds t, Duration commandTimeout) {
    return new WatchPolicy(Duration.ofMinutes(t.watchLeadMin()), t.colderThanForecastMarginC(),
        Duration.ofMinutes(t.staleAfterMin()), t.windyWind10mMs(), commandTimeout);
  }
}
