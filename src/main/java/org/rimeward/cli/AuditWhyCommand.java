package org.rimeward.cli;

import java.time.LocalDate;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.BlockWhy;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.CrewReport;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunSummary;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "why",
    description = {"Why protection started, or did not, on one block one night: the rules that"
        + " fired for it in firing order with the numbers each saw, the farm-wide rules about its"
        + " water source, the forecast lines and crop-profile values those numbers came from, and"
        + " the hash of every input.",
        "Without --night or --run: the newest night recorded for the block, and its latest run."})
final class AuditWhyCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Parameters(paramLabel = "BLOCK", description = "Block id, as in farm.yaml.")
  String block;

  @ArgGroup(exclusive = true)
  Which which;

  static final class Which {
    @Option(names = "--night", paramLabel = "YYYY-MM-DD",
        description = "The night: its latest run that planned the block.")
    LocalDate night;

    @Option(names = "--run", paramLabel = "RUN", description = "Run id, or its first characters.")
    String run;
  }

  @Option(names = "--json", description = "Print JSON: run, night, block, status, risk, rules"
      + " (seq, id, kind, explanation, values) inputs, and what the crew recorded as done (done).")
  boolean json;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      RunRecord rec;
      List<CrewAction> done;
      try (AuditStore store = where.openForReading()) {
        rec = find(store);
        done = store.listActions(rec.night(), Optional.of(block));
      }
      BlockWhy why = BlockWhy.of(rec, block);
      spec.commandLine().getOut().print(json
          ? CrewReport.withActions(why.json(), "done", done, java.time.ZoneId.of(rec.zoneId()))
          : why.text(AuditCommand.units(spec)) + CrewReport.text(rec, done, Optional.of(block)));
      return Main.OK;
    });
  }

  private RunRecord find(AuditStore store) {
    if (which != null && which.run != null) {
      return store.loadRun(which.run).orElseThrow(() -> new BadInputException("--run: no run '"
          + which.run + "' in " + where.file() + "; list them with 'rimeward audit list'"));
    }
    LocalDate night = which != null ? which.night : store.listRuns(Optional.empty(),
        Optional.of(block)).stream().map(RunSummary::night).max(Comparator.naturalOrder())
        .orElseThrow(() -> new BadInputException("BLOCK: no recorded run planned block '" + block
            + "' in " + where.file() + "; check the block id, or list runs with 'rimeward audit"
            + " list'"));
    return store.latestRunFor(block, night).orElseThrow(() -> new BadInputException("--night: no"
        + " recorded run planned block '" + block + "' for the night of " + night + " in "
        + where.file() + "; list runs with 'rimeward audit list --block " + block + "'"));
  }
}
