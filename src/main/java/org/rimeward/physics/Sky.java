package org.rimeward.physics;

/** Night-sky long-wave radiation: clear-sky emissivity, cloud correction, downward flux. */
public final class Sky {
  /** Stefan–Boltzmann constant, W m⁻² K⁻⁴ (the value used in FAO 2005 and most crop texts). */
  public static final double SIGMA = 5.67e-8;
  static final double KELVIN = 273.15;

  private Sky() {}

  /**
   * Clear-sky emissivity (dimensionless) from air temperature in °C (−40…50) and vapour pressure in
   * kPa (above 0, at most 8); Brutsaert (1975), ε = 1.24 (e_hPa/T_K)^(1/7).
   */
  public static double clearSkyEmissivityBrutsaert(double airTempC, double vapourPressureKPa) {
    Ranges.check("air temperature", airTempC, -40, 50, "°C");
    if (!(vapourPressureKPa > 0 && vapourPressureKPa <= 8)) {
      throw new OutOfRangeException("vapour pressure " + Ranges.fmt(vapourPressureKPa)
          + " kPa is outside the range this method is valid for (above 0 to 8 kPa)");
    }
    return 1.24 * Math.pow(vapourPressureKPa * 10.0 / (airTempC + KELVIN), 1.0 / 7.0);
  }

  /**
   * All-sky emissivity from clear-sky emissivity (0…1) and cloud cover in % (0…100); Unsworth &amp;
   * Monteith (1975), ε = (1 − 0.84c) ε_clr + 0.84c, as used by Campbell &amp; Norman (1998).
   */
  public static double cloudyEmissivity(double clearSkyEmissivity, double cloudPct) {
    Ranges.check("clear-sky emissivity", clearSkyEmissivity, 0, 1, "");
    Ranges.check("cloud cover", cloudPct, 0, 100, "%");
    double c = cloudPct / 100.0;
    return (1 - 0.84 * c) * clearSkyEmissivity + 0.84 * c;
  }

  /**
   * Downward long-wave radiation, W/m², from air temperature in °C (−40…50) and sky emissivity
   * (0…1); Stefan–Boltzmann law L↓ = ε σ T⁴ with screen-height air temperature (Brutsaert 1975).
   */
  public static double downwardLongWaveWm2(double airTempC, double skyEmissivity) {
    Ranges.check("air temperature", airTempC, -40, 50, "°C");
    Ranges.check("sky emissivity", skyEmissivity, 0, 1, "");
    return skyEmissivity * blackBodyWm2(airTempC);
  }

  /**
   * Downward long-wave radiation, W/m², from air temperature (−40…50 °C), dew point (−40 °C…air
   * temperature) and cloud cover (0…100 %): Brutsaert (1975) with the Unsworth &amp; Monteith (1975)
   * cloud correction, e from the dew point (Alduchov &amp; Eskridge 1996).
   */
  public static double downwardLongWaveWm2(double airTempC, double dewPointC, double cloudPct) {
    Ranges.check("dew point", dewPointC, -40, 50, "°C");
    Ranges.checkDewPoint(airTempC, dewPointC);
    double e = Psychrometrics.vapourPressureFromDewPointKPa(dewPointC);
    double eps = cloudyEmissivity(clearSkyEmissivityBrutsaert(airTempC, e), cloudPct);
    return downwardLongWaveWm2(airTempC, eps);
  }

  static double blackBodyWm2(double tempC) {
    double t = tempC + KELVIN;
    return SIGMA * t * t * t * t;
  }
}
