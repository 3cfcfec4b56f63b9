package org.rimeward.crop;

/**
 * Plausibility limits for crop-profile values. They catch typing errors (a dropped minus sign, °F
 * written as °C) rather than judge the agronomy.
 */
public final class Limits {
  /**
   * Coldest critical temperature accepted, °C. The coldest published spring bud value here is
   * about −19.4 °C (Concord first swell, FAO 2005 Table 4.8); −30 °C leaves room for hardy
   * varieties without admitting a dormant-wood value by mistake.
   */
  public static final double MIN_C = -30.0;
  /** Warmest accepted, °C. Open flowers and small fruit are killed just below 0 °C. */
  public static final double MAX_C = 5.0;
  /**
   * Largest variety hardiness offset, °C. Published variety footnotes are 1–2 °F (WSU table via
   * Penn State Extension); more than 3 °C is more likely a unit mix-up than a hardier variety.
   */
  public static final double MAX_HARDINESS_OFFSET_C = 3.0;
  /** Largest T10−T90 margin for one-tolerance stages, °C. */
  public static final double MAX_TOLERANCE_MARGIN_C = 3.0;

  private Limits() {}
}
