package org.rimeward.cli;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.rimeward.farm.Sprinklers;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.OutOfRangeException;
import org.rimeward.physics.SprinklerBalance;
import org.rimeward.physics.Wind;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.RuleThresholds;
import org.rimeward.rules.facts.Thresholds;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "rate",
    description = {"Over-plant sprinkling: the application rate that keeps iced buds at 0 °C at an air"
        + " temperature (--temp), or the lowest air temperature a rate protects to (--rate).",
        "Energy balance of iced 10 mm twigs in the wind, checked against the UF/IFAS and MSU rate"
        + " tables; clear sky unless --cloud is given.",
        "Says whether sprinkling is advised in that wind, by the wind limits the rule files set"
            + " (rule THRESHOLDS, policy/thresholds.drl), and why.",
        "Decision support: uniform coverage and clear ice matter as much as the rate."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcRateCommand implements Runnable {
  /** Forecasts and weather stations report wind at 10 m (WMO standard exposure). */
  static final String DEFAULT_WIND_HEIGHT = "10 m";

  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @ArgGroup(exclusive = true, multiplicity = "1")
  Target target;

  static final class Target {
    @Option(names = "--temp", paramLabel = "T", description = "Air temperature to protect at: " + CalcOutput.TEMP_UNITS + ".")
    String temp;

    @Option(names = "--rate", paramLabel = "R", description = "Application rate, e.g. 3.8 mm/h or 0.15 in/h.")
    String rate;
  }

  @Option(names = "--dew-point", required = true, paramLabel = "TD", description = "Dew point: " + CalcOutput.TEMP_UNITS + ".")
  String dewPoint;

  @Option(names = "--wind", required = true, paramLabel = "W",
      description = "Wind speed as reported, with its unit: 2 m/s, 5 mph, 8 km/h or 4 kn.")
  String wind;

  @Option(names = "--wind-height", paramLabel = "Z",
      description = "Height the wind is reported at, e.g. 10 m or 33 ft (default " + DEFAULT_WIND_HEIGHT
          + ", as forecasts give it); brought to 2 m by FAO-56 Eq. 47.")
  String windHeight;

  @Option(names = "--cloud", paramLabel = "PCT", description = "Cloud cover, 0-100 %% (default 0: a clear sky, the worst case).")
  String cloud;

  @Option(names = "--water-temp", paramLabel = "T",
      description = "Temperature of the supply water (default 5 °C / 41 °F): " + CalcOutput.TEMP_UNITS + ".")
  String waterTemp;

  @Option(names = "--elevation", paramLabel = "Z", description = "Elevation, e.g. 240 m or 800 ft (default 0 m).")
  String elevation;

  @Option(names = "--rules", paramLabel = "DIR",
      description = "Folder of .drl rule files whose wind limits decide 'advised' (default: ./rules if present, else the bundled rules).")
  Path rules;

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  @Override
  public void run() {
    UnitSystem units = CalcOutput.units(spec);
    double dewC = CalcOutput.temperature(dewPoint, "--dew-point", units);
    double windMs = Quantities.parse(wind, Dimension.SPEED, "--wind");
    double heightM = Quantities.parse(windHeight == null ? DEFAULT_WIND_HEIGHT : windHeight,
        Dimension.LENGTH, "--wind-height");
    double wind2mMs;
    try {
      wind2mMs = Wind.at2mMs(windMs, heightM);
    } catch (OutOfRangeException e) {
      throw new BadInputException("--wind/--wind-height: " + e.getMessage());
    }
    double cloudPct = cloud == null ? 0 : Quantities.parse(cloud, Dimension.PERCENT, "--cloud", units);
    double waterC = waterTemp == null ? Sprinklers.DEFAULT_WATER_TEMP_C
        : CalcOutput.temperature(waterTemp, "--water-temp", units);
    double pressureKPa = Atmosphere.stationPressureKPa(
        elevation == null ? 0 : Quantities.parse(elevation, Dimension.LENGTH, "--elevation"));
    // The rule files state their wind limits against the reported 10 m wind.
    double wind10mMs = wind2mMs / Wind.at2mMs(1.0, 10.0);
    Thresholds limits = limits();
    UnitSystem shown = json ? UnitSystem.METRIC : units;
    Map<String, Object> m = new LinkedHashMap<>();
    String line;
    Advice advice;
    if (target.temp != null) {
      double airC = CalcOutput.temperature(target.temp, "--temp", units);
      double rate = SprinklerBalance.requiredRateMmH(airC, dewC, wind2mMs, waterC, pressureKPa, cloudPct);
      m.put("required_rate_mm_h", CalcOutput.round(rate, 2));
      line = "required over-plant rate " + rate(rate, units)
          + " to hold iced buds at 0 °C with the air at " + CalcOutput.temp(airC, units);
      advice = airC >= 0
          ? new Advice(true, "The air, " + CalcOutput.temp(airC, shown) + ", is not below freezing,"
              + " so the wind limit does not apply; sprinkling at this hour needs at least "
              + rate(rate, shown) + ".")
          : windAdvice(limits, wind10mMs, wind2mMs, "At least " + rate(rate, shown), shown);
    } else {
      double rate = Quantities.parse(target.rate, Dimension.RATE, "--rate");
      SprinklerBalance.Protection p = SprinklerBalance.protection(rate, dewC, wind2mMs, waterC,
          pressureKPa, cloudPct);
      m.put("protects_to_c", p.limit() == SprinklerBalance.Limit.AIR_TEMPERATURE
          ? CalcOutput.round(p.airTempC(), 2) : null);
      m.put("limited_by", switch (p.limit()) {
        case AIR_TEMPERATURE -> "air-temperature";
        case DEW_POINT -> "dew-point";
        case FREEZING -> "rate";
      });
      line = switch (p.limit()) {
        case AIR_TEMPERATURE -> rate(rate, units)
            + " protects iced buds down to an air temperature of about " + CalcOutput.temp(p.airTempC(), units);
        case DEW_POINT -> rate(rate, units) + " holds iced buds at 0 °C even with the air down at its"
            + " dew point, " + CalcOutput.temp(dewC, units) + "; the air cannot cool below that unless"
            + " the dew point falls too, so how far this rate protects depends on a dew point the"
            + " night does not reach here. Give the lowest dew point expected for the night with"
            + " --dew-point to find the limit";
        case FREEZING -> rate(rate, units) + " is short even with the air at 0 °C: it cannot keep"
            + " ice on the buds wet in this wind and dry air, and sprinkling with it can leave buds"
            + " colder than none";
      };
      advice = p.limit() == SprinklerBalance.Limit.FREEZING
          ? new Advice(false, rate(rate, shown) + " falls short even with the air"
              + " at 0 °C in this wind and dew point, and wet buds short of water end colder than dry ones.")
          : windAdvice(limits, wind10mMs, wind2mMs, "At " + rate(rate, shown), shown);
    }
    if (json) {
      m.put("wind_10m_ms", CalcOutput.round(wind10mMs, 2));
      m.put("wind_2m_ms", CalcOutput.round(wind2mMs, 2));
      m.put("advised", advice.advised());
      m.put("reason", advice.reason());
      CalcOutput.printJson(spec, m);
      return;
    }
    CalcOutput.printLine(spec, line + " (dew point " + CalcOutput.temp(dewC, units) + ", wind "
        + Quantities.format(windMs, Dimension.SPEED, units, 1) + " at "
        + Quantities.format(heightM, Dimension.LENGTH, units, 0) + ", "
        + Quantities.format(wind2mMs, Dimension.SPEED, units, 1) + " at 2 m, cloud "
        + Math.round(cloudPct) + " %, water " + CalcOutput.temp(waterC, units) + ")");
    CalcOutput.printLine(spec, (advice.advised() ? "Advised. " : "Not advised. ") + advice.reason());
  }

  /** Whether sprinkling is advised, and why in the user's words and units. */
  record Advice(boolean advised, String reason) {}

  /**
   * The wind limits as the rule files set them (rule THRESHOLDS), so this command and the plan
   * judge wind by the same numbers, kept in one place.
   */
  private Thresholds limits() {
    return RuleThresholds.of(RuleBook.load(rules != null ? rules : BundledData.folder("rules")));
  }

  /** Below freezing: the rule files' wind bands, stated against the 10 m wind. */
  private static Advice windAdvice(Thresholds limits, double wind10mMs, double wind2mMs,
      String lead, UnitSystem shown) {
    String wind = "the wind, " + speed(wind10mMs, shown) + " at "
        + Quantities.format(10.0, Dimension.LENGTH, shown, 0) + " (" + speed(wind2mMs, shown)
        + " at " + Quantities.format(2.0, Dimension.LENGTH, shown, 0) + "),";
    if (wind10mMs > limits.windyWind10mMs()) {
      return new Advice(false, "T" + wind.substring(1) + " is above "
          + speed(limits.windyWind10mMs(), shown) + ", the rule files' limit for over-plant"
          + " sprinkling alone: in a wind-borne freeze wet buds can end colder than dry ones; covers"
          + " with sprinkling over them, or none, are what is left.");
    }
    if (wind10mMs > limits.breezyWind10mMs()) {
      return new Advice(true, lead + ": " + wind + " is above "
          + speed(limits.breezyWind10mMs(), shown) + ", so wet buds lose heat faster and sprinkling"
          + " needs more water; check that the ice stays clear.");
    }
    return new Advice(true, lead + ": " + wind + " is at or below "
        + speed(limits.breezyWind10mMs(), shown) + ".");
  }

  private static String speed(double ms, UnitSystem units) {
    return Quantities.format(ms, Dimension.SPEED, units, 1);
  }

  private static String rate(double mmH, UnitSystem units) {
    return Quantities.format(mmH, Dimension.RATE, units, units == UnitSystem.US ? 3 : 1);
  }
}
