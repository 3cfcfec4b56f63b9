package org.rimeward.physics;

/**
 * Bud kill as a logistic curve of tissue temperature through the published 10 % and 90 % kill
 * temperatures (the WSU/MSU critical-temperature tables, 30-minute exposure). Colder means more
 * kill; between and beyond the two points the logistic shape is an interpolation, not data.
 *
 * @param t10C temperature, °C, that kills 10 % of buds
 * @param t90C temperature, °C, that kills 90 % of buds; must be below {@code t10C}
 */
public record KillCurve(double t10C, double t90C) {
  private static final double LN9 = Math.log(9);

  public KillCurve {
    Ranges.check("10 % kill temperature", t10C, -60, 20, "°C");
    Ranges.check("90 % kill temperature", t90C, -60, 20, "°C");
    if (!(t90C < t10C)) {
      throw new OutOfRangeException("90 % kill temperature " + Ranges.fmt(t90C)
          + " °C must be below the 10 % kill temperature " + Ranges.fmt(t10C)
          + " °C (more buds die at colder temperatures)");
    }
  }

  /** Temperature of 50 % kill, °C: the midpoint of the logistic. */
  public double t50C() {
    return 0.5 * (t10C + t90C);
  }

  /** Logistic scale, °C per unit log-odds; 10 % and 90 % are ±ln 9 from the midpoint. */
  private double scaleC() {
    return (t10C - t90C) / (2 * LN9);
  }

  /**
   * Percentage of buds killed, 0…100, at a tissue temperature in °C (−80…40); logistic through
   * the WSU/MSU 10 % and 90 % kill points (e.g. Longstroth, MSU Extension picture table).
   */
  public double killPct(double tempC) {
    Ranges.check("temperature", tempC, -80, 40, "°C");
    return 100.0 / (1.0 + Math.exp((tempC - t50C()) / scaleC()));
  }

  /**
   * Tissue temperature, °C, that kills the given percentage of buds (strictly between 0 and 100);
   * inverse of {@link #killPct}.
   */
  public double tempForKillPct(double killPct) {
    if (!(killPct > 0 && killPct < 100)) {
      throw new OutOfRangeException("kill percentage must be above 0 and below 100 %, was " + killPct);
    }
    return t50C() + scaleC() * Math.log(100.0 / killPct - 1.0);
  }
}
