package org.rimeward.cli;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.rimeward.farm.FarmLoader;
import org.rimeward.minimum.SiteMinimumFile;
import org.rimeward.minimum.SiteMinimumModel;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "predict",
    description = {"Tonight's minimum from the site model (<farm>/site-minimum.yaml), given the air"
        + " temperature and dew point two hours after sunset, with a 95 %% prediction interval.",
        "Valid on clear calm nights only."},
    footer = {"", Cautions.HELP_FOOTER})
final class MinimumPredictCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Mixin FarmOption farmOption = new FarmOption();

  @Option(names = "--temp", required = true, paramLabel = "T0",
      description = "Air temperature two hours after sunset: " + CalcOutput.TEMP_UNITS + ".")
  String temp;

  @Option(names = "--dew-point", required = true, paramLabel = "TD0",
      description = "Dew point two hours after sunset: " + CalcOutput.TEMP_UNITS + ".")
  String dewPoint;

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  @Override
  public void run() {
    UnitSystem units = CalcOutput.units(spec);
    double t0 = CalcOutput.temperature(temp, "--temp", units);
    double td0 = CalcOutput.temperature(dewPoint, "--dew-point", units);
    if (td0 > t0 + 1e-9) {
      throw new org.rimeward.io.BadInputException("--dew-point: " + dewPoint + " is above --temp "
          + temp + "; the dew point cannot exceed the air temperature");
    }
    SiteMinimumModel m = SiteMinimumFile.read(SiteMinimumFile.in(
        FarmLoader.load(farmOption.farm()).folder()));
    double min = m.minAirC(t0, td0);
    double half = m.halfWidthC(t0, td0);
    boolean inside = m.withinFit(t0, td0);
    if (json) {
      Map<String, Object> j = new LinkedHashMap<>();
      j.put("min_air_c", CalcOutput.round(min, 2));
      j.put("interval_low_c", CalcOutput.round(min - half, 2));
      j.put("interval_high_c", CalcOutput.round(min + half, 2));
      j.put("interval_level", SiteMinimumModel.INTERVAL_LEVEL);
      j.put("within_fit_range", inside);
      j.put("nights", m.nights());
      j.put("residual_sd_c", CalcOutput.round(m.residualSdC(), 3));
      j.put("history_sha256", m.historySha256());
      CalcOutput.printJson(spec, j);
      return;
    }
    var w = spec.commandLine().getOut();
    w.printf(Locale.ROOT, "site minimum %s (95 %% interval %s to %s) for T0 %s, Td0 %s at sunset + 2 h;"
        + " from %d radiation nights, %s to %s%n", CalcOutput.temp(min, units),
        CalcOutput.temp(min - half, units), CalcOutput.temp(min + half, units),
        CalcOutput.temp(t0, units), CalcOutput.temp(td0, units), m.nights(), m.from(), m.to());
    if (!inside) {
      w.println("  caution: T0 or Td0 lies outside the range the model was fitted on; trust it less.");
    }
    w.println("  Valid on clear calm nights only. Decision support: thermometers at bud height decide.");
    w.flush();
  }
}
