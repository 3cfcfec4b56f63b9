package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/** Runs target/rimeward.jar in its own JVM, as a grower would, after the build packaged it. */
class PackagedJarIT {
  record Run(int exit, String out, String err) {}

  static Run java(String... args) throws Exception {
    String jar = System.getProperty("rimeward.jar", "target/rimeward.jar");
    List<String> cmd = new ArrayList<>();
    cmd.add(System.getProperty("java.home") + File.separator + "bin" + File.separator + "java");
    cmd.add("-jar");
    cmd.add(jar);
    cmd.addAll(List.of(args));
    Process p = new ProcessBuilder(cmd).start();
    p.getOutputStream().close();
    byte[] out = p.getInputStream().readAllBytes();
    byte[] err = p.getErrorStream().readAllBytes();
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    return new Run(p.exitValue(), new String(out, StandardCharsets.UTF_8),
        new String(err, StandardCharsets.UTF_8));
  }

  @Test
  void versionComesFromTheManifest() throws Exception {
    Run r = java("--version");
    assertThat(r.exit()).isZero();
    assertThat(r.out()).startsWith("rimeward 0.");
  }
}
