package org.rimeward.physics;

/** Wind speed brought to the 2 m standard height. */
public final class Wind {
  private Wind() {}

  /**
   * Wind speed at 2 m, m/s, from a speed in m/s (0…75) measured at a height in m (0.5…100) over
   * short grass; FAO-56 (Allen et al. 1998) Eq. 47, u2 = uz·4.87/ln(67.8 z − 5.42).
   */
  public static double at2mMs(double windMs, double heightM) {
    Ranges.check("wind speed", windMs, 0, 75, "m/s");
    Ranges.check("measurement height", heightM, 0.5, 100, "m");
    return windMs * 4.87 / Math.log(67.8 * heightM - 5.42);
  }
}
