package org.rimeward.physics;

/**
 * Heat-transfer coefficients of small plant parts in air: buds as spheres, iced twigs and spurs as
 * cylinders across the wind. Air properties are those of dry air at
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

  /**
   * Coefficient h, W m⁻² K⁻¹, of a long cylinder of diameter d across wind u, surface ΔT below
   * air: forced convection after Churchill &amp; Bernstein (1977), valid for all Re with Re·Pr &gt; 0.2,
   * Nu = 0.3 + 0.62 Re^½ Pr^⅓ [1 + (0.4/Pr)^⅔]^−¼ [1 + (Re/282 000)^⅝]^⅘ (field factor on the flow
   * term, as for the sphere), and free convection from a horizontal cylinder after Churchill &amp;
   * Chu (1975), Nu = {0.6 + 0.387 Ra^⅙/[1 + (0.559/Pr)^(9/16)]^(8/27)}², combined as
   * Nu³ = Nu_f³ + Nu_n³ so that calm air stays finite and wind always adds.
   */
  static double cylinderWPerM2K(double diameterM, double windMs, double airTempC, double deltaTK) {
    double filmC = airTempC - deltaTK / 2;
    double nu = kinematicViscosityM2PerS(filmC);
    double k = conductivityWPerMK(filmC);
    double re = windMs * diameterM / nu;
    double forced = 0.3 + FIELD_TURBULENCE_FACTOR * (cylinderForcedNusselt(re) - 0.3);
    double alpha = nu / PRANDTL;
    double beta = 1.0 / (filmC + Sky.KELVIN);
    double ra = GRAVITY * beta * Math.abs(deltaTK) * Math.pow(diameterM, 3) / (nu * alpha);
    double root = 0.6 + 0.387 * Math.pow(ra, 1.0 / 6.0)
        / Math.pow(1 + Math.pow(0.559 / PRANDTL, 9.0 / 16.0), 8.0 / 27.0);
    double free = root * root;
    double nusselt = Math.cbrt(forced * forced * forced + free * free * free);
    return nusselt * k / diameterM;
  }

  /** Churchill &amp; Bernstein (1977) Nusselt number of a cylinder in cross flow, wind-tunnel air. */
  static double cylinderForcedNusselt(double reynolds) {
    return 0.3 + 0.62 * Math.sqrt(reynolds) * Math.cbrt(PRANDTL)
        / Math.pow(1 + Math.pow(0.4 / PRANDTL, 2.0 / 3.0), 0.25)
        * Math.pow(1 + Math.pow(reynolds / 282_000.0, 5.0 / 8.0), 4.0 / 5.0);
  }
}
