package org.rimeward.cli;

import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.BlockWhy;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.CrewReport;
import org.rimeward.audit.RunRecord;
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
        "Without --night or --run: the latest run that planned the block.",
        "Also names the recorded profile edits that changed the values used. --json adds the"
            + " values each rule saw and the hash of every input."})
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
      List<org.rimeward.audit.RecordedEdit> edits;
      try (AuditStore store = where.openForReading()) {
        rec = find(store);
        done = store.listActions(rec.night(), Optional.of(block));
        edits = store.listRecordedEdits();
      }
      BlockWhy why = BlockWhy.of(rec, block);
      spec.commandLine().getOut().print(json
          ? CrewReport.withActions(why.json(), "done", done, java.time.ZoneId.of(rec.zoneId()))
          : why.text(AuditCommand.units(spec), why.editsThatShaped(edits)) + CrewReport.text(rec, done, Optional.of(block)));
      return Main.OK;
    });
  }

  private RunRecord find(AuditStore store) {
    if (which != null && which.run != null) {
      return store.loadRun(which.run).orElseThrow(() -> new BadInputException("--run: no run '"
          + which.run + "' in " + where.file() + "; list them with 'rimeward audit list'"));
    }
    if (which != null && which.night != null) {
      return store.latestRunFor(block, which.night).orElseThrow(() -> new BadInputException(
          "--night: no recorded run planned block '" + block + "' for the night of "
              + which.night + " in " + where.file() + "; list runs with 'rimeward audit list"
              + " --block " + block + "'"));
    }
    // The latest run, whatever its night: a plan re-run this evening for last night's readings
    // is still the newest answer the manager got.
    return store.latestRunFor(block).orElseThrow(() -> new BadInputException("BLOCK: no recorded"
        + " run planned block '" + block + "' in " + where.file() + "; check the block id, or"
        + " list runs with 'rimeward audit list'"));
  }
}
