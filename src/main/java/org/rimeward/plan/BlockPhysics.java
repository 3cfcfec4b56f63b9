package org.rimeward.plan;

import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.rimeward.farm.Block;
import org.rimeward.farm.Sprinklers;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.BudTemperature;
import org.rimeward.physics.KillCurve;
import org.rimeward.physics.OutOfRangeException;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.physics.SprinklerBalance;
import org.rimeward.physics.Wind;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.Measure;
import org.rimeward.rules.facts.NightSeries;
import org.rimeward.weather.ForecastStep;

/**
 * Computes one block's night, step by step, with the physics core: the air at the block, wet
 * bulb at the site's pressure, the radiative cooling of a bud, and the water an iced bud needs.
 */
final class BlockPhysics {
  /**
   * Above this air temperature an iced bud at 0 °C gains heat from the air, so sprinkling needs
   * no water to hold it; the sprinkler balance is only valid up to it.
   */
  static final double NO_ICE_NEEDED_ABOVE_C = 5.0;

  /** The forecast's wind is brought to this height too, where extension wind limits apply. */
  static final double REPORTED_WIND_HEIGHT_M = 10.0;

  private BlockPhysics() {}

  static BlockNight compute(Block block, double t10C, double t90C, List<ForecastStep> steps,
      double pressureKPa, String forecastName) {
    return compute(block, block.coldAirOffsetC(), t10C, t90C, steps, pressureKPa, forecastName,
        new Memo());
  }

  /**
   * The per-step physics depends on a block only through its cold-air offset and its sprinkler
   * water temperature, so blocks that share both share one computation; a region of thousands
   * of blocks has few distinct pairs. A memo serves one forecast.
   */
  static final class Memo {
    private final Map<List<Double>, Steps> bySite = new HashMap<>();
  }

  /** One site's night, step by step, before it is tied to a block. */
  private record Steps(long[] t, int[] lines, Map<Measure, double[]> v) {}

  /**
   * {@code block}'s night from {@code steps}, its air {@code coldAirOffsetC} off theirs (the
   * block's own offset, or none where its station's readings are already the block's air).
   */
  static BlockNight compute(Block block, double coldAirOffsetC, double t10C, double t90C,
      List<ForecastStep> steps, double pressureKPa, String forecastName, Memo memo) {
    double waterTempC = block.sprinklers().map(s -> s.waterTempC()).orElse(Sprinklers.DEFAULT_WATER_TEMP_C);
    List<Double> site = List.of(coldAirOffsetC, waterTempC);
    Steps computed = memo.bySite.get(site);
    if (computed == null) {
      computed = steps(block, coldAirOffsetC, steps, pressureKPa, forecastName, waterTempC);
      memo.bySite.put(site, computed);
    }
    // NightSeries copies what it is given, so the shared arrays stay untouched.
    NightSeries series = new NightSeries(computed.t(), computed.lines(), computed.v());
    double kill = new KillCurve(t10C, t90C).killPct(
        series.valueAt(Measure.DRY_BUD_C, series.indexOfMin(Measure.DRY_BUD_C)));
    return BlockNight.of(block.id(), series, kill);
  }

  private static Steps steps(Block block, double coldAirOffsetC, List<ForecastStep> steps,
      double pressureKPa, String forecastName, double waterTempC) {
    int n = steps.size();
    long[] t = new long[n];
    int[] lines = new int[n];
    Map<Measure, double[]> v = new EnumMap<>(Measure.class);
    for (Measure m : Measure.values()) {
      v.put(m, new double[n]);
    }
    // FAO-56 Eq. 47 is linear in the wind, so its ratio between two heights is a constant.
    double tenMPer2M = 1.0 / Wind.at2mMs(1.0, REPORTED_WIND_HEIGHT_M);
    for (int i = 0; i < n; i++) {
      ForecastStep s = steps.get(i);
      t[i] = s.time().getEpochSecond();
      lines[i] = s.line();
      try {
        double air = s.airTempC() + coldAirOffsetC;
        // Air cooled in a cold pocket cannot hold more vapour than saturation: dew point ≤ air.
        double dew = Math.min(s.dewPointC(), air);
        double wind2m = Wind.at2mMs(s.windMs(), s.windHeightM());
        double wetBulb = Psychrometrics.wetBulbC(air, dew, pressureKPa);
        BudTemperature bud = BudTemperature.estimate(air, dew, wind2m, s.cloudPct(),
            s.solarWm2().orElse(0.0));
        double rate = requiredRateMmH(air, dew, wind2m, waterTempC, pressureKPa, s.cloudPct());
        v.get(Measure.AIR_C)[i] = air;
        v.get(Measure.DEW_POINT_C)[i] = dew;
        v.get(Measure.WET_BULB_C)[i] = wetBulb;
        v.get(Measure.DRY_BUD_C)[i] = air - bud.depressionC();
        v.get(Measure.WET_BUD_C)[i] = wetBulb - bud.depressionC();
        v.get(Measure.WIND_2M_MS)[i] = wind2m;
        v.get(Measure.WIND_10M_MS)[i] = wind2m * tenMPer2M;
        v.get(Measure.REQUIRED_RATE_MM_H)[i] = rate;
        v.get(Measure.CLOUD_PCT)[i] = s.cloudPct();
        v.get(Measure.SOLAR_WM2)[i] = s.solarWm2().orElse(0.0);
      } catch (IllegalArgumentException e) {
        throw new BadInputException(forecastName + ":" + s.line() + ": block " + block.id()
            + ": " + e.getMessage() + "; check this forecast line", e);
      }
    }
    return new Steps(t, lines, v);
  }

  /**
   * The sprinkling need at one step; NaN where the weather is outside the range the sprinkler
   * balance states it is valid for. Whether sprinkling is advised there is the rules' business
   * (rules/sprinkling/rate.drl); a NaN never leaves the series.
   */
  private static double requiredRateMmH(double air, double dew, double wind2m, double waterTempC,
      double pressureKPa, double cloudPct) {
    if (air > NO_ICE_NEEDED_ABOVE_C) {
      return 0.0;
    }
    try {
      return SprinklerBalance.requiredRateMmH(air, dew, wind2m, waterTempC, pressureKPa, cloudPct);
    } catch (OutOfRangeException e) {
      return Double.NaN;
    }
  }

}
