package org.rimeward.cli;

import java.io.PrintWriter;
import java.util.stream.Collectors;
import org.rimeward.crop.Crop;
import org.rimeward.crop.CropLibrary;
import org.rimeward.crop.Variety;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "list",
    description = "List the crops and their varieties, the number of stages and each file.")
final class ProfileListCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();

  @Override
  public void run() {
    CropLibrary lib = CropLibrary.load(folder.resolve());
    PrintWriter out = spec.commandLine().getOut();
    out.printf("%-20s %6s  %-44s %s%n", "CROP", "STAGES", "VARIETIES", "FILE");
    for (Crop c : lib.crops()) {
      String varieties = c.varieties().isEmpty() ? "-"
          : c.varieties().stream().map(Variety::id).collect(Collectors.joining(", "));
      out.printf("%-20s %6d  %-44s %s%n", c.id(), c.stages().size(), varieties, c.file());
    }
    out.flush();
  }
}
