package org.rimeward.farm;

import java.util.Locale;
import java.util.Objects;

/**
 * How the farm wants protection decided.
 *
 * @param target the temperature to protect to
 * @param startMarginC how far above the target the wet-bud temperature may fall before sprinkling
 *     starts, °C (a difference); NaN when the farm file names none, and the rules' default applies
 * @param stopRule when sprinkling may stop
 */
public record Policy(Target target, double startMarginC, StopRule stopRule) {
  /** Largest start margin accepted, °C. */
  public static final double MAX_START_MARGIN_C = 5.0;

  /**
   * No start margin of the farm's own: the default lives with the other thresholds in the rule
   * files ({@code rules/policy/thresholds.drl}), with its source.
   */
  public static final double RULES_START_MARGIN = Double.NaN;

  /** t10, the rules' start margin, stop when the wet bulb is above freezing (UF/IFAS Circ. 348). */
  public static final Policy DEFAULT =
      new Policy(Target.t10(), RULES_START_MARGIN, StopRule.WET_BULB_ABOVE_FREEZING);

  public Policy {
    Objects.requireNonNull(target, "target");
    Objects.requireNonNull(stopRule, "stopRule");
    if (!Double.isNaN(startMarginC) && !(startMarginC >= 0 && startMarginC <= MAX_START_MARGIN_C)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "start margin %s °C is outside 0 to %.0f °C", startMarginC, MAX_START_MARGIN_C));
    }
  }
}
