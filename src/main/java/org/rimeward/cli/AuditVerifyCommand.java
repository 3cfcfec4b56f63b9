package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.security.PublicKey;
import java.util.List;
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

@Command(name = "verify",
    description = {"Check the whole hash chain of the audit trail and name the first record that"
        + " was changed, removed or added outside rimeward. Exit code "
        + AuditCommand.CHAIN_BROKEN + " when the chain is broken.",
        "A chain alone can be rebuilt by whoever can write the file; --head, and the seals in"
            + " <farm>/audit.db.seals, check it against heads held elsewhere."})
final class AuditVerifyCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Option(names = "--head", paramLabel = "SEQ:HASH",
      description = "A head printed earlier by 'audit head' (or found in an export): the trail must"
          + " still hold that record with that hash.")
  String head;

  @Option(names = "--public-key", paramLabel = "FILE",
      description = "Every seal must be signed by this key (the FILE.pub of 'audit seal --new-key').")
  Path publicKey;

  @Override
  public Integer call() throws Exception {
    ChainHead held;
    try {
      held = head == null ? ChainHead.EMPTY : ChainHead.parse(head);
    } catch (IllegalArgumentException e) {
      throw new BadInputException("--head: " + e.getMessage());
    }
    PublicKey expected = publicKey == null ? null : Seals.readPublicKey(publicKey);
    return AuditCommand.guarded(spec, () -> {
      VerifyResult v;
      List<Seals.Seal> seals = Seals.read(where.file());
      List<String> pending;
      String sealProblem = null;
      try (AuditStore store = where.openForReading()) {
        v = store.verify(held);
        pending = store.unsettledChanges();
        for (Seals.Seal s : seals) {
          if (sealProblem != null || !v.intact()) {
            break;
          }
          if (!Seals.valid(s)) {
            sealProblem = "seal on line " + s.line() + " of " + Seals.fileFor(where.file())
                + " has a signature that does not match its head " + s.head();
          } else if (expected != null && !expected.equals(s.key())) {
            sealProblem = "seal on line " + s.line() + " is signed by key " + s.keyFingerprint()
                + ", not by " + Seals.fingerprint(expected) + " given with --public-key";
          } else {
            VerifyResult h = store.verify(s.head());
            if (!h.intact()) {
              sealProblem = "seal on line " + s.line() + " (" + s.at() + "): "
                  + h.problem().orElseThrow();
            }
          }
        }
      }
      PrintWriter out = spec.commandLine().getOut();
      if (v.intact() && sealProblem == null) {
        out.println("chain intact: " + v.recordCount() + " records");
        if (head != null) {
          out.println("holds the head " + held + " given with --head");
        }
        if (!seals.isEmpty()) {
          Seals.Seal last = seals.get(seals.size() - 1);
          out.println(seals.size() + " seal(s) check out; newest " + last.head() + " sealed "
              + last.at() + " with key " + last.keyFingerprint());
        }
        out.println("head: " + new ChainHead(v.recordCount(), v.headHash())
            + " (keep it elsewhere; 'audit verify --head' checks it later)");
        for (String p : pending) {
          out.println("note: " + p);
        }
        return Main.OK;
      }
      out.println("chain broken: " + (v.intact() ? sealProblem : v.problem().orElseThrow()));
      out.println(v.recordCount() + " records before it check out. Keep a copy of "
          + where.file() + " as it is, for inspection.");
      return AuditCommand.CHAIN_BROKEN;
    });
  }
}
