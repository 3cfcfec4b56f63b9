package org.rimeward.cli;

import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunReport;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "show", mixinStandardHelpOptions = true,
    versionProvider = RimewardCommand.Version.class,
    description = "Show one recorded run: the night, each block's status, risk and actions, the"
        + " rules that fired, the cautions, and the hash of every input.")
final class AuditShowCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Parameters(paramLabel = "RUN", description = "Run id, or its first characters if unique.")
  String run;

  @Option(names = "--json", description = "Print the recorded plan with the run's metadata and"
      + " input hashes as JSON.")
  boolean json;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      RunRecord rec = load(where, run);
      spec.commandLine().getOut().print(json ? RunReport.json(rec)
          : RunReport.text(rec, AuditCommand.units(spec)));
      return Main.OK;
    });
  }

  static RunRecord load(AuditCommand.Location where, String run) {
    try (AuditStore store = where.openForReading()) {
      return store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '" + run
          + "' in " + where.file() + "; list them with 'rimeward audit list'"));
    }
  }
}
