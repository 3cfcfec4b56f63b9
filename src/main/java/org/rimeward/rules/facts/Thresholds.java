package org.rimeward.rules.facts;

/**
 * Derived: the bands and margins the decision rules, the night watch and the site's minimum model
 * use, each set and sourced in one rule file ({@code rules/policy/thresholds.drl}); Java only
 * carries them.
 *
 * @param watchBandC how far above its target a block's coldest bud is still a near miss
 * @param breezyWind10mMs wind at 10 m above which sprinkling needs more water
 * @param windyWind10mMs wind at 10 m above which over-plant sprinkling alone is not advised; the
 *     night watch's wind alarm too
 * @param clearMorningCloudPct cloud below which a morning counts as clear (sun under covers)
 * @param defaultStartMarginC how far above the target the wet bud may fall before sprinkling
 *     starts, when the farm names no start margin
 * @param alarmMarginC how far above the start air temperature the frost alarm is set
 * @param coverMarginC how far above the target the coldest covered bud must stay for covers to
 *     be called enough alone
 * @param overcastCloudPct cloud at or above which a night is overcast for covers
 * @param coverShareInWindOrCloud the share of a cover's published protection credited on a
 *     breezy, windy or overcast night
 * @param watchLeadMin how many minutes before a planned start the watch raises start-due
 * @param colderThanForecastMarginC readings colder than forecast by more than this over the last
 *     hour raise the watch's alarm, and again at each further multiple
 * @param staleAfterMin minutes without a reading after which the watch raises stale
 * @param radiationNightMaxWindMs the most mean wind over a night that is still a radiation night
 * @param radiationNightMaxCloudPct the most mean cloud over a radiation night, where recorded
 * @param radiationNightMinCoolingDeltaC where cloud is not recorded, the least fall of the air from
 *     sunset to sunset + 2 h on a radiation night
 * @param radiationNightMinDepressionC where cloud is not recorded, the least dew-point depression
 *     at sunset + 2 h on a radiation night (no fog)
 * @param radiationNightMaxGapMin the longest gap in the readings across a night that still counts
 */
public record Thresholds(double watchBandC, double breezyWind10mMs, double windyWind10mMs,
    double clearMorningCloudPct, double defaultStartMarginC, double alarmMarginC,
    double coverMarginC, double overcastCloudPct, double coverShareInWindOrCloud,
    int watchLeadMin, double colderThanForecastMarginC, int staleAfterMin,
    double radiationNightMaxWindMs, double radiationNightMaxCloudPct,
    double radiationNightMinCoolingDeltaC, double radiationNightMinDepressionC,
    int radiationNightMaxGapMin) {
  public Thresholds {
    if (!(watchBandC >= 0 && breezyWind10mMs > 0 && windyWind10mMs > breezyWind10mMs
        && clearMorningCloudPct >= 0 && clearMorningCloudPct <= 100 && defaultStartMarginC >= 0
        && alarmMarginC >= 0 && coverMarginC >= 0 && overcastCloudPct >= 0 && overcastCloudPct <= 100
        && coverShareInWindOrCloud >= 0 && coverShareInWindOrCloud <= 1
        && watchLeadMin >= 0 && colderThanForecastMarginC > 0 && staleAfterMin > 0
        && radiationNightMaxWindMs > 0 && radiationNightMaxCloudPct >= 0
        && radiationNightMaxCloudPct <= 100 && radiationNightMinCoolingDeltaC >= 0
        && radiationNightMinDepressionC >= 0 && radiationNightMaxGapMin > 0)) {
      throw new IllegalArgumentException("thresholds out of range: " + thresholdsText());
    }
  }

  private String thresholdsText() {
    return "watch band " + watchBandC + " °C, breezy " + breezyWind10mMs + " m/s, windy "
        + windyWind10mMs + " m/s, clear morning " + clearMorningCloudPct + " %, start margin "
        + defaultStartMarginC + " °C, alarm margin " + alarmMarginC + " °C, cover margin "
        + coverMarginC + " °C, overcast " + overcastCloudPct + " %, cover share "
        + coverShareInWindOrCloud + ", watch lead " + watchLeadMin + " min (≥ 0), colder margin "
        + colderThanForecastMarginC + " °C (> 0), stale after " + staleAfterMin + " min (> 0),"
        + " radiation night: wind " + radiationNightMaxWindMs + " m/s (> 0), cloud "
        + radiationNightMaxCloudPct + " %, cooling " + radiationNightMinCoolingDeltaC
        + " °C, depression " + radiationNightMinDepressionC + " °C, gap " + radiationNightMaxGapMin
        + " min (> 0)";
  }
}
