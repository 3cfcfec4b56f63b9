package org.rimeward.rules;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.rimeward.physics.Wind;
import org.rimeward.rules.facts.BlockFact;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.Measure;
import org.rimeward.rules.facts.NightFact;
import org.rimeward.rules.facts.NightSeries;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.TargetBasis;
import org.rimeward.rules.facts.WaterSourceFact;

/**
 * Minimal facts for one rule test: a night with hourly steps from 18:00 and blocks whose series
 * are given directly, so a test sets exactly the numbers a rule looks at. Invented values.
 */
final class Scenario {
  static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  static final LocalDate DATE = LocalDate.of(2026, 4, 10);
  static final ZonedDateTime FIRST = DATE.atTime(18, 0).atZone(ZONE);
  static final Instant SUNSET = DATE.atTime(19, 40).atZone(ZONE).toInstant();
  static final Instant SUNRISE = DATE.plusDays(1).atTime(6, 30).atZone(ZONE).toInstant();
  /** Sea level, ICAO standard atmosphere. */
  static final double PRESSURE_KPA = 101.325;

  PolicyFact policy = new PolicyFact(TargetBasis.T10, Double.NaN, 1.0, StopBasis.WET_BULB_ABOVE_FREEZING);
  final List<Object> facts = new ArrayList<>();

  static Instant at(int dayOffset, int hour, int minute) {
    return DATE.plusDays(dayOffset).atTime(hour, minute).atZone(ZONE).toInstant();
  }

  Scenario policy(PolicyFact p) {
    this.policy = p;
    return this;
  }

  /** Facts inserted as they are, e.g. thresholds of a test's own. */
  Scenario fact(Object f) {
    facts.add(f);
    return this;
  }

  Scenario source(String id, double maxFlowM3H, double volumeM3) {
    facts.add(new WaterSourceFact(id, maxFlowM3H, volumeM3));
    return this;
  }

  /** A block builder; the series is hourly from 18:00, one value per hour. */
  BlockBuilder block(String id) {
    return new BlockBuilder(id);
  }

  List<Object> facts() {
    List<Object> all = new ArrayList<>();
    all.add(new NightFact(DATE, ZONE, SUNSET, SUNRISE, PRESSURE_KPA));
    all.add(policy);
    all.addAll(facts);
    return all;
  }

  final class BlockBuilder {
    final String id;
    String crop = "apple";
    String stage = "full-bloom";
    boolean flowering = true;
    double areaHa = 4;
    double t10C = -2.2;
    double t90C = -3.9;
    double rateMmH = 0;
    String source;
    double coverC = 0;
    double deployHours = 2;
    double valuePerHa = Double.NaN;
    double killPct = 0;
    double[] air;
    double[] wetBulb;
    double depressionC = 1.0;
    double[] wind;
    double[] dew;
    double[] rate;
    double[] cloud;

    BlockBuilder(String id) {
      this.id = id;
    }

    BlockBuilder thresholds(double t10, double t90) {
      t10C = t10;
      t90C = t90;
      return this;
    }

    BlockBuilder stage(String s, boolean isFlowering) {
      stage = s;
      flowering = isFlowering;
      return this;
    }

    BlockBuilder area(double ha) {
      areaHa = ha;
      return this;
    }

    BlockBuilder sprinklers(double r, String src) {
      rateMmH = r;
      source = src;
      return this;
    }

    BlockBuilder covers(double c, double hours) {
      coverC = c;
      deployHours = hours;
      return this;
    }

    BlockBuilder value(double perHa) {
      valuePerHa = perHa;
      return this;
    }

    BlockBuilder kill(double pct) {
      killPct = pct;
      return this;
    }

    /** Air and wet bulb per hour; the dry bud is air less the depression, the wet bud likewise. */
    BlockBuilder hourly(double[] airC, double[] wetBulbC) {
      air = airC;
      wetBulb = wetBulbC;
      return this;
    }

    /** Dew point per hour; by default read back from the wet bulb with the one-third rule. */
    BlockBuilder dew(double... c) {
      dew = c;
      return this;
    }

    BlockBuilder depression(double c) {
      depressionC = c;
      return this;
    }

    /** Wind at 10 m per hour, as forecasts report it; 2 m follows by FAO-56 Eq. 47. */
    BlockBuilder wind(double... ms) {
      wind = ms;
      return this;
    }

