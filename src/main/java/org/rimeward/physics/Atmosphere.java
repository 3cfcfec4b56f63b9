package org.rimeward.physics;

/** Station pressure and the psychrometric constant from elevation, after FAO-56. */
public final class Atmosphere {
  /** Sea-level standard pressure used by FAO-56 Eq. 7, kPa. */
  public static final double SEA_LEVEL_KPA = 101.3;

  /**
   * Elevations the pressure formula is used over, m: from the lowest farmland (Dead Sea shore,
   * about −430 m) to 4500 m. The farm file accepts exactly this range, so no elevation it
   * accepts is refused later.
   */
  public static final double MIN_ELEVATION_M = -420;
  public static final double MAX_ELEVATION_M = 4500;

  private Atmosphere() {}

  /**
   * Mean station pressure, kPa, from elevation in m, −420…4500 m; FAO-56 (Allen et al. 1998) Eq. 7,
   * P = 101.3 ((293 − 0.0065 z)/293)^5.26.
   */
  public static double stationPressureKPa(double elevationM) {
    Ranges.check("elevation", elevationM, MIN_ELEVATION_M, MAX_ELEVATION_M, "m");
    return SEA_LEVEL_KPA * Math.pow((293.0 - 0.0065 * elevationM) / 293.0, 5.26);
  }

  /**
   * Psychrometric constant γ, kPa/°C, from pressure in kPa, 50…110 kPa; FAO-56 Eq. 8,
   * γ = c_p P/(ε λ) = 0.665×10⁻³ P.
   */
  public static double psychrometricConstantKPaPerC(double pressureKPa) {
    Ranges.check("pressure", pressureKPa, 50, 110, "kPa");
    return 1.013e-3 * pressureKPa / (0.622 * 2.45);
  }
}
