package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "air",
    description = {"Humidity of the air: dew point, frost point, relative humidity, vapour pressure,"
        + " wet-bulb and ice-bulb temperature (WMO ventilated-psychrometer equation).",
        "Decision support: the wet bulb is what sprinkler start and stop rules read."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcAirCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Option(names = "--temp", required = true, paramLabel = "T",
      description = "Air temperature: " + CalcOutput.TEMP_UNITS + ".")
  String temp;

  @ArgGroup(exclusive = true, multiplicity = "1")
  Humidity humidity;

  static final class Humidity {
    @Option(names = "--dew-point", paramLabel = "TD", description = "Dew point: " + CalcOutput.TEMP_UNITS + ".")
    String dewPoint;

    @Option(names = "--rh", paramLabel = "RH", description = "Relative humidity over water, e.g. 80%% or 80.")
    String rh;
  }

  @ArgGroup(exclusive = true, multiplicity = "0..1")
  Site site;

  static final class Site {
    @Option(names = "--elevation", paramLabel = "Z",
        description = "Elevation, e.g. 240 m or 800 ft (default 0 m); gives the pressure by FAO-56 Eq. 7.")
    String elevation;

    @Option(names = "--pressure", paramLabel = "P", description = "Station pressure, e.g. 98.5 kPa, 985 hPa or 29.1 inHg.")
    String pressure;
  }

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  private static double dewPointFromRh(double airC, double rhPct) {
    try {
      return Psychrometrics.dewPointFromRhC(airC, rhPct);
    } catch (org.rimeward.physics.OutOfRangeException e) {
      throw new org.rimeward.io.BadInputException("--rh: " + e.getMessage());
    }
  }

  @Override
  public void run() {
    UnitSystem units = CalcOutput.units(spec);
    double airC = CalcOutput.temperature(temp, "--temp", units);
    double dewC = humidity.dewPoint != null
        ? CalcOutput.temperature(humidity.dewPoint, "--dew-point", units)
        : dewPointFromRh(airC, Quantities.parse(humidity.rh, Dimension.PERCENT, "--rh", units));
    double pressureKPa = site == null ? Atmosphere.stationPressureKPa(0)
        : site.pressure != null ? Quantities.parse(site.pressure, Dimension.PRESSURE, "--pressure")
        : Atmosphere.stationPressureKPa(Quantities.parse(site.elevation, Dimension.LENGTH, "--elevation"));
    double wetC = Psychrometrics.wetBulbC(airC, dewC, pressureKPa);
    OptionalDouble iceC = Psychrometrics.iceBulbC(airC, dewC, pressureKPa);
    double frostC = Psychrometrics.frostPointFromDewPointC(dewC);
    double rhPct = Psychrometrics.rhPct(airC, dewC);
    double eKPa = Psychrometrics.vapourPressureFromDewPointKPa(dewC);
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("air_temp_c", CalcOutput.round(airC, 2));
      m.put("dew_point_c", CalcOutput.round(dewC, 2));
      m.put("frost_point_c", CalcOutput.round(frostC, 2));
      m.put("rh_pct", CalcOutput.round(rhPct, 1));
      m.put("vapour_pressure_kpa", CalcOutput.round(eKPa, 4));
      m.put("pressure_kpa", CalcOutput.round(pressureKPa, 2));
      m.put("wet_bulb_c", CalcOutput.round(wetC, 2));
      m.put("ice_bulb_c", iceC.isPresent() ? CalcOutput.round(iceC.getAsDouble(), 2) : null);
      CalcOutput.printJson(spec, m);
      return;
    }
    String ice = iceC.isPresent() ? "ice bulb " + CalcOutput.temp(iceC.getAsDouble(), units)
        : "no ice bulb (the bulb would not be below 0 °C)";
    CalcOutput.printLine(spec, String.format(Locale.ROOT,
        "air %s, dew point %s, frost point %s, RH %.0f %%, vapour pressure %.3f kPa at %.1f kPa:"
            + " wet bulb %s, %s",
        CalcOutput.temp(airC, units), CalcOutput.temp(dewC, units), CalcOutput.temp(frostC, units),
        rhPct, eKPa, pressureKPa, CalcOutput.temp(wetC, units), ice));
  }
}
