package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.audit.TrailEditJournal;
import org.rimeward.crop.EditJournal;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.units.UnitFormat;
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

  /**
   * Which profiles a profile command acts on: {@code --crop-profiles DIR}, else the farm's own
   * ({@code <farm>/crop-profiles}), else the copy bundled in the jar, which can be read but not
   * edited. The working folder is never consulted.
   */
  static final class Folder {
    @Option(names = "--crop-profiles", paramLabel = "DIR",
        description = "Folder of crop profile files (default: <farm>/crop-profiles if present,"
            + " else the copy inside the jar; the first edit copies that into"
            + " <farm>/crop-profiles).")
    Path dir;

    @Option(names = "--farm", paramLabel = "DIR", defaultValue = ".",
        description = "Farm folder whose crop-profiles and audit.db are used (default: the"
            + " current folder).")
    Path farm;

    /** The farm folder: the one given, or the folder of the farm file given. */
    Path farmDir() {
      return Files.isRegularFile(farm) ? farm.toAbsolutePath().getParent() : farm;
    }

    Path resolve() {
      if (dir != null) {
        return dir;
      }
      Path own = farmDir().resolve("crop-profiles");
      return Files.isDirectory(own) ? own : BundledData.bundled("crop-profiles");
    }

    /** Where the profiles listed come from, for a header line. */
    String describe(Path resolved) {
      return dir == null && !Files.isDirectory(farmDir().resolve("crop-profiles"))
          ? "the copy bundled with rimeward (the farm "
          + farmDir() + " has no crop-profiles folder)" : resolved.toString();
    }

    /**
     * The folder an edit writes to. A farm without profiles of its own gets a copy of the bundled
     * ones first, in {@code <farm>/crop-profiles}, which the plan then reads; the copy is said.
     */
    Path resolveForEdit(PrintWriter out) {
      Path p = resolve();
      if (dir != null || Files.isDirectory(farmDir().resolve("crop-profiles"))) {
        return p;
      }
      Path farmDir = farmDir();
      if (!Files.isRegularFile(farmDir.resolve("farm.yaml"))) {
        throw new BadInputException("--farm: " + farmDir.toAbsolutePath() + " has no farm.yaml;"
            + " run this in the farm folder, give --farm DIR, or name the profiles to edit with"
            + " --crop-profiles DIR");
      }
      Path target = farmDir.resolve("crop-profiles");
      Path tmp = farmDir.resolve(".crop-profiles.copying");
      try {
        if (Files.exists(tmp)) {
          try (var s = Files.walk(tmp)) {
            for (Path q : s.sorted(java.util.Comparator.reverseOrder()).toList()) {
              Files.delete(q);
            }
          }
        }
        Files.createDirectory(tmp);
        try (var s = Files.list(p)) {
          for (Path q : s.filter(q -> q.getFileName().toString().endsWith(".yaml")).toList()) {
            Files.copy(q, tmp.resolve(q.getFileName().toString()));
          }
        }
        // Whole or not at all: a half-copied folder would be read by tonight's plan.
        Files.move(tmp, target, java.nio.file.StandardCopyOption.ATOMIC_MOVE);
      } catch (java.nio.file.FileAlreadyExistsException e) {
        return target;
      } catch (java.io.IOException e) {
        throw new BadInputException(target + ": cannot copy the bundled crop profiles there ("
            + e.getMessage() + "); check that the farm folder can be written", e);
      }
      out.println("The farm had no crop profiles of its own: copied the bundled ones into "
          + target + ". Edits go there, and the plan reads them from there.");
      return target;
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
      + " --audit FILE) before the file changes, unless --no-audit is given; an edit of the same"
      + " file by another program waits for this one. Exit codes: 0 written and recorded; 2 bad"
      + " input, nothing written; 1 internal error, or the audit trail could not be written"
      + " (nothing written), or the edit was written and recorded as pending but not confirmed"
      + " (the next command confirms it).";

  static UnitSystem units(CommandSpec spec) {
    return UnitsOption.of(spec);
  }

  static String temp(double c, UnitSystem units) {
    return UnitFormat.of(units).temp(c);
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
    /**
     * The farm folder, from the command's {@link Folder} (which owns {@code --farm} for the profile
     * commands); set before use.
     */
    Path farm = Path.of(".");

    @Mixin AuditFileOption auditFile = new AuditFileOption();

    @Option(names = "--no-audit", description = "Record nothing in the audit trail.")
    boolean noAudit;

    Path file() {
      return auditFile.file(farm);
    }

    /**
     * Opens the trail before the profile is touched, so an unusable trail stops the edit; null
     * with {@code --no-audit}.
     */
    AuditStore open(CommandSpec spec) {
      if (!AuditOptions.recording(noAudit, auditFile)) {
        return null;
      }
      try {
        return AuditStore.open(file());
      } catch (AuditUnavailableException e) {
        throw new AuditUnavailableException("the profile was not changed: " + e.getMessage(), e);
      } catch (org.rimeward.audit.AuditIntegrityException e) {
        throw new AuditUnavailableException("the profile was not changed: " + e.getMessage()
            + "; run 'rimeward audit verify'", null);
      }
    }
  }

  /**
   * Runs one edit with the trail around it: unfinished edits an earlier, killed command left are
   * settled first; then the edit is recorded as pending before its file changes and confirmed
   * after. An unusable trail stops the edit before the file is touched.
   *
   * @param edit makes the edit, reporting to the journal it is given, and prints what it did
   * @return the command's exit code
   */
  static int runEdit(CommandSpec spec, AuditTarget target,
      java.util.function.Function<EditJournal, List<ProfileEdit>> edit) {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    try (AuditStore store = target.open(spec)) {
      if (store == null) {
        edit.apply(EditJournal.NONE);
        out.println("not recorded in the audit trail (--no-audit)");
        out.flush();
        return Main.OK;
      }
      for (String line : store.settlePendingChanges()) {
        err.println("rimeward: " + line);
      }
      err.flush();
      TrailEditJournal journal = new TrailEditJournal(store);
      List<ProfileEdit> edits;
      try {
        edits = edit.apply(journal);
      } catch (AuditUnavailableException e) {
        out.flush();
        if (journal.pendingRecorded()) {
          err.println("rimeward: the edit IS written and recorded in the audit trail as pending,"
              + " but its confirmation could not be recorded: " + e.getMessage() + " The next"
              + " profile command or plan confirms it from the file.");
        } else {
          err.println("rimeward: the profile was not changed: " + e.getMessage());
        }
        err.flush();
        return Main.INTERNAL_ERROR;
      }
      for (ProfileEdit e : edits) {
        out.printf(Locale.ROOT, "recorded in %s: %s %s by %s: %s%s %s (%s)%n", target.file(),
            e.at(), e.file(), e.by(), e.crop(), e.variety() == null ? "" : "/" + e.variety(),
            e.stage() == null ? e.field() : e.stage() + " " + e.field(), e.note());
      }
      out.flush();
      return Main.OK;
    }
  }
}
