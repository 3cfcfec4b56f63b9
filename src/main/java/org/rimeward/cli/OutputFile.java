package org.rimeward.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.rimeward.io.AtomicFiles;
import org.rimeward.io.BadInputException;

/** Where a command's document goes: the screen, or a file replaced whole with {@code --output}. */
final class OutputFile {
  private OutputFile() {}

  /** Checks {@code --output} before any work is done, so a typo costs nothing. */
  static void check(Path output) {
    if (output == null) {
      return;
    }
    Path folder = output.toAbsolutePath().getParent();
    if (Files.isDirectory(output) || folder == null || !Files.isDirectory(folder)) {
      throw new BadInputException("--output: " + output + (Files.isDirectory(output)
          ? " is a folder; name a file" : ": folder " + folder + " does not exist; create it first"));
    }
  }

  /** Prints {@code text}, or writes it to {@code output} atomically and says where. */
  static void write(PrintWriter out, Path output, String text, String what) {
    if (output == null) {
      out.print(text);
    } else {
      check(output);
      try {
        AtomicFiles.writeString(output, text);
      } catch (java.io.IOException e) {
        throw new BadInputException("--output: cannot write " + output + " (" + e.getMessage()
            + "); check that the folder is writable, or name another file");
      }
      out.println("wrote " + what + " to " + output);
    }
    out.flush();
  }
}
