package org.rimeward.physics;

/**
 * Vapour pressure, dew point and frost point. Temperatures in °C, vapour pressures in kPa.
 */
public final class Psychrometrics {
  private Psychrometrics() {}

  /**
   * Saturation vapour pressure over liquid water, kPa; Alduchov &amp; Eskridge (1996) AERK form,
   * relative error under about 0.4 % for −40…+50 °C.
   */
  public static double saturationOverWaterKPa(double tempC) {
    Ranges.check("temperature", tempC, -40, 50, "°C");
    return 0.61094 * Math.exp(17.625 * tempC / (tempC + 243.04));
  }

  /**
   * Saturation vapour pressure over ice, kPa; Alduchov &amp; Eskridge (1996) AERKi form, valid
   * −80…0 °C (within 0.1 % of ASHRAE 2017 Fundamentals Table 3 at −20 and −5 °C).
   */
  public static double saturationOverIceKPa(double tempC) {
    Ranges.check("temperature", tempC, -80, 0.01, "°C");
    return 0.61121 * Math.exp(22.587 * tempC / (tempC + 273.86));
  }

  /** Actual vapour pressure from the dew point, kPa (dew point over water, WMO convention). */
  public static double vapourPressureFromDewPointKPa(double dewPointC) {
    return saturationOverWaterKPa(dewPointC);
  }

  /** Dew point, °C, from vapour pressure in kPa; inverse of the AERK form. */
  public static double dewPointC(double vapourPressureKPa) {
    if (!(vapourPressureKPa > 0)) {
      throw new IllegalArgumentException("vapour pressure must be above 0 kPa, was " + vapourPressureKPa);
    }
    double g = Math.log(vapourPressureKPa / 0.61094);
    return 243.04 * g / (17.625 - g);
  }

  /** Frost point, °C, from vapour pressure in kPa; inverse of the AERKi form. */
  public static double frostPointC(double vapourPressureKPa) {
    if (!(vapourPressureKPa > 0)) {
      throw new IllegalArgumentException("vapour pressure must be above 0 kPa, was " + vapourPressureKPa);
    }
    double g = Math.log(vapourPressureKPa / 0.61121);
    return 273.86 * g / (22.587 - g);
  }

  /** Dew point, °C, from air temperature in °C and relative humidity in % (over water), 0 &lt; RH ≤ 100. */
  public static double dewPointFromRhC(double airTempC, double rhPct) {
    if (!(rhPct > 0 && rhPct <= 100)) {
      throw new IllegalArgumentException("relative humidity must be above 0 and at most 100 %, was " + rhPct);
    }
    return dewPointC(rhPct / 100.0 * saturationOverWaterKPa(airTempC));
  }

  /** Relative humidity over water, %, from air temperature and dew point in °C. */
  public static double rhPct(double airTempC, double dewPointC) {
    return 100.0 * saturationOverWaterKPa(dewPointC) / saturationOverWaterKPa(airTempC);
  }
}
