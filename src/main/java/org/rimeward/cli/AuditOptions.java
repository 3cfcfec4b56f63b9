package org.rimeward.cli;

import java.nio.file.Path;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code --farm}, {@code --audit FILE} and {@code --no-audit}, declared once for every command
 * that records in the audit trail: the trail is {@code <farm>/audit.db} unless {@code --audit}
 * names another file; {@code --no-audit} records nothing.
 */
final class AuditOptions {
  @Mixin FarmOption farmOption = new FarmOption();
  @Mixin AuditFileOption auditFile = new AuditFileOption();

  @Option(names = "--no-audit", description = "Record nothing in the audit trail.")
  boolean noAudit;

  Path farm() {
    return farmOption.farm();
  }

  /** Whether to record; refuses {@code --audit} together with {@code --no-audit}. */
  boolean recording() {
    return recording(noAudit, auditFile);
  }

  /** Whether to record, refusing {@code --no-audit} beside an {@code --audit FILE} it would ignore. */
  static boolean recording(boolean noAudit, AuditFileOption auditFile) {
    if (noAudit && auditFile.given()) {
      throw new BadInputException("--audit and --no-audit: give one or the other; --no-audit"
          + " records nothing, so it has no file to record in");
    }
    return !noAudit;
  }

  /** The trail's file: {@code --audit FILE}, else the farm's {@code audit.db}. */
  Path file() {
    return auditFile.file(farm());
  }
}
