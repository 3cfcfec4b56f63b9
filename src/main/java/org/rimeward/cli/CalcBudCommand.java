package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Map;
import org.rimeward.physics.BudTemperature;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "bud",
    description = {"Temperature of a dry, unprotected flower bud under the night sky: how far it"
        + " radiates below the air (about 1-3 °C on a clear calm night, little in wind or overcast).",
        "Decision support: an estimate for a 5 mm bud; measure at bud height where you can."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcBudCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Option(names = "--temp", required = true, paramLabel = "T", description = "Air temperature: " + CalcOutput.TEMP_UNITS + ".")
  String temp;

  @Option(names = "--dew-point", required = true, paramLabel = "TD", description = "Dew point: " + CalcOutput.TEMP_UNITS + ".")
  String dewPoint;

  @Option(names = "--wind", required = true, paramLabel = "W",
      description = "Wind speed taken at 2 m height, with its unit: 2 m/s, 5 mph, 8 km/h or 4 kn.")
  String wind;

  @Option(names = "--cloud", required = true, paramLabel = "PCT", description = "Cloud cover, 0-100 %%, e.g. 20%% or 20.")
  String cloud;

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  @Override
  public void run() {
    UnitSystem units = CalcOutput.units(spec);
    double airC = CalcOutput.temperature(temp, "--temp", units);
    double dewC = CalcOutput.temperature(dewPoint, "--dew-point", units);
    double windMs = Quantities.parse(wind, Dimension.SPEED, "--wind");
    double cloudPct = Quantities.parse(cloud, Dimension.PERCENT, "--cloud", units);
    BudTemperature bud = BudTemperature.estimate(airC, dewC, windMs, cloudPct);
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("bud_temp_c", CalcOutput.round(bud.budTempC(), 2));
      m.put("depression_c", CalcOutput.round(bud.depressionC(), 2));
      CalcOutput.printJson(spec, m);
      return;
    }
    CalcOutput.printLine(spec, "bud about " + CalcOutput.temp(bud.budTempC(), units) + ", "
        + CalcOutput.delta(bud.depressionC(), units) + " below the air at "
        + CalcOutput.temp(airC, units) + " (wind " + Quantities.format(windMs, Dimension.SPEED, units, 1)
        + " at 2 m, cloud " + Math.round(cloudPct) + " %)");
  }
}
