package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "profile",
    description = "Crop profiles: critical bud temperatures by stage, per crop and variety.",
    subcommands = {ProfileListCommand.class, ProfileShowCommand.class, ProfileCheckCommand.class,
        ProfileNewVarietyCommand.class, ProfileSetCommand.class},
    footer = {"", Cautions.HELP_FOOTER})
final class ProfileCommand implements Runnable {
  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(),
        "a subcommand is required: list, show, check, new-variety or set");
  }

  /** The {@code --crop-profiles DIR} option every profile command takes. */
  static final class Folder {
    @Option(names = "--crop-profiles", paramLabel = "DIR",
        description = "Folder of crop profile files (default: ./crop-profiles if present, else the"
            + " copy inside the jar, which can be read but not edited).")
    Path dir;

    Path resolve() {
      return dir != null ? dir : BundledData.folder("crop-profiles");
    }
  }

  /** Who makes an edit, and the observation behind it: both go into the file and the trail. */
  static final class Author {
    @Option(names = "--note", required = true,
        description = "Who observed what, and when; kept in the file.")
    String note;

    @Option(names = "--by", paramLabel = "NAME", description = "Who makes the change (default: login name).")
    String by = System.getProperty("user.name", "unknown");
  }

  /** The footer of the editing commands: where edits are recorded and what each exit code means. */
  static final String EDIT_FOOTER = "Each edit is recorded in the audit trail (<farm>/audit.db, or"
      + " --audit FILE) unless --no-audit is given. Exit codes: 0 written and recorded; 2 bad"
      + " input, nothing written; 1 internal error, or the audit trail could not be opened"
      + " (nothing written), or the edit was written but could not be recorded (the edit stays in"
      + " the profile file, and the message says so).";

  static UnitSystem units(CommandSpec spec) {
    return UnitsOption.of(spec);
  }

  static String temp(double c, UnitSystem units) {
    return Quantities.format(c, Dimension.TEMPERATURE, units, 1);
  }

  /** Splits {@code CROP} or {@code CROP/VARIETY}; the variety is null when not given. */
  static String[] cropAndVariety(String arg, String what) {
    String[] parts = arg.split("/", -1);
    if (parts.length > 2 || parts[0].isBlank() || parts.length == 2 && parts[1].isBlank()) {
      throw new BadInputException(what + ": '" + arg + "' is not CROP or CROP/VARIETY, for example"
          + " apple or apple/golden-delicious");
    }
    return new String[] {parts[0], parts.length == 2 ? parts[1] : null};
  }

  /**
   * Where profile edits are recorded: {@code --audit FILE}, else {@code <farm>/audit.db}; nothing
   * with {@code --no-audit}.
   */
  static final class AuditTarget {
    @Mixin AuditOptions options = new AuditOptions();

    Path file() {
      return options.file();
    }

    /**
     * Opens the trail before the profile is touched, so an unusable trail stops the edit; null
     * with {@code --no-audit}.
     */
    AuditStore open(CommandSpec spec) {
      if (!options.recording()) {
        return null;
      }
      try {
        return AuditStore.open(file());
      } catch (AuditUnavailableException e) {
        throw new AuditUnavailableException("the profile was not changed: " + e.getMessage(), e);
      }
    }
  }

  /**
   * Records the edits just written in the audit trail, in one transaction, and reports them.
   * When the trail cannot take them the edits stay in the profile file (it is already written
   * and correct); the error says so, and the exit code is 1.
   *
   * @param store null when the edit is not to be recorded ({@code --no-audit})
   * @return the command's exit code
   */
  static int recorded(List<ProfileEdit> edits, AuditTarget target, AuditStore store,
      CommandSpec spec) {
    PrintWriter out = spec.commandLine().getOut();
    if (store == null) {
      out.println("not recorded in the audit trail (--no-audit)");
      out.flush();
      return Main.OK;
    }
    try {
      store.appendProfileEdits(edits);
    } catch (AuditUnavailableException e) {
      out.flush();
      PrintWriter err = spec.commandLine().getErr();
      err.println("rimeward: the edit IS written to " + edits.get(0).file() + " but was NOT"
          + " recorded in the audit trail: " + e.getMessage() + " The profile keeps the new value;"
          + " note the change by hand, or undo it with 'rimeward profile set' once the trail works.");
      err.flush();
      return Main.INTERNAL_ERROR;
    }
    for (ProfileEdit e : edits) {
      out.printf(Locale.ROOT, "recorded in %s: %s %s by %s: %s%s %s (%s)%n", target.file(), e.at(),
          e.file(), e.by(), e.crop(), e.variety() == null ? "" : "/" + e.variety(),
          e.stage() == null ? e.field() : e.stage() + " " + e.field(), e.note());
    }
    out.flush();
    return Main.OK;
  }
}
