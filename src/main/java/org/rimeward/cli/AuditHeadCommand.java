package org.rimeward.cli;

import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.ChainHead;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "head",
    description = {"Print the newest record of the trail as SEQ:HASH, and nothing else.",
        "Send it somewhere the farm cannot rewrite (a mail each night, an insurer's file); later,"
            + " 'rimeward audit verify --head SEQ:HASH' proves the history up to it is unchanged."})
final class AuditHeadCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      ChainHead head;
      try (AuditStore store = where.openForReading()) {
        head = store.head();
      }
      spec.commandLine().getOut().println(head);
      return Main.OK;
    });
  }
}
