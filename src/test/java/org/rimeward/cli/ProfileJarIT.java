package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The packaged jar, run from a folder without crop-profiles/, uses the copy inside the jar. */
class ProfileJarIT {
  @TempDir Path cwd;

  record Run(int exit, String out, String err) {}

  Run java(String... args) throws Exception {
    String jar = new File(System.getProperty("rimeward.jar", "target/rimeward.jar")).getAbsolutePath();
    List<String> cmd = new ArrayList<>(List.of(
        System.getProperty("java.home") + File.separator + "bin" + File.separator + "java", "-jar", jar));
    cmd.addAll(List.of(args));
    Process p = new ProcessBuilder(cmd).directory(cwd.toFile()).start();
    p.getOutputStream().close();
    byte[] out = p.getInputStream().readAllBytes();
    byte[] err = p.getErrorStream().readAllBytes();
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    return new Run(p.exitValue(), new String(out, StandardCharsets.UTF_8), new String(err, StandardCharsets.UTF_8));
  }

  @Test
  void bundledProfilesAreReadFromTheJar() throws Exception {
    Run r = java("profile", "check");
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.out()).startsWith("OK: 11 crop files").contains("/rimeward/crop-profiles");
    Run show = java("profile", "show", "grapevine/concord", "--json");
    assertThat(show.exit()).isZero();
    assertThat(show.out()).contains("\"t10_c\" : -10.6");
  }

  @Test
  void editingTheCopyInsideTheJarSaysWhatToDo() throws Exception {
    Run r = java("profile", "set", "apple/winesap", "--stage", "full-bloom", "--t10", "-3", "--note", "n",
        "--no-audit");
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("packed inside the rimeward jar").contains("--crop-profiles DIR");
  }
}
