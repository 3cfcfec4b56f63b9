package org.rimeward.physics;

/**
 * Over-plant sprinkling: the application rate that keeps ice-coated buds at 0 °C, and the lowest
 * air temperature a given rate holds.
 *
 * <p>Per m² of iced plant surface at 0 °C the loss is convection h·(0 − T_a), evaporation of the
 * water film h·(e_i(0) − e_a)/γ_v (Lewis relation: mass transfer from h with Le ≈ 1,
 * γ_v = c_p P/(0.622 L_v)), and net long-wave loss to a clear sky over the upper half and to
 * surroundings at air temperature over the lower half. h is the wind-convection coefficient
 * h = 5.7 + 3.8 u of McAdams (1954, after Jürges), as given by Duffie &amp; Beckman, for 0…5 m/s:
 * sprinkling is not advised above about 4.5 m/s (10 mph; Virginia Tech tree-fruit guidance), so the
 * method stops at 5 m/s rather than extrapolate. The wind inside a sprinkled canopy is taken as
 * {@link #CANOPY_WIND_RATIO} = 0.5 of the open 2 m wind, the mid-canopy value of an exponential
 * in-canopy wind profile (Cionco 1965, attenuation coefficient about 1.4; from memory). The sky is
 * taken as clear (a radiation frost): the worst case. The loss is met by the latent heat of freezing
 * (0.334 MJ/kg) plus the sensible heat of the water from its supply temperature to 0 °C.
 *
 * <p>Not all applied water freezes on the buds (drift, runoff, water landing on the ground) and a
 * canopy has more or less exchange surface than its ground area, so the rate per ground area is
 * the loss times {@link #CANOPY_FACTOR}, one documented calibration constant. It is set so that,
 * with a dry frost-night dew point 3 °C below the air, "no wind" = 0.5 m/s and "light wind" =
 * 2 m/s, the results fall inside the published rules of thumb: 0.12–0.15 in/h (3.0–3.8 mm/h)
 * protects to about 22 °F (−5.6 °C) with no wind and 24–25 °F (−4.4 to −3.9 °C) with a light wind
 * (Longstroth 2012, MSU Extension), and 70–80 gpm/acre (3.9–4.5 mm/h) protects trees to about
 * 24 °F (−4.4 °C) (R. G. Evans in Good Fruit Grower, "Frost control options"), here at a breezy
 * 3.5 m/s since that article names no wind. The pair of MSU figures limits how fast the need may
 * rise between 0.5 and 2 m/s; with this convection law the need at 4.5 m/s is about 1.5 times the
 * calm need, gentler than older wind tables (UF/IFAS Circ. 287, not verified here).
 */
public final class SprinklerBalance {
  /** Ground-area rate per unit of iced-surface water need: exchange area over freezing efficiency. */
  public static final double CANOPY_FACTOR = 2.4;
  /** In-canopy wind over open 2 m wind; see the class comment. */
  public static final double CANOPY_WIND_RATIO = 0.5;
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

  /**
   * Over-plant application rate, mm/h of water over the ground, that keeps iced buds at 0 °C on a
   * clear night, from air temperature (−15…5 °C), dew point (−40 °C…air), wind at 2 m (0…5 m/s),
   * supply water temperature (0…30 °C) and pressure (50…110 kPa); energy balance after FAO 2005
   * (Snyder &amp; de Melo-Abreu, ch. 7) with McAdams (1954) convection, calibrated by
   * {@link #CANOPY_FACTOR} to Longstroth (2012, MSU) and Evans (Good Fruit Grower). Zero when the
   * iced surface loses no heat.
   */
  public static double requiredRateMmH(double airTempC, double dewPointC, double windMs,
      double waterTempC, double pressureKPa) {
    Ranges.check("air temperature", airTempC, -15, 5, "°C");
    Ranges.check("dew point", dewPointC, -40, 50, "°C");
    Ranges.checkDewPoint(airTempC, dewPointC);
    if (windMs > 5) {
      throw new OutOfRangeException("wind speed at 2 m " + Ranges.fmt(windMs) + " m/s is above the"
          + " 5 m/s this sprinkler balance is valid for; over-plant sprinkling is not advised above"
          + " about 4.5 m/s (10 mph), so plan another method for this wind");
    }
    Ranges.check("wind speed at 2 m", windMs, 0, 5, "m/s");
    Ranges.check("water temperature", waterTempC, 0, 30, "°C");
    Ranges.check("pressure", pressureKPa, 50, 110, "kPa");
    double lossWm2 = iceSurfaceLossWm2(airTempC, dewPointC, windMs, pressureKPa);
    if (lossWm2 <= 0) {
      return 0;
    }
    double heatPerKg = LATENT_FUSION_J_PER_KG + WATER_HEAT_CAPACITY * waterTempC;
    return CANOPY_FACTOR * lossWm2 / heatPerKg * 3600.0;
  }

