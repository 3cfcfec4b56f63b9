package org.rimeward.rules.facts;

/**
 * Derived: the bands and margins the decision rules use, each set and sourced in one rule file
 * ({@code rules/policy/thresholds.drl}); Java only carries them.
 *
 * @param watchBandC how far above its target a block's coldest bud is still a near miss
 * @param breezyWind10mMs wind at 10 m above which sprinkling needs more water
 * @param windyWind10mMs wind at 10 m above which over-plant sprinkling alone is not advised
 * @param clearMorningCloudPct cloud below which a morning counts as clear (sun under covers)
 * @param defaultStartMarginC how far above the target the wet bud may fall before sprinkling
 *     starts, when the farm names no start margin
 * @param alarmMarginC how far above the start air temperature the frost alarm is set
 * @param coverMarginC how far above the target the coldest covered bud must stay for covers to
 *     be called enough alone
 * @param overcastCloudPct cloud at or above which a night is overcast for covers
 * @param coverShareInWindOrCloud the share of a cover's published protection credited on a
 *     breezy, windy or overcast night
 */
public record Thresholds(double watchBandC, double breezyWind10mMs, double windyWind10mMs,
    double clearMorningCloudPct, double defaultStartMarginC, double alarmMarginC,
    double coverMarginC, double overcastCloudPct, double coverShareInWindOrCloud) {
  public Thresholds {
    if (!(watchBandC >= 0 && breezyWind10mMs > 0 && windyWind10mMs > breezyWind10mMs
        && clearMorningCloudPct >= 0 && clearMorningCloudPct <= 100 && defaultStartMarginC >= 0
        && alarmMarginC >= 0 && coverMarginC >= 0 && overcastCloudPct >= 0 && overcastCloudPct <= 100
        && coverShareInWindOrCloud >= 0 && coverShareInWindOrCloud <= 1)) {
      throw new IllegalArgumentException("thresholds out of range: " + thresholdsText());
    }
  }

  private String thresholdsText() {
    return "watch band " + watchBandC + " °C, breezy " + breezyWind10mMs + " m/s, windy "
        + windyWind10mMs + " m/s, clear morning " + clearMorningCloudPct + " %, start margin "
        + defaultStartMarginC + " °C, alarm margin " + alarmMarginC + " °C, cover margin "
        + coverMarginC + " °C, overcast " + overcastCloudPct + " %, cover share "
        + coverShareInWindOrCloud;
  }
}