    BlockBuilder rate(double... mmH) {
      rate = mmH;
      return this;
    }

    BlockBuilder cloud(double... pct) {
      cloud = pct;
      return this;
    }

    Scenario done() {
      int n = air.length;
      long[] t = new long[n];
      int[] lines = new int[n];
      Map<Measure, double[]> v = new EnumMap<>(Measure.class);
      double[] dry = new double[n];
      double[] wet = new double[n];
      for (int i = 0; i < n; i++) {
        t[i] = FIRST.plusHours(i).toEpochSecond();
        lines[i] = i + 2;
        dry[i] = air[i] - depressionC;
        wet[i] = wetBulb[i] - depressionC;
      }
      double[] wind10 = wind != null ? wind : fill(n, 1.0);
      double[] wind2 = java.util.Arrays.stream(wind10).map(u -> Wind.at2mMs(u, 10.0)).toArray();
      double[] dewC = dew;
      if (dewC == null) {
        // Knox, Nevius & Knox (2017) one-third rule, Tw ≈ T − (T − Td)/3, read backwards: enough
        // for a fixture whose rules never compute a wet bulb from a dew point.
        dewC = new double[n];
        for (int i = 0; i < n; i++) {
          dewC[i] = Math.min(wetBulb[i], air[i] - 3 * (air[i] - wetBulb[i]));
        }
      }
      v.put(Measure.AIR_C, air);
      v.put(Measure.DEW_POINT_C, dewC);
      v.put(Measure.WET_BULB_C, wetBulb);
      v.put(Measure.DRY_BUD_C, dry);
      v.put(Measure.WET_BUD_C, wet);
      v.put(Measure.WIND_10M_MS, wind10);
      v.put(Measure.WIND_2M_MS, wind2);
      v.put(Measure.REQUIRED_RATE_MM_H, rate != null ? rate : fill(n, 2.0));
      v.put(Measure.CLOUD_PCT, cloud != null ? cloud : fill(n, 0));
      v.put(Measure.SOLAR_WM2, fill(n, 0));
      // The series and its summary are built the one way the planner builds them.
      NightSeries s = new NightSeries(t, lines, v);
      facts.add(new BlockFact(id, crop, null, stage, stage.replace('-', ' '), flowering, areaHa, t10C, t90C,
          "test table", 0, valuePerHa, rateMmH > 0, rateMmH, source, coverC > 0, coverC,
          coverC > 0 ? "test cover" : null, deployHours));
      facts.add(BlockNight.of(id, s, killPct));
      return Scenario.this;
    }
  }

  /**
   * A frost night, 18:00 to 09:00 (16 hourly steps): the air falls to -4 °C at 05:00 and warms
   * after sunrise; the wet bulb runs below it. With the default 1 °C depression the wet bud
   * crosses -1.2 °C at 22:42 and the wet bulb rises through 0 °C at 07:40.
   */
  static final double[] FROST_AIR = {6, 5, 4, 3, 2, 1, 0, -1, -2, -3, -3.5, -4, -3, 0, 2, 4};
  static final double[] FROST_WET = {3, 2.5, 2, 1.5, 0.5, -0.5, -1.5, -2, -3, -3.8, -4, -4.5, -3.5, -1, 0.5, 2};

  /**
   * Air for a night whose coldest step is exactly {@code minC}, at 02:00 (step 8, forecast line
   * 10); every other step is warmer, and the morning is above 0 °C from 05:00.
   */
  static double[] coldestAt0200(double minC) {
    return new double[] {6, 5, 4, 3, 2, 1, minC + 1, minC + 0.5, minC, minC + 0.5, minC + 1, 2, 3, 4, 5, 6};
  }

  /** Each value less {@code d}. */
  static double[] minus(double[] a, double d) {
    return java.util.Arrays.stream(a).map(x -> x - d).toArray();
  }

  /** A copy with step {@code i} set to {@code v}. */
  static double[] with(double[] a, int i, double v) {
    double[] c = a.clone();
    c[i] = v;
    return c;
  }

  static double[] fill(int n, double v) {
    double[] a = new double[n];
    java.util.Arrays.fill(a, v);
    return a;
  }

  static double min(double[] a) {
    return java.util.Arrays.stream(a).min().orElseThrow();
  }
}
