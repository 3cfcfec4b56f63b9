package org.rimeward.physics;

import java.util.function.DoubleUnaryOperator;

/**
 * Over-plant sprinkling: the application rate that keeps iced buds at 0 °C, and the lowest air
 * temperature a given rate holds. An energy balance at bud and twig scale, derived from heat
 * transfer rather than fitted to one rule of thumb; the one calibration constant is
 * {@link #GROUND_AREA_FACTOR}.
 *
 * <p>The protected parts are ice-coated cylinders of {@link #ICED_DIAMETER_M} = 10 mm across the
 * wind: the middle of the 5–20 mm of buds, bud clusters, spurs and twigs under a few millimetres
 * of ice (an assumption, stated; the need scales about as d^−½, so 5 mm needs about 1.2 times and
 * 20 mm about 0.8 times as much). Per m² of ice surface held at 0 °C the losses are:
 * <ul>
 *   <li>convection h·(0 − T_a), h from {@code Convection.cylinderWPerM2K}: Churchill &amp;
 *       Bernstein (1977) in cross flow with the field-turbulence factor 1.4 of Campbell &amp; Norman
 *       (1998, ch. 7) that the bud model uses, combined with Churchill &amp; Chu (1975) free
 *       convection so calm air stays finite;</li>
 *   <li>evaporation from the wet ice, λ_v E = h (e_s(0) − e_a) / (γ Le^⅔), the Lewis relation in
 *       its Chilton–Colburn form with Le = {@link #LEWIS_NUMBER}, γ = c_p P / (0.622 λ_v) at the
 *       site's pressure, e_a from the dew point (Alduchov &amp; Eskridge 1996). The film is liquid
 *       water at 0 °C, so λ_v = 2.501 MJ/kg; where the film dries the ice sublimates (λ_s = 2.834
 *       MJ/kg) and cools below 0 °C, which is what the rate must prevent;</li>
 *   <li>net long-wave, ε σ T_0⁴ − ε (½ L↓_sky + ½ σ T_a⁴): the upper half sees the sky (Brutsaert
 *       1975 with the Unsworth &amp; Monteith 1975 cloud correction), the lower half ground and
 *       wood at air temperature.</li>
 * </ul>
 * The gains per kg of water are the latent heat of fusion (0.334 MJ/kg) and the sensible heat of
 * the supply water down to 0 °C.
 *
 * <p>Wind is the wind at the buds, taken at 2 m: callers bring a forecast's wind from its height
 * with FAO-56 Eq. 47 ({@link Wind#at2mMs}), the log profile over short grass
 * (d = 0.08 m, z0 = 0.0148 m). The balance holds for any wind from calm to {@link #MAX_WIND_MS};
 * whether sprinkling is advised in a wind is for the rules to decide, not this class.
 */
public final class SprinklerBalance {
  /** Representative diameter of an iced bud cluster, spur or twig, m; see the class comment. */
  public static final double ICED_DIAMETER_M = 0.010;

  /**
   * Ground-area rate over the ice-surface freezing need: exchange surface per ground area over the
   * share of water that freezes on the plant. The one calibration constant, fitted as the
   * log-mean ratio of table to model over the 12 cells from 18 to 26 °F of the UF/IFAS Circ. 287
   * table as printed by MSU Extension ("Using your sprinkler system to protect blueberries from
   * freezes", wind 0–1, 2–4, 5–8 mph taken as 0.5, 3, 6.5 mph at 10 m; dew point 3 °C below the
   * air; water at 5 °C). The fit gives 1.41; see {@code SprinklerRateTablesTest}.
   */
  public static final double GROUND_AREA_FACTOR = 1.4;

  /** Lewis number of water vapour in air near 0 °C, α/D = 1.87e-5/2.22e-5 (Incropera &amp; DeWitt, from memory). */
  public static final double LEWIS_NUMBER = 0.84;

  /** Highest wind at 2 m the balance takes, m/s (a hurricane; the correlation holds further). */
  public static final double MAX_WIND_MS = 60;

  /** Latent heat of fusion of water at 0 °C, J/kg (Rogers &amp; Yau; FAO 2005 uses 0.334 MJ/kg). */
  static final double LATENT_FUSION_J_PER_KG = 3.34e5;
  /** Latent heat of vaporisation at 0 °C, J/kg (Rogers &amp; Yau, L_v = 2.501 MJ/kg). */
  static final double LATENT_VAPORISATION_J_PER_KG = 2.501e6;
  /** Specific heat of liquid water, J kg⁻¹ K⁻¹. */
  static final double WATER_HEAT_CAPACITY = 4186;
  /** Specific heat of moist air, J kg⁻¹ K⁻¹ (FAO-56: 1.013×10⁻³ MJ kg⁻¹ °C⁻¹). */
  static final double AIR_HEAT_CAPACITY = 1013;
  /** Long-wave emissivity of ice and water. */
  static final double ICE_EMISSIVITY = 0.97;

  private SprinklerBalance() {}

  /** Heat lost by one m² of wet ice at 0 °C, W/m², by way of loss; negative is a gain. */
  record IceLoss(double convectionWm2, double evaporationWm2, double longWaveWm2) {
    double totalWm2() {
      return convectionWm2 + evaporationWm2 + longWaveWm2;
    }
  }

  /** How far a rate protects: see {@link #protection}. */
  public enum Limit {
    /** The rate holds iced buds at 0 °C down to {@link Protection#airTempC}. */
    AIR_TEMPERATURE,
    /**
     * The rate holds even with the air down at its dew point; the air cannot cool further without
     * the dew point falling too, so where the rate gives out depends on a lower dew point.
     */
    DEW_POINT,
    /** The rate falls short even with the air at 0 °C: it keeps no ice wet in this air and wind. */
    FREEZING
  }

