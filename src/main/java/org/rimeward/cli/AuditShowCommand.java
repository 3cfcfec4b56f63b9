package org.rimeward.cli;

import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.CrewReport;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunReport;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "show",
    description = "Show one recorded run: the night, each block's status, risk and actions, the"
        + " rules that fired, the cautions, and the hash of every input.")
final class AuditShowCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Parameters(paramLabel = "RUN", description = "Run id, or its first characters if unique.")
  String run;

  @Option(names = "--json", description = "Print the recorded plan with the run's metadata and"
      + " input hashes, and the crew's recorded actions of the night (crew_actions), as JSON.")
  boolean json;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      Loaded l = loadWithActions(where, run);
      spec.commandLine().getOut().print(json
          ? CrewReport.withActions(RunReport.json(l.run()), "crew_actions", l.actions(),
              java.time.ZoneId.of(l.run().zoneId()))
          : RunReport.text(l.run(), AuditCommand.units(spec))
              + CrewReport.text(l.run(), l.actions(), java.util.Optional.empty()));
      return Main.OK;
    });
  }

  /** A run and the crew's actions of its night. */
  record Loaded(RunRecord run, java.util.List<CrewAction> actions) {}

  static Loaded loadWithActions(AuditCommand.Location where, String run) {
    try (AuditStore store = where.openForReading()) {
      RunRecord rec = store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '"
          + run + "' in " + where.file() + "; list them with 'rimeward audit list'"));
      return new Loaded(rec, store.listActions(rec.night(), java.util.Optional.empty()));
    }
  }

  static RunRecord load(AuditCommand.Location where, String run) {
    try (AuditStore store = where.openForReading()) {
      return store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '" + run
          + "' in " + where.file() + "; list them with 'rimeward audit list'"));
    }
  }
}
