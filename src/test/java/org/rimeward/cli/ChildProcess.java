package org.rimeward.cli;

import static org.assertj.core.api.Assertions.fail;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/**
 * Runs a program to its end with a time limit that can fire: its output goes to files, not to
 * pipes read to the end first (a pipe read to the end waits as long as the program does).
 */
final class ChildProcess {
  record Run(int exit, String out, String err) {}

  private ChildProcess() {}

  /** {@code java [jvmOptions] -jar rimeward.jar args}, in {@code dir} (null: this folder). */
  static List<String> jar(List<String> jvmOptions, String... args) {
    String jar = Path.of(System.getProperty("rimeward.jar", "target/rimeward.jar"))
        .toAbsolutePath().toString();
    List<String> cmd = new ArrayList<>();
    cmd.add(System.getProperty("java.home") + File.separator + "bin" + File.separator + "java");
    cmd.addAll(jvmOptions);
    cmd.add("-jar");
    cmd.add(jar);
    cmd.addAll(List.of(args));
    return cmd;
  }

  static Run run(ProcessBuilder pb, long timeoutSeconds) throws Exception {
    Path out = Files.createTempFile("rimeward-child", ".out");
    Path err = Files.createTempFile("rimeward-child", ".err");
    try {
      pb.redirectInput(ProcessBuilder.Redirect.from(new File("/dev/null")));
      pb.redirectOutput(out.toFile());
      pb.redirectError(err.toFile());
      Process p = pb.start();
      if (!p.waitFor(timeoutSeconds, TimeUnit.SECONDS)) {
        p.destroyForcibly();
        p.waitFor(30, TimeUnit.SECONDS);
        fail("%s did not finish within %d s; stderr so far:%n%s", pb.command(), timeoutSeconds,
            Files.readString(err, StandardCharsets.UTF_8));
      }
      return new Run(p.exitValue(), Files.readString(out, StandardCharsets.UTF_8),
          Files.readString(err, StandardCharsets.UTF_8));
    } finally {
      Files.deleteIfExists(out);
      Files.deleteIfExists(err);
    }
  }
}
