package org.rimeward.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditIntegrityException;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "audit",
    description = "Look into the audit trail: every nightly plan and crop-profile edit, recorded"
        + " append-only and hash-chained in <farm>/audit.db.",
    subcommands = {AuditListCommand.class, AuditShowCommand.class, AuditExportCommand.class,
        AuditVerifyCommand.class, AuditWhyCommand.class, AuditReplayCommand.class,
        AuditHeadCommand.class, AuditSealCommand.class, AuditEditsCommand.class,
        AuditSeasonCommand.class},
    footer = {"", "Exit codes: 0 done, 1 internal error or audit database unavailable,"
        + " 2 bad input, " + AuditCommand.CHAIN_BROKEN + " audit chain broken (a recorded row was"
        + " changed, removed or added outside rimeward).", "", Cautions.HELP_FOOTER})
final class AuditCommand implements Runnable {
  /** A recorded row no longer matches its hash: the trail was altered or damaged. */
  static final int CHAIN_BROKEN = 4;

  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(),
        "a subcommand is required: list, show, why, replay, export or verify");
  }

  /** Where the trail is: {@code --audit FILE}, else {@code <farm>/audit.db}. */
  static final class Location {
    @Mixin FarmOption farmOption = new FarmOption();
    @Mixin AuditFileOption auditFile = new AuditFileOption();

    Path file() {
      return auditFile.file(farmOption.farm());
    }

    /** The farm folder, or its farm file, as given. */
    Path farm() {
      return farmOption.farm();
    }

    /** Opens the existing trail for reading; a missing file is the user's to fix. */
    AuditStore openForReading() {
      Path f = file();
      if (!Files.isRegularFile(f)) {
        throw new BadInputException((auditFile.given() ? "--audit" : "--farm") + ": no audit database"
            + " at " + f + "; runs are recorded there by 'rimeward plan'. Check the folder, or"
            + " name the file with --audit.");
      }
      return AuditStore.openReadOnly(f);
    }
  }

  /** The display units chosen with the inherited {@code --units} option. */
  static org.rimeward.units.UnitSystem units(CommandSpec spec) {
    return UnitsOption.of(spec);
  }

  /**
   * Runs a subcommand body, turning an unavailable or altered trail into one clear line and its
   * exit code instead of an internal error.
   */
  static int guarded(CommandSpec spec, Callable<Integer> body) throws Exception {
    try {
      return body.call();
    } catch (AuditUnavailableException e) {
      spec.commandLine().getErr().println("rimeward: " + e.getMessage());
      return Main.INTERNAL_ERROR;
    } catch (AuditIntegrityException e) {
      spec.commandLine().getErr().println("rimeward: " + e.getMessage());
      return CHAIN_BROKEN;
    }
  }
}