  /**
   * Lowest air temperature, °C, at which a rate in mm/h (0.1…25) keeps iced buds at 0 °C, for a
   * dew point (−15…5 °C), wind at 2 m (0…5 m/s), water temperature (0…30 °C) and pressure
   * (50…110 kPa); inverse of {@link #requiredRateMmH} by bisection to 0.001 °C. The answer cannot be
   * below the dew point (the air would be saturated there); a rate that holds even there, or that
   * fails even at 0 °C air, is reported as out of range rather than given a made-up limit.
   */
  public static double protectsToC(double rateMmH, double dewPointC, double windMs, double waterTempC,
      double pressureKPa) {
    Ranges.check("application rate", rateMmH, 0.1, 25, "mm/h");
    Ranges.check("dew point", dewPointC, -15, 5, "°C");
    double low = dewPointC;
    double high = Math.max(0.0, dewPointC);
    if (requiredRateMmH(low, dewPointC, windMs, waterTempC, pressureKPa) <= rateMmH) {
      throw new OutOfRangeException(String.format(java.util.Locale.ROOT,
          "%.2f mm/h holds the buds at 0 °C even when the air falls to its dew point (%.1f °C); the"
              + " limit lies below that, so give the lower dew point expected later in the night",
          rateMmH, dewPointC));
    }
    if (requiredRateMmH(high, dewPointC, windMs, waterTempC, pressureKPa) > rateMmH) {
      throw new OutOfRangeException(String.format(java.util.Locale.ROOT,
          "%.2f mm/h cannot keep iced buds at 0 °C even with the air at %.1f °C in this wind; use a"
              + " higher rate", rateMmH, high));
    }
    double lo = low;
    double hi = high;
    while (hi - lo > 1e-3) {
      double mid = 0.5 * (lo + hi);
      if (requiredRateMmH(mid, dewPointC, windMs, waterTempC, pressureKPa) > rateMmH) {
        lo = mid;
      } else {
        hi = mid;
      }
    }
    return 0.5 * (lo + hi);
  }

  /** McAdams (1954) wind-convection coefficient, W m⁻² K⁻¹, valid 0…5 m/s. */
  static double convectionWPerM2K(double windMs) {
    return 5.7 + 3.8 * windMs;
  }

  /** Heat loss, W/m², of an iced plant surface held at 0 °C. */
  static double iceSurfaceLossWm2(double airTempC, double dewPointC, double windMs, double pressureKPa) {
    double h = convectionWPerM2K(CANOPY_WIND_RATIO * windMs);
    double sensible = h * (0.0 - airTempC);
    double gammaKPaPerK = AIR_HEAT_CAPACITY * pressureKPa / (0.622 * LATENT_VAPORISATION_J_PER_KG);
    double ea = Psychrometrics.vapourPressureFromDewPointKPa(dewPointC);
    double latent = h * (Psychrometrics.saturationOverIceKPa(0.0) - ea) / gammaKPaPerK;
    double sky = Sky.downwardLongWaveWm2(airTempC, dewPointC, 0);
    double longWave = ICE_EMISSIVITY
        * (Sky.blackBodyWm2(0.0) - 0.5 * sky - 0.5 * Sky.blackBodyWm2(airTempC));
    return sensible + latent + longWave;
  }
}