  /** The outcome of {@link #protection}: the limit and the air temperature it sits at, °C. */
  public record Protection(Limit limit, double airTempC) {}

  /**
   * Over-plant application rate, mm/h of water over the ground, that keeps iced buds at 0 °C under
   * a clear sky (the radiation-frost worst case); see
   * {@link #requiredRateMmH(double, double, double, double, double, double)}.
   */
  public static double requiredRateMmH(double airTempC, double dewPointC, double windMs,
      double waterTempC, double pressureKPa) {
    return requiredRateMmH(airTempC, dewPointC, windMs, waterTempC, pressureKPa, 0);
  }

  /**
   * Over-plant application rate, mm/h of water over the ground, that keeps iced buds at 0 °C, from
   * air temperature (−40…20 °C), dew point (−40 °C…air), wind at 2 m (0…{@link #MAX_WIND_MS}
   * m/s), supply water temperature (0…40 °C), pressure (50…110 kPa) and cloud cover (0…100 %);
   * the energy balance of the class comment times {@link #GROUND_AREA_FACTOR}. Zero when the
   * iced surface loses no heat; finite for every input in range.
   */
  public static double requiredRateMmH(double airTempC, double dewPointC, double windMs,
      double waterTempC, double pressureKPa, double cloudPct) {
    checkConditions(airTempC, dewPointC, windMs, waterTempC, pressureKPa, cloudPct);
    return rateFor(iceLoss(airTempC, dewPointC, windMs, pressureKPa, cloudPct), waterTempC);
  }

  /**
   * How far a rate in mm/h (0.01…200) protects iced buds, for a dew point (−40…20 °C), wind at
   * 2 m, water temperature, pressure and cloud cover as for {@link #requiredRateMmH}: the lowest
   * air temperature, °C, at which the rate still meets the need (bisection to 0.001 °C), or, when
   * there is no such temperature between the dew point and 0 °C, which of the two ends limits it.
   * The need rises as the air cools at a fixed dew point, so the answer is unique.
   */
  public static Protection protection(double rateMmH, double dewPointC, double windMs,
      double waterTempC, double pressureKPa, double cloudPct) {
    Ranges.check("application rate", rateMmH, 0.01, 200, "mm/h");
    Ranges.check("dew point", dewPointC, -40, 20, "°C");
    DoubleUnaryOperator need = air -> requiredRateMmH(air, dewPointC, windMs, waterTempC,
        pressureKPa, cloudPct);
    if (need.applyAsDouble(dewPointC) <= rateMmH) {
      return new Protection(Limit.DEW_POINT, dewPointC);
    }
    if (need.applyAsDouble(0.0) > rateMmH) {
      return new Protection(Limit.FREEZING, 0.0);
    }
    double lo = dewPointC;
    double hi = 0.0;
    while (hi - lo > 1e-3) {
      double mid = 0.5 * (lo + hi);
      if (need.applyAsDouble(mid) > rateMmH) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return new Protection(Limit.AIR_TEMPERATURE, 0.5 * (lo + hi));
  }

  static void checkConditions(double airTempC, double dewPointC, double windMs, double waterTempC,
      double pressureKPa, double cloudPct) {
    Ranges.check("air temperature", airTempC, -40, 20, "°C");
    Ranges.check("dew point", dewPointC, -40, 20, "°C");
    Ranges.checkDewPoint(airTempC, dewPointC);
    Ranges.check("wind speed at 2 m", windMs, 0, MAX_WIND_MS, "m/s");
    Ranges.check("water temperature", waterTempC, 0, 40, "°C");
    Ranges.check("pressure", pressureKPa, 50, 110, "kPa");
    Ranges.check("cloud cover", cloudPct, 0, 100, "%");
  }

  static double rateFor(IceLoss loss, double waterTempC) {
    double lossWm2 = loss.totalWm2();
    if (lossWm2 <= 0) {
      return 0;
    }
    double heatPerKg = LATENT_FUSION_J_PER_KG + WATER_HEAT_CAPACITY * waterTempC;
    // 1 kg of water over 1 m² of ground is 1 mm.
    return GROUND_AREA_FACTOR * lossWm2 / heatPerKg * 3600.0;
  }

  /** Heat loss of one m² of wet ice at 0 °C on an iced twig; see the class comment. */
  static IceLoss iceLoss(double airTempC, double dewPointC, double windMs, double pressureKPa,
      double cloudPct) {
    double h = Convection.cylinderWPerM2K(ICED_DIAMETER_M, windMs, airTempC, 0.0 - airTempC);
    double convection = h * (0.0 - airTempC);
    double gammaKPaPerK = AIR_HEAT_CAPACITY * pressureKPa / (0.622 * LATENT_VAPORISATION_J_PER_KG);
    double ea = Psychrometrics.vapourPressureFromDewPointKPa(dewPointC);
    double evaporation = h * (Psychrometrics.saturationOverIceKPa(0.0) - ea)
        / (gammaKPaPerK * Math.pow(LEWIS_NUMBER, 2.0 / 3.0));
    double sky = Sky.downwardLongWaveWm2(airTempC, dewPointC, cloudPct);
    double longWave = ICE_EMISSIVITY
        * (Sky.blackBodyWm2(0.0) - 0.5 * sky - 0.5 * Sky.blackBodyWm2(airTempC));
    return new IceLoss(convection, evaporation, longWave);
  }
}
