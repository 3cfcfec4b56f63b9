package org.rimeward.physics;

import java.util.OptionalDouble;

/**
 * Vapour pressure, dew point, frost point, wet bulb and ice bulb. Temperatures in °C, vapour
 * pressures in kPa.
 */
public final class Psychrometrics {
  /** WMO-No. 8 psychrometer coefficient of a ventilated (Assmann) wet bulb, 1/°C, at Tw = 0. */
  static final double A_WATER = 6.53e-4;
  /** WMO-No. 8 psychrometer coefficient when the bulb is coated with ice, 1/°C. */
  static final double A_ICE = 5.75e-4;
  /** Solver tolerance, °C: far below any thermometer's resolution. */
  private static final double TOLERANCE_C = 1e-5;

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
      throw new OutOfRangeException("vapour pressure must be above 0 kPa, was " + vapourPressureKPa);
    }
    double g = Math.log(vapourPressureKPa / 0.61094);
    return 243.04 * g / (17.625 - g);
  }

  /** Frost point, °C, from vapour pressure in kPa; inverse of the AERKi form. */
  public static double frostPointC(double vapourPressureKPa) {
    if (!(vapourPressureKPa > 0)) {
      throw new OutOfRangeException("vapour pressure must be above 0 kPa, was " + vapourPressureKPa);
    }
    double g = Math.log(vapourPressureKPa / 0.61121);
    return 273.86 * g / (22.587 - g);
  }

  /** Dew point, °C, from air temperature in °C and relative humidity in % (over water), 0 &lt; RH ≤ 100. */
  public static double dewPointFromRhC(double airTempC, double rhPct) {
    if (!(rhPct > 0 && rhPct <= 100)) {
      throw new OutOfRangeException("relative humidity must be above 0 and at most 100 %, was " + rhPct);
    }
    return dewPointC(rhPct / 100.0 * saturationOverWaterKPa(airTempC));
  }

  /** Relative humidity over water, %, from air temperature and dew point in °C. */
  public static double rhPct(double airTempC, double dewPointC) {
    return 100.0 * saturationOverWaterKPa(dewPointC) / saturationOverWaterKPa(airTempC);
  }

  /**
   * Actual vapour pressure, kPa, from air temperature in °C (−40…50) and relative humidity over
   * water in % (0 &lt; RH ≤ 100); RH definition of WMO-No. 8 with the AERK form (Alduchov &amp;
   * Eskridge 1996).
   */
  public static double vapourPressureFromRhKPa(double airTempC, double rhPct) {
    if (!(rhPct > 0 && rhPct <= 100)) {
      throw new OutOfRangeException("relative humidity must be above 0 and at most 100 %, was " + rhPct);
    }
    return rhPct / 100.0 * saturationOverWaterKPa(airTempC);
  }

  /**
   * Frost point, °C, from the dew point in °C (−40…50): the temperature at which the same vapour
   * pressure saturates over ice; AERK and AERKi forms (Alduchov &amp; Eskridge 1996). Above 0 °C it
   * is reported as computed, although frost cannot form there.
   */
  public static double frostPointFromDewPointC(double dewPointC) {
    return frostPointC(vapourPressureFromDewPointKPa(dewPointC));
  }

  /**
   * Wet-bulb temperature, °C, of a ventilated psychrometer, from air temperature (−40…50 °C), dew
   * point (−40 °C…air temperature) and pressure (50…110 kPa): solves e = e_w(Tw) − A·P·(T − Tw),
   * A = 6.53×10⁻⁴ (1 + 0.000944 Tw) per °C (WMO-No. 8 psychrometer equation; e_w after Alduchov &amp;
   * Eskridge 1996), to 10⁻⁵ °C by bisection. The bulb is taken as liquid water, also below 0 °C.
   */
  public static double wetBulbC(double airTempC, double dewPointC, double pressureKPa) {
    checkAir(airTempC, dewPointC, pressureKPa);
    double e = vapourPressureFromDewPointKPa(dewPointC);
    // f rises with Tw; f(Td) = −A·P·(T − Td) ≤ 0 and f(T) = e_w(T) − e ≥ 0, so [Td, T] brackets it.
    return bisect(dewPointC, airTempC, tw ->
        saturationOverWaterKPa(tw) - A_WATER * (1 + 0.000944 * tw) * pressureKPa * (airTempC - tw) - e);
  }

  /**
   * Ice-bulb temperature, °C, from air temperature (−40…50 °C), dew point (−40 °C…air
   * temperature) and pressure (50…110 kPa): solves e = e_i(Ti) − A·P·(T − Ti), A = 5.75×10⁻⁴ per °C
   * (WMO-No. 8, bulb coated with ice; e_i after Alduchov &amp; Eskridge 1996). Empty when the
   * solution is not below 0 °C, because an ice bulb cannot exist there.
   */
  public static OptionalDouble iceBulbC(double airTempC, double dewPointC, double pressureKPa) {
    checkAir(airTempC, dewPointC, pressureKPa);
    double e = vapourPressureFromDewPointKPa(dewPointC);
    java.util.function.DoubleUnaryOperator f =
        ti -> saturationOverIceKPa(ti) - A_ICE * pressureKPa * (airTempC - ti) - e;
    if (f.applyAsDouble(0.0) <= 0) {
      return OptionalDouble.empty();
    }
    // At min(frost point, T) both terms are ≤ 0, so the root lies between there and 0 °C.
    double low = Math.max(-80, Math.min(frostPointC(e), airTempC));
    return OptionalDouble.of(bisect(low, 0.0, f));
  }

  private static void checkAir(double airTempC, double dewPointC, double pressureKPa) {
    Ranges.check("air temperature", airTempC, -40, 50, "°C");
    Ranges.check("dew point", dewPointC, -40, 50, "°C");
    Ranges.checkDewPoint(airTempC, dewPointC);
    Ranges.check("pressure", pressureKPa, 50, 110, "kPa");
  }

  /** Root of a rising function on [low, high] with f(low) ≤ 0 ≤ f(high). */
  static double bisect(double low, double high, java.util.function.DoubleUnaryOperator f) {
    double lo = low;
    double hi = high;
    if (f.applyAsDouble(lo) >= 0) {
      return lo;
    }
    if (f.applyAsDouble(hi) <= 0) {
      return hi;
    }
    while (hi - lo > TOLERANCE_C) {
      double mid = 0.5 * (lo + hi);
      if (f.applyAsDouble(mid) < 0) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return 0.5 * (lo + hi);
  }
}
