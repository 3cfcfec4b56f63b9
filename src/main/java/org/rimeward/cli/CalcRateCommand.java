package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.SprinklerBalance;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "rate", mixinStandardHelpOptions = true, versionProvider = RimewardCommand.Version.class,
    description = {"Over-plant sprinkling: the application rate that keeps iced buds at 0 °C at an air"
        + " temperature (--temp), or the lowest air temperature a rate protects to (--rate).",
        "Energy balance calibrated to extension rules of thumb (MSU, WSU); clear sky assumed.",
        "Decision support: uniform coverage and clear ice matter as much as the rate."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcRateCommand implements Runnable {

  @Spec CommandSpec spec;

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
      description = "Wind speed taken at 2 m height, with its unit: 2 m/s, 5 mph, 8 km/h or 4 kn (up to 5 m/s).")
  String wind;

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
    double waterC = waterTemp == null ? org.rimeward.farm.Sprinklers.DEFAULT_WATER_TEMP_C : CalcOutput.temperature(waterTemp, "--water-temp", units);
    double pressureKPa = Atmosphere.stationPressureKPa(
        elevation == null ? 0 : Quantities.parse(elevation, Dimension.LENGTH, "--elevation"));
    Map<String, Object> m = new LinkedHashMap<>();
    String line;
    if (target.temp != null) {
      double airC = CalcOutput.temperature(target.temp, "--temp", units);
      double rate = SprinklerBalance.requiredRateMmH(airC, dewC, windMs, waterC, pressureKPa);
      m.put("required_rate_mm_h", CalcOutput.round(rate, 2));
      line = "required over-plant rate " + Quantities.format(rate, Dimension.RATE, units, units == UnitSystem.US ? 3 : 1)
          + " to hold iced buds at 0 °C with the air at " + CalcOutput.temp(airC, units);
    } else {
      double rate = Quantities.parse(target.rate, Dimension.RATE, "--rate");
      double toC = SprinklerBalance.protectsToC(rate, dewC, windMs, waterC, pressureKPa);
      m.put("protects_to_c", CalcOutput.round(toC, 2));
      line = Quantities.format(rate, Dimension.RATE, units, units == UnitSystem.US ? 3 : 1)
          + " protects iced buds down to an air temperature of about " + CalcOutput.temp(toC, units);
    }
    if (json) {
      CalcOutput.printJson(spec, m);
      return;
    }
    CalcOutput.printLine(spec, line + " (dew point " + CalcOutput.temp(dewC, units) + ", wind "
        + Quantities.format(windMs, Dimension.SPEED, units, 1) + " at 2 m, water "
        + CalcOutput.temp(waterC, units) + ")");
  }
}
