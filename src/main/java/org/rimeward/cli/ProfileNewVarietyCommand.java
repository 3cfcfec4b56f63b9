package org.rimeward.cli;

import java.io.PrintWriter;
import java.time.ZoneId;
import java.util.List;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.crop.ProfileEditor;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "new-variety",
    description = "Add a variety to a crop file. It inherits the crop's stages; --offset makes it"
        + " uniformly hardier (positive) or more tender (negative).",
    footer = {"", ProfileCommand.EDIT_FOOTER})
final class ProfileNewVarietyCommand implements java.util.concurrent.Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();
  @Mixin ProfileCommand.AuditTarget auditTarget = new ProfileCommand.AuditTarget();

  @Parameters(index = "0", paramLabel = "CROP/VARIETY", description = "e.g. apple/honeycrisp")
  String target;

  @Option(names = "--from", paramLabel = "CROP/OTHER",
      description = "Copy the offset and overrides of this variety of the same crop.")
  String from;

  @Option(names = "--offset", paramLabel = "DELTA",
      description = "Hardiness offset, e.g. 0.5C or 1F (bare numbers in --units).")
  String offset;

  @Option(names = "--name", description = "Display name (default: the id).")
  String name;

  @Mixin ProfileCommand.Author author = new ProfileCommand.Author();

  @Override
  public Integer call() {
    String[] cv = ProfileCommand.cropAndVariety(target, "CROP/VARIETY");
    if (cv[1] == null) {
      throw new BadInputException("CROP/VARIETY: '" + target + "' names no variety; write it as"
          + " CROP/VARIETY, for example apple/honeycrisp");
    }
    String fromVariety = null;
    if (from != null) {
      String[] fv = ProfileCommand.cropAndVariety(from, "--from");
      if (!fv[0].equals(cv[0]) || fv[1] == null) {
        throw new BadInputException("--from: '" + from + "' must be a variety of the same crop, e.g. "
            + cv[0] + "/OTHER; stages differ between crops");
      }
      fromVariety = fv[1];
    }
    auditTarget.farm = folder.farm;
    ProfileEditor editor = new ProfileEditor(
        folder.resolveForEdit(spec.commandLine().getOut()),
        RimewardCommand.clock(spec).withZone(ZoneId.systemDefault()));
    String fromV = fromVariety;
    return ProfileCommand.runEdit(spec, auditTarget, journal -> {
      ProfileEdit edit = editor.newVariety(cv[0], cv[1], name, fromV, offset,
          ProfileCommand.units(spec), author.note, author.by, journal);
      PrintWriter out = spec.commandLine().getOut();
      out.println("Added variety " + cv[0] + "/" + cv[1] + " to " + edit.file()
          + (edit.afterC() == null ? " (no hardiness offset)"
              : String.format(java.util.Locale.ROOT, " (hardiness offset %.2f °C, %.1f °F)",
                  edit.afterC(), edit.afterC() * 1.8)));
      return List.of(edit);
    });
  }
}
