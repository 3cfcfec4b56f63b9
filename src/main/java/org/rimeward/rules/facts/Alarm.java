package org.rimeward.rules.facts;

import java.time.Instant;
import java.util.List;
import org.rimeward.physics.Psychrometrics;

/**
 * Derived: the thermometer readings a manager acts on for a block. Sprinkling starts when the air
 * falls to {@code startAirC} (the wet bulb then {@code startWetBulbC}) at the dew point forecast
 * for the reference hour; the alarm is set {@code alarmAirC}, a margin above it.
 *
 * @param referenceAt the hour whose dew point and bud cooling the start air is read at: the start
 *     itself, or on a near miss the hour the wet bud comes closest to the threshold
 * @param alarmAt when the forecast air first reaches the alarm temperature; null if it never does
 */
public record Alarm(String blockId, double thresholdC, Instant referenceAt, double startWetBulbC,
    double startAirC, double alarmAirC, Instant alarmAt) {

  /**
   * Reads the start and alarm temperatures at a reference hour: the wet bulb at which the wet bud
   * (wet bulb less the hour's radiative depression) is at the threshold, the air temperature that
   * gives that wet bulb at the hour's dew point and the site's pressure, and the alarm above it.
   */
  public static Alarm of(String blockId, NightSeries s, double thresholdC, Instant referenceAt,
      double alarmMarginC, double pressureKPa) {
    double depression = s.valueAtTime(Measure.AIR_C, referenceAt)
        - s.valueAtTime(Measure.DRY_BUD_C, referenceAt);
    double dew = s.valueAtTime(Measure.DEW_POINT_C, referenceAt);
    double wetBulb = thresholdC + depression;
    double air = airForWetBulbC(wetBulb, dew, pressureKPa);
    double alarm = air + alarmMarginC;
    List<Moment> reached = s.firstAtOrBelow(Measure.AIR_C, alarm);
    return new Alarm(blockId, thresholdC, referenceAt, wetBulb, air, alarm,
        reached.isEmpty() ? null : reached.get(0).at());
  }

  /** The hour the wet bud comes closest to its threshold: the step where it is lowest. */
  public static Instant closestApproach(NightSeries s) {
    return s.timeAt(s.indexOfMin(Measure.WET_BUD_C));
  }

  /**
   * The air temperature, °C, whose wet bulb is {@code wetBulbC} at a dew point: the wet bulb
   * rises with the air at a fixed dew point, so bisection to 0.001 °C; air at or below the dew
   * point is saturated, its wet bulb the air itself.
   */
  static double airForWetBulbC(double wetBulbC, double dewPointC, double pressureKPa) {
    if (dewPointC >= wetBulbC) {
      return wetBulbC;
    }
    double lo = wetBulbC;
    double hi = Math.min(50.0, wetBulbC + 40);
    while (hi - lo > 1e-3) {
      double mid = 0.5 * (lo + hi);
      if (Psychrometrics.wetBulbC(mid, Math.min(dewPointC, mid), pressureKPa) < wetBulbC) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return 0.5 * (lo + hi);
  }
}
