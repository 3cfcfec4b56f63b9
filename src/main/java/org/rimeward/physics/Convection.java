package org.rimeward.physics;

/**
 * Heat-transfer coefficients of small plant parts in air. Air properties are those of dry air at
 * 101.3 kPa, linear fits to the usual textbook tables (Incropera &amp; DeWitt, Table A.4, from
 * memory) over −30…30 °C; the coefficients only matter to a few percent for frost nights.
 */
final class Convection {
  /** Outdoor turbulence raises conductances about 1.4-fold over wind-tunnel values (Campbell &amp; Norman 1998, ch. 7). */
  static final double FIELD_TURBULENCE_FACTOR = 1.4;
  private static final double PRANDTL = 0.71;
  private static final double GRAVITY = 9.81;

  private Convection() {}

  static double conductivityWPerMK(double tempC) {
    return 0.02414 + 7.4e-5 * tempC;
  }

  static double kinematicViscosityM2PerS(double tempC) {
    return 1.327e-5 + 8.9e-8 * tempC;
  }

  /**
   * Coefficient h, W m⁻² K⁻¹, of a sphere of diameter d in wind u, surface ΔT below air: forced
   * convection after Whitaker (1972), Nu = 2 + (0.4 Re^½ + 0.06 Re^⅔) Pr^0.4 (field factor on the
   * flow terms), and free convection after Churchill (1983), Nu = 2 + 0.589 Ra^¼/[1 + (0.469/Pr)^(9/16)]^(4/9),
   * combined as Nu³ = Nu_f³ + Nu_n³ (Churchill's mixed-convection rule), so calm air stays finite.
   */
  static double sphereWPerM2K(double diameterM, double windMs, double airTempC, double deltaTK) {
    double filmC = airTempC - deltaTK / 2;
    double nu = kinematicViscosityM2PerS(filmC);
    double k = conductivityWPerMK(filmC);
    double re = windMs * diameterM / nu;
    double forced = 2 + FIELD_TURBULENCE_FACTOR
        * (0.4 * Math.sqrt(re) + 0.06 * Math.pow(re, 2.0 / 3.0)) * Math.pow(PRANDTL, 0.4);
    double alpha = nu / PRANDTL;
    double beta = 1.0 / (filmC + Sky.KELVIN);
    double ra = GRAVITY * beta * Math.abs(deltaTK) * Math.pow(diameterM, 3) / (nu * alpha);
    double free = 2 + 0.589 * Math.pow(ra, 0.25)
        / Math.pow(1 + Math.pow(0.469 / PRANDTL, 9.0 / 16.0), 4.0 / 9.0);
    double nusselt = Math.cbrt(forced * forced * forced + free * free * free);
    return nusselt * k / diameterM;
  }
}
