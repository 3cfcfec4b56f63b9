package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import org.rimeward.farm.Sprinklers;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.OutOfRangeException;
import org.rimeward.physics.SprinklerBalance;
import org.rimeward.physics.Wind;
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
    Map<String, Object> m = new LinkedHashMap<>();
    String line;
    if (target.temp != null) {
      double airC = CalcOutput.temperature(target.temp, "--temp", units);
      double rate = SprinklerBalance.requiredRateMmH(airC, dewC, wind2mMs, waterC, pressureKPa, cloudPct);
      m.put("required_rate_mm_h", CalcOutput.round(rate, 2));
      line = "required over-plant rate " + rate(rate, units)
          + " to hold iced buds at 0 °C with the air at " + CalcOutput.temp(airC, units);
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
    }
    if (json) {
      m.put("wind_2m_ms", CalcOutput.round(wind2mMs, 2));
      CalcOutput.printJson(spec, m);
      return;
    }
    CalcOutput.printLine(spec, line + " (dew point " + CalcOutput.temp(dewC, units) + ", wind "
        + Quantities.format(windMs, Dimension.SPEED, units, 1) + " at "
        + Quantities.format(heightM, Dimension.LENGTH, units, 0) + ", "
        + Quantities.format(wind2mMs, Dimension.SPEED, units, 1) + " at 2 m, cloud "
        + Math.round(cloudPct) + " %, water " + CalcOutput.temp(waterC, units) + ")");
  }

  private static String rate(double mmH, UnitSystem units) {
    return Quantities.format(mmH, Dimension.RATE, units, units == UnitSystem.US ? 3 : 1);
  }
}
