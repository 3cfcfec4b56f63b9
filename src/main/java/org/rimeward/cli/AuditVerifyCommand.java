package org.rimeward.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.VerifyResult;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "verify",
    description = "Check the whole hash chain of the audit trail and name the first record that"
        + " was changed, removed or added outside rimeward. Exit code "
        + AuditCommand.CHAIN_BROKEN + " when the chain is broken.")
final class AuditVerifyCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      VerifyResult v;
      try (AuditStore store = where.openForReading()) {
        v = store.verify();
      }
      PrintWriter out = spec.commandLine().getOut();
      if (v.intact()) {
        out.println("chain intact: " + v.recordCount() + " records");
        out.println("head hash: " + v.headHash()
            + " (keep it elsewhere to detect later removal of the newest runs)");
        return Main.OK;
      }
      out.println("chain broken: " + v.problem().orElseThrow());
      out.println(v.recordCount() + " records before it check out. Keep a copy of "
          + where.file() + " as it is, for inspection.");
      return AuditCommand.CHAIN_BROKEN;
    });
  }
}
