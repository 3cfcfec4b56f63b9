package org.rimeward.cli;

import java.io.PrintWriter;
import java.time.ZoneId;
import java.util.List;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.crop.ProfileEditor;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "set",
    description = "Set a variety's T10 and/or T90 for one stage, as an override kept with its note.",
    footer = {"", ProfileCommand.EDIT_FOOTER})
final class ProfileSetCommand implements java.util.concurrent.Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();
  @Mixin ProfileCommand.AuditTarget auditTarget = new ProfileCommand.AuditTarget();

  @Parameters(index = "0", paramLabel = "CROP/VARIETY", description = "e.g. apple/golden-delicious")
  String target;

  @Option(names = "--stage", required = true, description = "Stage id, e.g. full-bloom.")
  String stage;

  @Option(names = "--t10", paramLabel = "TEMP",
      description = "New 10%% kill temperature, e.g. -2.8C or 27F (bare: °C, or °F with --units us).")
  String t10;

  @Option(names = "--t90", paramLabel = "TEMP", description = "New 90%% kill temperature.")
  String t90;

  @Mixin ProfileCommand.Author author = new ProfileCommand.Author();

  @Override
  public Integer call() {
    String[] cv = ProfileCommand.cropAndVariety(target, "CROP/VARIETY");
    UnitSystem units = ProfileCommand.units(spec);
    auditTarget.farm = folder.farm;
    ProfileEditor editor = new ProfileEditor(
        folder.resolveForEdit(spec.commandLine().getOut()),
        RimewardCommand.clock(spec).withZone(ZoneId.systemDefault()));
    return ProfileCommand.runEdit(spec, auditTarget, journal -> {
      List<ProfileEdit> edits = editor.set(cv[0], cv[1], stage, t10, t90, units, author.note,
          author.by, journal);
      PrintWriter out = spec.commandLine().getOut();
      for (ProfileEdit e : edits) {
        out.println(e.crop() + "/" + e.variety() + " " + e.stage() + " " + e.field() + ": before "
            + ProfileCommand.temp(e.beforeC(), units) + ", after "
            + ProfileCommand.temp(e.afterC(), units));
      }
      out.println("Written to " + edits.get(0).file());
      return edits;
    });
  }
}
