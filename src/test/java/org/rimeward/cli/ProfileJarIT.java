package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The packaged jar, run from a folder without crop-profiles/, uses the copy inside the jar. */
class ProfileJarIT {
  @TempDir Path cwd;

  ChildProcess.Run java(String... args) throws Exception {
    return ChildProcess.run(new ProcessBuilder(ChildProcess.jar(List.of(), args))
        .directory(cwd.toFile()), 120);
  }

  @Test
  void bundledProfilesAreReadFromTheJar() throws Exception {
    ChildProcess.Run r = java("profile", "check");
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.out()).startsWith("OK: 11 crop files").contains("/rimeward/crop-profiles");
    ChildProcess.Run show = java("profile", "show", "grapevine/concord", "--json");
    assertThat(show.exit()).isZero();
    assertThat(show.out()).contains("\"t10_c\" : -10.6");
  }

  @Test
  void editingOutsideAFarmFolderSaysWhatToDo() throws Exception {
    // The bundled copy is never edited; outside a farm folder there is no farm to copy it into.
    ChildProcess.Run r = java("profile", "set", "apple/winesap", "--stage", "full-bloom", "--t10", "-3", "--note", "n",
        "--no-audit");
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("has no farm.yaml").contains("--crop-profiles DIR");
  }
}
