package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "profile", mixinStandardHelpOptions = true, versionProvider = RimewardCommand.Version.class,
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

  static UnitSystem units(CommandSpec spec) {
    Object root = spec.root().userObject();
    return root instanceof RimewardCommand r ? r.global.units() : UnitSystem.METRIC;
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
   * Reports the edits just written. This is where the audit trail records each edit once the
   * audit store exists (an {@code --audit FILE} option on the editing commands); until then the
   * edits are only printed.
   */
  static void recorded(List<ProfileEdit> edits, PrintWriter out) {
    for (ProfileEdit e : edits) {
      out.printf(Locale.ROOT, "recorded: %s %s by %s: %s%s %s (%s)%n", e.at(), e.file(), e.by(),
          e.crop(), e.variety() == null ? "" : "/" + e.variety(),
          e.stage() == null ? e.field() : e.stage() + " " + e.field(), e.note());
    }
  }
}
