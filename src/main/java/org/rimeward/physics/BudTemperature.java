package org.rimeward.physics;

/**
 * Temperature of a dry flower bud on a frost night, and how far it sits below the air.
 *
 * <p>The bud is a sphere of {@link #DIAMETER_M} = 5 mm, the size of an apple or cherry flower bud
 * from tight cluster to first bloom (common practice). Its emissivity {@link #EMISSIVITY} = 0.97
 * is the middle of the 0.94–0.99 range given for leaves and green tissue (Campbell &amp; Norman
 * 1998, Table 11.3, from memory). It sees the sky over its upper half and, over its lower half,
 * ground and neighbouring wood taken as black at air temperature. Sensible heat from the air is
 * the only gain: frost nights are dry enough that deposition on a bud above its frost point is
 * left out, which keeps the estimate on the cold (safe) side. After sunrise the sun's absorbed
 * short-wave radiation is a second gain and can warm a bud above the air.
 *
 * @param budTempC bud temperature, °C
 * @param depressionC air temperature minus bud temperature, °C; negative when the sun warms the
 *     bud above the air
 */
public record BudTemperature(double budTempC, double depressionC) {
  /** Bud diameter, m. */
  public static final double DIAMETER_M = 0.005;
  /** Long-wave emissivity (and absorptivity) of the bud surface. */
  public static final double EMISSIVITY = 0.97;
  /**
   * Share of solar (short-wave) radiation a bud absorbs: about 0.5 for green tissue over the
   * whole solar spectrum (Campbell &amp; Norman 1998, ch. 11, from memory).
   */
  public static final double SOLAR_ABSORPTIVITY = 0.5;

  public BudTemperature {
    if (!Double.isFinite(budTempC) || !Double.isFinite(depressionC)) {
      throw new OutOfRangeException("bud temperature and its depression must be finite, were "
          + budTempC + " and " + depressionC);
    }
  }

  /**
   * Bud temperature, °C, from air temperature (−40…45 °C), dew point (−40 °C…air), wind at 2 m
   * (0…60 m/s, as the sprinkler balance) and cloud cover (0…100 %): steady energy balance of a sphere with Brutsaert (1975)
   * sky emissivity, Unsworth &amp; Monteith (1975) cloud correction and Whitaker (1972)/Churchill
   * (1983) convection; gives 1–3 °C below air on clear calm nights as measured by Leuning &amp;
   * Cremer (1988) and described in FAO 2005 (Snyder &amp; de Melo-Abreu), near zero in wind or
   * overcast.
   */
  public static BudTemperature estimate(double airTempC, double dewPointC, double windMs, double cloudPct) {
    return estimate(airTempC, dewPointC, windMs, cloudPct, 0.0);
  }

  /**
   * As {@link #estimate(double, double, double, double)}, with global solar radiation on a
   * horizontal surface (0…1400 W/m²) as a further gain: a sphere intercepts a beam over a quarter of
   * its surface, so it absorbs {@link #SOLAR_ABSORPTIVITY} × S / 4 per m². Horizontal radiation
   * understates the beam a bud meets at a low sun, which errs on the cold side at dawn.
   */
  public static BudTemperature estimate(double airTempC, double dewPointC, double windMs,
      double cloudPct, double solarWm2) {
    // The balance itself holds at any weather; these bounds only keep out values no forecast gives,
    // so a warm spring afternoon or a gale in the window is planned, not refused.
    Ranges.check("air temperature", airTempC, -40, 45, "°C");
    Ranges.check("wind speed at 2 m", windMs, 0, SprinklerBalance.MAX_WIND_MS, "m/s");
    Ranges.check("cloud cover", cloudPct, 0, 100, "%");
    Ranges.check("solar radiation", solarWm2, 0, 1400, "W/m²");
    double skyWm2 = Sky.downwardLongWaveWm2(airTempC, dewPointC, cloudPct);
    double surroundWm2 = Sky.blackBodyWm2(airTempC);
    double absorbedWm2 = EMISSIVITY * 0.5 * (skyWm2 + surroundWm2)
        + SOLAR_ABSORPTIVITY * solarWm2 / 4.0;
    // Net gain per m² of bud surface; rises as the bud cools, zero at the balance temperature.
    java.util.function.DoubleUnaryOperator gain = budC -> {
      double depression = airTempC - budC;
      return absorbedWm2 - EMISSIVITY * Sky.blackBodyWm2(budC)
          + Convection.sphereWPerM2K(DIAMETER_M, windMs, airTempC, depression) * depression;
    };
    // Without sun, gain(air) is the net long-wave loss, ≤ 0 since the sky emissivity is at most 1,
    // so the bud is at or below the air; sunlight can lift it above.
    double high = solarWm2 > 0 ? airTempC + 30 : airTempC;
    double budC = Psychrometrics.bisect(airTempC - 30, high, b -> -gain.applyAsDouble(b));
    return new BudTemperature(budC, airTempC - budC);
  }
}
