package org.rimeward.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.ChainHead;
import org.rimeward.audit.Seals;
import org.rimeward.audit.VerifyResult;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "seal",
    description = {"Sign the trail's current head with an Ed25519 key kept outside the farm folder,"
        + " and add the seal to <farm>/audit.db.seals. 'audit verify' checks every seal it finds.",
        "Make a key once with --new-key FILE (FILE.pub is its public half, to hand to whoever"
            + " checks the seals)."})
final class AuditSealCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Option(names = "--key", paramLabel = "FILE",
      description = "The private key to sign with, outside the farm folder.")
  Path key;

  @Option(names = "--new-key", paramLabel = "FILE",
      description = "Make a new key pair at FILE and FILE.pub (never overwrites), then seal.")
  Path newKey;

  @Override
  public Integer call() throws Exception {
    if ((key == null) == (newKey == null)) {
      throw new BadInputException("give --key FILE (an existing key) or --new-key FILE (make one)");
    }
    return AuditCommand.guarded(spec, () -> {
      ChainHead head;
      VerifyResult v;
      try (AuditStore store = where.openForReading()) {
        v = store.verify();
        head = store.head();
      }
      if (!v.intact()) {
        spec.commandLine().getErr().println("rimeward: not sealed: the chain is broken: "
            + v.problem().orElseThrow());
        return AuditCommand.CHAIN_BROKEN;
      }
      Path k = key;
      if (newKey != null) {
        Seals.newKey(newKey);
        spec.commandLine().getOut().println("new key: " + newKey + " (keep it private), public"
            + " half " + Seals.publicKeyFile(newKey));
        k = newKey;
      }
      Seals.Seal seal = Seals.seal(where.file(), head, k,
          RimewardCommand.clock(spec).instant());
      spec.commandLine().getOut().println("sealed " + head + " with key " + seal.keyFingerprint()
          + " in " + Seals.fileFor(where.file()));
      return Main.OK;
    });
  }
}
