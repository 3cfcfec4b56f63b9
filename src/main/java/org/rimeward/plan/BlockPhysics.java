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

  /** The sprinkler balance holds up to this wind at 2 m; extension guidance stops at 4.5 m/s. */
  static final double SPRINKLING_WIND_LIMIT_MS = 5.0;

  private BlockPhysics() {}

  static BlockNight compute(Block block, double t10C, double t90C, List<ForecastStep> steps,
      double pressureKPa, String forecastName) {
    return compute(block, t10C, t90C, steps, pressureKPa, forecastName, new Memo());
  }

  /**
   * The per-step physics depends on a block only through its cold-air offset and its sprinkler
   * water temperature, so blocks that share both share one computation; a region of thousands
   * of blocks has few distinct pairs.
   */
  static final class Memo {
    private final Map<List<Double>, Steps> bySite = new HashMap<>();
  }

  /** One site's night, step by step, before it is tied to a block. */
  private record Steps(long[] t, int[] lines, Map<Measure, double[]> v, double maxWindFreezing) {}

  static BlockNight compute(Block block, double t10C, double t90C, List<ForecastStep> steps,
      double pressureKPa, String forecastName, Memo memo) {
    double waterTempC = block.sprinklers().map(s -> s.waterTempC()).orElse(Sprinklers.DEFAULT_WATER_TEMP_C);
    List<Double> site = List.of(block.coldAirOffsetC(), waterTempC);
    Steps computed = memo.bySite.get(site);
    if (computed == null) {
      computed = steps(block, steps, pressureKPa, forecastName, waterTempC);
      memo.bySite.put(site, computed);
    }
    // NightSeries copies what it is given, so the shared arrays stay untouched.
    return night(block, t10C, t90C, computed.t(), computed.lines(), computed.v(),
        computed.maxWindFreezing());
  }

  private static Steps steps(Block block, List<ForecastStep> steps, double pressureKPa,
      String forecastName, double waterTempC) {
    int n = steps.size();
    long[] t = new long[n];
    int[] lines = new int[n];
    Map<Measure, double[]> v = new EnumMap<>(Measure.class);
    for (Measure m : Measure.values()) {
      v.put(m, new double[n]);
    }
    double maxWindFreezing = 0;
    for (int i = 0; i < n; i++) {
      ForecastStep s = steps.get(i);
      t[i] = s.time().getEpochSecond();
      lines[i] = s.line();
      try {
        double air = s.airTempC() + block.coldAirOffsetC();
        // Air cooled in a cold pocket cannot hold more vapour than saturation: dew point ≤ air.
        double dew = Math.min(s.dewPointC(), air);
        double wind2m = Wind.at2mMs(s.windMs(), s.windHeightM());
        double wetBulb = Psychrometrics.wetBulbC(air, dew, pressureKPa);
        BudTemperature bud = BudTemperature.estimate(air, dew, wind2m, s.cloudPct(),
            s.solarWm2().orElse(0.0));
        double rate;
        if (air > NO_ICE_NEEDED_ABOVE_C) {
          rate = 0.0;
        } else if (wind2m > SPRINKLING_WIND_LIMIT_MS) {
          // Beyond the balance's validity: no rate holds iced buds at 0 °C in such wind.
          rate = Double.POSITIVE_INFINITY;
        } else {
          rate = SprinklerBalance.requiredRateMmH(air, dew, wind2m, waterTempC, pressureKPa);
        }
        v.get(Measure.AIR_C)[i] = air;
        v.get(Measure.WET_BULB_C)[i] = wetBulb;
        v.get(Measure.DRY_BUD_C)[i] = air - bud.depressionC();
        v.get(Measure.WET_BUD_C)[i] = wetBulb - bud.depressionC();
        v.get(Measure.WIND_2M_MS)[i] = wind2m;
        v.get(Measure.REQUIRED_RATE_MM_H)[i] = rate;
        v.get(Measure.CLOUD_PCT)[i] = s.cloudPct();
        v.get(Measure.SOLAR_WM2)[i] = s.solarWm2().orElse(0.0);
        if (air <= 0) {
          maxWindFreezing = Math.max(maxWindFreezing, wind2m);
        }
      } catch (IllegalArgumentException e) {
        throw new BadInputException(forecastName + ":" + s.line() + ": block " + block.id()
            + ": " + e.getMessage() + "; check this forecast line", e);
      }
    }
    return new Steps(t, lines, v, maxWindFreezing);
  }

  private static BlockNight night(Block block, double t10C, double t90C, long[] t, int[] lines,
      Map<Measure, double[]> v, double maxWindFreezing) {
    int n = t.length;
    NightSeries series = new NightSeries(t, lines, v);
    int cold = series.indexOfMin(Measure.DRY_BUD_C);
    double minDryBud = series.valueAt(Measure.DRY_BUD_C, cold);
    double maxDepression = 0;
    for (int i = 0; i < n; i++) {
      maxDepression = Math.max(maxDepression,
          series.valueAt(Measure.AIR_C, i) - series.valueAt(Measure.DRY_BUD_C, i));
    }
    double kill = new KillCurve(t10C, t90C).killPct(minDryBud);
    return new BlockNight(block.id(), series, min(series, Measure.AIR_C), minDryBud,
        min(series, Measure.WET_BULB_C), min(series, Measure.WET_BUD_C), maxDepression,
        series.timeAt(cold), series.lineAt(cold), kill, maxWindFreezing);
  }

  private static double min(NightSeries s, Measure m) {
    return s.valueAt(m, s.indexOfMin(m));
  }
}
