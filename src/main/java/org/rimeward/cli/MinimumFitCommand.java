package org.rimeward.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.minimum.NightSample;
import org.rimeward.minimum.RadiationNights;
import org.rimeward.minimum.SiteMinimumFile;
import org.rimeward.minimum.SiteMinimumFit;
import org.rimeward.minimum.SiteMinimumModel;
import org.rimeward.plan.RadiationNightCriteria;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.RuleThresholds;
import org.rimeward.units.UnitSystem;
import org.rimeward.weather.Reading;
import org.rimeward.weather.Readings;
import org.rimeward.weather.ReadingsReader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "fit",
    description = {"Fits Tmin = a·T0 + b·Td0 + c by least squares to the radiation nights of a"
        + " station history (the readings format, any length), and writes"
        + " <farm>/site-minimum.yaml with the history's hash and dates.",
        "T0 and Td0 are interpolated two hours after the farm's own sunset; the minimum is the"
        + " lowest air temperature from then to sunrise. Windy, cloudy and incomplete nights are"
        + " left out, by the criteria printed with the result."},
    footer = {"", "Exit codes: 0 fitted and written; 2 bad input, or too few radiation nights (the"
        + " reason is printed, nothing is written).", "", Cautions.HELP_FOOTER})
final class MinimumFitCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Mixin FarmOption farmOption = new FarmOption();

  @Option(names = "--history", paramLabel = "FILE", required = true,
      description = "Station history CSV in the readings format (time, air_temp_c, dew_point_c, ...).")
  Path history;

  @Option(names = "--station", paramLabel = "ID",
      description = "The station to fit when the history holds several (its station column).")
  String station;

  @Option(names = "--min-nights", paramLabel = "N", defaultValue = "" + SiteMinimumFit.MIN_NIGHTS,
      description = "Fewest radiation nights to accept (default: ${DEFAULT-VALUE}; at least 5).")
  int minNights;

  @Option(names = "--rules", paramLabel = "DIR",
      description = "Folder of .drl rule files whose radiation-night criteria (rule THRESHOLDS)"
          + " pick the nights (default: the farm's own: farm.yaml's rules:, else <farm>/rules if"
          + " present, else the bundled rules; as the plan reads them).")
  Path rules;

  @Option(names = "--json", description = "Print one JSON object (always metric).")
  boolean json;

  @Override
  public void run() {
    if (minNights < 5) {
      throw new BadInputException("--min-nights: " + minNights + " is too few to fit three"
          + " coefficients and judge the fit; give 5 or more");
    }
    Farm f = FarmLoader.load(farmOption.farm());
    Readings all = ReadingsReader.read(history, f.zone());
    List<String> stations = all.stations();
    String id = station != null ? station : stations.size() == 1 ? stations.get(0) : null;
    if (id == null) {
      throw new BadInputException(history + ": holds readings of " + stations.size()
          + " stations (" + String.join(", ", stations) + "); choose one with --station");
    }
    if (!stations.contains(id)) {
      throw new BadInputException("--station: '" + id + "' has no readings in " + history
          + "; stations there: " + String.join(", ", stations));
    }
    List<Reading> readings = all.of(id);
    // The criteria the re-plan judges tonight by: the same rule files, the same numbers.
    Path ruleDir = rules != null ? rules : f.ownRules().orElseGet(() -> BundledData.bundled("rules"));
    RadiationNights.Criteria criteria = RadiationNightCriteria.of(RuleThresholds.of(RuleBook.load(ruleDir)));
    List<NightSample> nights = RadiationNights.nights(readings, f.latitude(), f.longitude(), f.zone(),
        criteria);
    String name = history.getFileName().toString();
    SiteMinimumFit.Result r = SiteMinimumFit.fit(nights, minNights, name);
    List<NightSample> used = nights.stream().filter(NightSample::used).toList();
    SiteMinimumModel model = new SiteMinimumModel(r.a(), r.b(), r.c(), r.nights(), r.residualSdC(),
        r.rSquared(), r.xtxInv(), used.get(0).date(), used.get(used.size() - 1).date(),
        SiteMinimumFile.sha256Hex(ReadingsReader.bytes(history)), name, id, criteria.describe(),
        r.rangeT0C(), r.rangeTd0C());
    Path out = SiteMinimumFile.in(f.folder());
    try {
      SiteMinimumFile.write(out, model);
    } catch (IOException e) {
      throw new BadInputException(out + ": could not write the model (" + e.getMessage()
          + "); check that the farm folder is writable", e);
    }
    Map<String, Integer> excluded = new TreeMap<>();
    for (NightSample s : nights) {
      s.excluded().ifPresent(why -> excluded.merge(why.replaceAll(":.*", ""), 1, Integer::sum));
    }
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("a", model.a());
      m.put("b", model.b());
      m.put("c", model.c());
      m.put("nights", model.nights());
      m.put("nights_in_history", nights.size());
      m.put("nights_excluded", excluded);
      m.put("residual_sd_c", CalcOutput.round(model.residualSdC(), 3));
      m.put("r_squared", CalcOutput.round(model.rSquared(), 4));
      m.put("from", model.from().toString());
      m.put("to", model.to().toString());
      m.put("history_sha256", model.historySha256());
      m.put("rows_skipped", all.skipped().size());
      m.put("criteria", criteria.describe());
      m.put("file", out.getFileName().toString());
      CalcOutput.printJson(spec, m);
      return;
    }
    UnitSystem units = CalcOutput.units(spec);
    var w = spec.commandLine().getOut();
    w.printf(Locale.ROOT, "Site minimum (FAO 2005 ch. 6): Tmin = %.3f·T0 %s %.3f·Td0 %s %.2f °C%n",
        model.a(), model.b() < 0 ? "−" : "+", Math.abs(model.b()), model.c() < 0 ? "−" : "+",
        Math.abs(model.c()));
    w.printf(Locale.ROOT, "  %d radiation nights of %d (%s to %s), residual SD %s, R² %.3f%n",
        model.nights(), nights.size(), model.from(), model.to(),
        CalcOutput.delta(model.residualSdC(), units), model.rSquared());
    excluded.forEach((why, n) -> w.printf(Locale.ROOT, "  left out: %d %s%n", n, why));
    if (!all.skipped().isEmpty()) {
      w.printf(Locale.ROOT, "  %d unusable row(s) skipped, first: %s%n", all.skipped().size(),
          all.skipped().get(0).message());
    }
    w.println("  criteria: " + criteria.describe());
    w.println("  written to " + out.getFileName() + " (history sha256 "
        + model.historySha256().substring(0, 12) + ")");
    w.println("  Valid on clear calm nights only. Decision support: thermometers at bud height decide.");
    w.flush();
  }
}
