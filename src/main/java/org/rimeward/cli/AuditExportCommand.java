package org.rimeward.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunReport;
import org.rimeward.io.AtomicFiles;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "export",
    description = "Export one recorded run for an insurer or a report: JSON (as 'show --json') or"
        + " CSV with one row per block action, with what the crew recorded beside it (done_start,"
        + " done_stop). Both carry the trail's head when exported (chain_head, SEQ:HASH), for"
        + " 'audit verify --head' later.")
final class AuditExportCommand implements Callable<Integer> {
  enum Format { json, csv }

  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Parameters(paramLabel = "RUN", description = "Run id, or its first characters if unique.")
  String run;

  @Option(names = "--format", paramLabel = "json|csv", defaultValue = "json",
      description = "Output format (default: ${DEFAULT-VALUE}).")
  Format format;

  @Option(names = "--output", paramLabel = "FILE",
      description = "Write to this file (replaced whole, never half-written) instead of the screen.")
  Path output;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      AuditShowCommand.Loaded l = AuditShowCommand.loadWithActions(where, run);
      RunRecord rec = l.run();
      String text = format == Format.csv ? RunReport.csv(rec, l.actions(), l.head())
          : AuditShowCommand.json(l);
      if (output == null) {
        spec.commandLine().getOut().print(text);
        return Main.OK;
      }
      Path folder = output.toAbsolutePath().getParent();
      if (Files.isDirectory(output) || folder == null || !Files.isDirectory(folder)) {
        throw new BadInputException("--output: " + output + (Files.isDirectory(output)
            ? " is a folder; name a file" : ": folder " + folder + " does not exist; create it first"));
      }
      AtomicFiles.writeString(output, text);
      spec.commandLine().getOut().println("exported run " + rec.runId() + " as " + format + " to "
          + output);
      return Main.OK;
    });
  }
}
