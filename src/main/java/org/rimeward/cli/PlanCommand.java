package org.rimeward.cli;

import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.audit.RunRecorder;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.NightPlanner;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanCsv;
import org.rimeward.plan.PlanDocuments;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.PlanText;
import org.rimeward.report.NightPage;
import org.rimeward.units.UnitFormat;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "plan",
    description = {"The nightly decision run: for every block, whether tonight's freeze threatens"
        + " its buds, when to start and stop sprinkling, when covers go on and come off, and"
        + " whether the water sources carry it all, with the rules that led there."},
    footer = {"", "Every run is recorded in the audit trail (<farm>/audit.db, or --audit FILE)"
        + " unless --no-audit is given: the inputs whole, each block's decision, every rule that"
        + " fired. See 'rimeward audit'.",
        "", "Exit codes: 0 a plan was made and recorded (whatever it recommends); 2 bad input;"
        + " 3 with --exit-code-on-action when a block needs protection; 1 internal error, or the"
        + " plan was printed but could not be recorded in the audit trail (the reason is on"
        + " stderr; nothing of the run was kept there).",
        "", Cautions.HELP_FOOTER})
final class PlanCommand implements Callable<Integer> {
  /** A fetched forecast older than this is likely yesterday's: say so. */
  static final java.time.Duration STALE_FETCH = java.time.Duration.ofHours(12);

  enum Format { TEXT, JSON, CSV, HTML }

  @ParentCommand RimewardCommand root;
  @Spec CommandSpec spec;
  @Mixin DataFolders folders;
  @Mixin AuditOptions audit = new AuditOptions();
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Option(names = "--forecast", paramLabel = "FILE",
      description = "Forecast to use instead of the one the farm file names: Rimeward's CSV, or an"
          + " Open-Meteo, NWS gridpoint or MET Norway JSON response, recognised by content.")
  Path forecast;

  @Option(names = "--night", paramLabel = "YYYY-MM-DD",
      description = "Date of the evening to plan (default: from the forecast's first step).")
  LocalDate night;

  @Option(names = "--format", paramLabel = "text|json|csv|html", defaultValue = "text",
      description = "Output format (default: ${DEFAULT-VALUE}). JSON and CSV are always metric;"
          + " html is one self-contained page with a chart per block at risk.")
  Format format;

  @Option(names = "--output", paramLabel = "FILE",
      description = "Write the plan to this file (replaced whole, never half-written) instead of"
          + " the screen.")
  Path output;

  @Option(names = "--explain", description = "Add every rule that fired, with its numbers.")
  boolean explain;

  @Option(names = "--exit-code-on-action",
      description = "Exit 3 when any block needs protection, for a scheduled job that alerts.")
  boolean exitCodeOnAction;

  @Option(names = "--readings", paramLabel = "FILE", description = "The station's readings CSV:"
      + " re-plan the rest of the night from now, readings replacing the forecast up to now and"
      + " correcting it after (see the README).")
  Path readings;

  @Option(names = "--now", paramLabel = "TIME", description = "With --readings: the time to plan"
      + " from, e.g. 2026-04-15T00:30-07:00 or local 2026-04-15T00:30 (default: the clock).")
  String now;

  @Option(names = "--station", paramLabel = "ID", description = "With --readings: plan every block"
      + " by this station's readings, over farm.yaml's stations (default: each block's own station;"
      + " a farm without stations: the only one, or the one running coldest against the forecast).")
  String station;

  @Override
  public Integer call() {
    boolean recording = audit.recording();
    OutputFile.check(output);
    Instant ranAt = root.clock.instant();
    Path farm = audit.farm();
    PlanRequest request = new PlanRequest(farm, forecast, folders.cropProfiles, folders.rules,
        night);
    if (readings == null && (now != null || station != null)) {
      throw new BadInputException((now != null ? "--now" : "--station") + ": only means something"
          + " with --readings FILE; give the station's readings, or leave it out");
    }
    Plan plan = readings == null ? new NightPlanner().plan(request)
        : NightReplan.run(request, readings, now, station, ranAt, audit.file());
    var out = root.spec.commandLine().getOut();
    var units = UnitsOption.of(spec);
    String text = switch (format) {
      case JSON -> PlanJson.toText(plan);
      case CSV -> PlanCsv.render(plan);
      case HTML -> NightPage.html(NightPage.of(PlanDocuments.canonical(plan),
          UnitFormat.of(units), PlanText.explainer(plan, units), java.util.Map.of(), null));
      default -> PlanText.render(plan, units, explain);
    };
    OutputFile.write(out, output, text, "the plan");
    out.flush();
    warnIfStale(plan, ranAt);
    if (recording) {
      // --farm may name the farm file itself; the trail then sits beside it.
      try (AuditStore store = AuditStore.open(audit.file())) {
        store.appendRun(RunRecorder.toRecord(plan, ranAt));
        store.settlePendingChanges().forEach(l -> root.spec.commandLine().getErr()
            .println("rimeward: " + l));
      } catch (org.rimeward.audit.AuditIntegrityException e) {
        var err = root.spec.commandLine().getErr();
        err.println("rimeward: the plan above was NOT recorded in the audit trail: "
            + e.getMessage());
        err.flush();
        return 4;
      } catch (AuditUnavailableException e) {
        var err = root.spec.commandLine().getErr();
        err.println("rimeward: the plan above was NOT recorded in the audit trail: "
            + e.getMessage());
        err.flush();
        return Main.INTERNAL_ERROR;
      }
    }
    return exitCodeOnAction && plan.actionNeeded() ? Main.ACTION_NEEDED : Main.OK;
  }

  private void warnIfStale(Plan plan, Instant now) {
    var fetched = plan.inputs().forecast().fetched();
    if (fetched == null) {
      return;
    }
    long hours = java.time.Duration.between(fetched.fetchedAt(), now).toHours();
    if (hours >= STALE_FETCH.toHours()) {
      var err = root.spec.commandLine().getErr();
      err.println("rimeward: caution: this forecast was fetched " + hours + " h ago, for the night of "
          + plan.night().date() + "; fetch tonight's with 'rimeward forecast fetch' and plan again");
      err.flush();
    }
  }
}
