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
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.PlanText;
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
  enum Format { TEXT, JSON, CSV }

  @ParentCommand RimewardCommand root;
  @Spec CommandSpec spec;
  @Mixin DataFolders folders;
  @Mixin AuditOptions audit = new AuditOptions();
  @Mixin UnitsOption unitsOption = new UnitsOption();

  @Option(names = "--forecast", paramLabel = "FILE",
      description = "Forecast CSV to use instead of the one the farm file names.")
  Path forecast;

  @Option(names = "--night", paramLabel = "YYYY-MM-DD",
      description = "Date of the evening to plan (default: from the forecast's first step).")
  LocalDate night;

  @Option(names = "--format", paramLabel = "text|json|csv", defaultValue = "text",
      description = "Output format (default: ${DEFAULT-VALUE}). JSON and CSV are always metric.")
  Format format;

  @Option(names = "--explain", description = "Add every rule that fired, with its numbers.")
  boolean explain;

  @Option(names = "--exit-code-on-action",
      description = "Exit 3 when any block needs protection, for a scheduled job that alerts.")
  boolean exitCodeOnAction;


  @Override
  public Integer call() {
    boolean recording = audit.recording();
    Instant ranAt = root.clock.instant();
    Plan plan = new NightPlanner().plan(new PlanRequest(audit.farm(), forecast,
        folders.cropProfiles(), folders.rules(), night));
    var out = root.spec.commandLine().getOut();
    switch (format) {
      case JSON -> out.print(PlanJson.toText(plan));
      case CSV -> out.print(PlanCsv.render(plan));
      default -> out.print(PlanText.render(plan, UnitsOption.of(spec), explain));
    }
    out.flush();
    if (recording) {
      // --farm may name the farm file itself; the trail then sits beside it.
      try (AuditStore store = AuditStore.open(audit.file())) {
        store.appendRun(RunRecorder.toRecord(plan, ranAt));
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
}
