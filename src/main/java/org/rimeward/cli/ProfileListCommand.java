package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import org.rimeward.crop.Crop;
import org.rimeward.crop.CropLibrary;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "list",
    description = "List the crops and their varieties (hardier or more tender than the crop's"
        + " table), the number of stages and each file.")
final class ProfileListCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();

  @Override
  public void run() {
    Path dir = folder.resolve();
    CropLibrary lib = CropLibrary.load(dir);
    UnitSystem units = ProfileCommand.units(spec);
    PrintWriter out = spec.commandLine().getOut();
    out.println("Crop profiles in " + folder.describe(dir));
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"CROP", "STAGES", "FILE", "VARIETIES"});
    for (Crop c : lib.crops()) {
      String varieties = c.varieties().isEmpty() ? "-" : c.varieties().stream()
          .map(v -> v.id() + " (" + ProfileListWords.offset(v.hardinessOffsetC(), units) + ")")
          .collect(Collectors.joining(", "));
      rows.add(new String[] {c.id(), Integer.toString(c.stages().size()), relative(dir, c.file()),
          varieties});
    }
    int[] w = new int[3];
    for (String[] r : rows) {
      for (int i = 0; i < w.length; i++) {
        w[i] = Math.max(w[i], r[i].length());
      }
    }
    for (String[] r : rows) {
      out.printf("%-" + w[0] + "s  %" + w[1] + "s  %-" + w[2] + "s  %s%n", r[0], r[1], r[2], r[3]);
    }
    out.flush();
  }

  /** The file as a path under the folder listed, which the header names. */
  static String relative(Path dir, String file) {
    try {
      Path f = dir.getFileSystem().getPath(file);
      if (f.isAbsolute() == dir.isAbsolute() && f.startsWith(dir)) {
        return dir.relativize(f).toString();
      }
      Path abs = f.toAbsolutePath().normalize();
      Path d = dir.toAbsolutePath().normalize();
      return abs.startsWith(d) ? d.relativize(abs).toString() : file;
    } catch (RuntimeException e) {
      return file;
    }
  }

}
