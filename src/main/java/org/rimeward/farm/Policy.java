package org.rimeward.farm;

import java.util.Locale;
import java.util.Objects;

/**
 * How the farm wants protection decided.
 *
 * @param target the temperature to protect to
 * @param startMarginC how far above the start temperature sprinkling begins, °C (a difference)
 * @param stopRule when sprinkling may stop
 */
public record Policy(Target target, double startMarginC, StopRule stopRule) {
  /** Largest start margin accepted, °C. */
  public static final double MAX_START_MARGIN_C = 5.0;

  /**
   * The default start margin, 1.0 °C: FAO 2005 (Snyder &amp; de Melo-Abreu) Ch. 7 advises setting
   * the alarm about 1 °C above the starting air temperature of its Table 7.5.
   */
  public static final double DEFAULT_START_MARGIN_C = 1.0;

  /** t10, 1.0 °C margin, stop when the wet bulb is above freezing (UF/IFAS Circular 348). */
  public static final Policy DEFAULT =
      new Policy(Target.t10(), DEFAULT_START_MARGIN_C, StopRule.WET_BULB_ABOVE_FREEZING);

  public Policy {
    Objects.requireNonNull(target, "target");
    Objects.requireNonNull(stopRule, "stopRule");
    if (!(startMarginC >= 0 && startMarginC <= MAX_START_MARGIN_C)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "start margin %s °C is outside 0 to %.0f °C", startMarginC, MAX_START_MARGIN_C));
    }
  }
}
