package org.rimeward.cli;

import java.nio.file.Path;
import org.rimeward.audit.AuditStore;
import picocli.CommandLine.Option;

/** {@code --audit FILE}: the audit trail to use instead of the farm's {@code audit.db}. */
final class AuditFileOption {
  @Option(names = "--audit", paramLabel = "FILE",
      description = "Audit database to use instead of <farm>/audit.db.")
  Path audit;

  /** {@code --audit FILE}, else the {@code audit.db} of {@code farm} (a folder or its farm.yaml). */
  Path file(Path farm) {
    return audit != null ? audit : AuditStore.fileFor(farm);
  }

  boolean given() {
    return audit != null;
  }
}
