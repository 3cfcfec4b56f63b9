package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import org.rimeward.crop.Crop;
import org.rimeward.crop.CropLibrary;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "check",
    description = "Check every crop profile file; exit 2 and list the problems if any.")
final class ProfileCheckCommand implements Runnable {
  @Spec CommandSpec spec;
  @Mixin ProfileCommand.Folder folder = new ProfileCommand.Folder();

  @Override
  public void run() {
    Path dir = folder.resolve();
    CropLibrary lib;
    try {
      lib = CropLibrary.load(dir);
    } catch (BadInputException e) {
      int n = e.getMessage().split("\\R").length;
      throw new BadInputException("crop profiles in " + dir + " have " + n + " problem"
          + (n == 1 ? "" : "s") + ":" + System.lineSeparator() + e.getMessage(), e);
    }
    int stages = lib.crops().stream().mapToInt(c -> c.stages().size()).sum();
    int varieties = lib.crops().stream().mapToInt(c -> c.varieties().size()).sum();
    for (Crop c : lib.crops()) {
      c.varieties().forEach(v -> lib.effective(c.id(), v.id()));
    }
    PrintWriter out = spec.commandLine().getOut();
    out.printf("OK: %d crop files, %d stages, %d varieties in %s%n", lib.crops().size(), stages,
        varieties, dir);
    List<String> notes = lib.notes();
    if (!notes.isEmpty()) {
      out.printf("%d stage%s no flowering flag:%n", notes.size(),
          notes.size() == 1 ? " has" : "s have");
      notes.forEach(n -> out.println("  " + n));
    }
    out.flush();
  }
}
