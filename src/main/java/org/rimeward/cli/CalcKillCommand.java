package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.rimeward.physics.KillCurve;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "kill",
    description = {"Expected bud kill at a bud temperature, from the stage's 10 %% and 90 %% kill"
        + " temperatures (30-minute exposure, as in the WSU/MSU critical-temperature tables).",
        "Decision support: the curve between the two published points is an interpolation."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcKillCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Option(names = "--t10", required = true, paramLabel = "T", description = "10 %% kill temperature: " + CalcOutput.TEMP_UNITS + ".")
  String t10;

  @Option(names = "--t90", required = true, paramLabel = "T",
      description = "90 %% kill temperature, colder than --t10: " + CalcOutput.TEMP_UNITS + ".")
  String t90;

  @Option(names = "--temp", required = true, paramLabel = "T", description = "Bud temperature: " + CalcOutput.TEMP_UNITS + ".")
  String temp;

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  @Override
  public void run() {
    UnitSystem units = CalcOutput.units(spec);
    KillCurve curve = new KillCurve(CalcOutput.temperature(t10, "--t10", units),
        CalcOutput.temperature(t90, "--t90", units));
    double tempC = CalcOutput.temperature(temp, "--temp", units);
    double pct = curve.killPct(tempC);
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("kill_pct", CalcOutput.round(pct, 1));
      CalcOutput.printJson(spec, m);
      return;
    }
    CalcOutput.printLine(spec, String.format(Locale.ROOT,
        "about %.0f %% of buds killed at %s (10 %% at %s, 90 %% at %s, 30-minute exposure)", pct,
        CalcOutput.temp(tempC, units), CalcOutput.temp(curve.t10C(), units), CalcOutput.temp(curve.t90C(), units)));
  }
}
