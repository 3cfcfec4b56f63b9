package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Runs target/rimeward.jar in its own JVM, as a grower would, after the build packaged it. */
class PackagedJarIT {
  record Run(int exit, String out, String err) {}

  static Run java(String... args) throws Exception {
    return javaIn(null, args);
  }

  /** The jar run to its end, or failed after two minutes: its output goes to files, not pipes. */
  static Run javaIn(java.nio.file.Path dir, String... args) throws Exception {
    ProcessBuilder pb = new ProcessBuilder(ChildProcess.jar(List.of(), args));
    if (dir != null) {
      pb.directory(dir.toFile());
    }
    ChildProcess.Run r = ChildProcess.run(pb, 120);
    return new Run(r.exit(), r.out(), r.err());
  }

  @Test
  void versionComesFromTheManifest() throws Exception {
    Run r = java("--version");
    assertThat(r.exit()).isZero();
    assertThat(r.out()).startsWith("rimeward 0.");
  }

  /**
   * The main job from the jar alone, in a folder with no rules/ or crop-profiles/: the bundled
   * copies inside the jar are used, and Drools finds its parts in the merged service files.
   */
  @Test
  void plansTheDemoFarmFromTheJarAlone(@org.junit.jupiter.api.io.TempDir java.nio.file.Path tmp)
      throws Exception {
    java.nio.file.Path farm = tmp.resolve("demo-farm");
    java.nio.file.Files.createDirectories(farm);
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      java.nio.file.Files.copy(java.nio.file.Path.of("demo-farm", f), farm.resolve(f));
    }
    Run r = javaIn(tmp, "plan", "--farm", "demo-farm", "--format", "json");
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.err()).isEmpty();
    var root = new com.fasterxml.jackson.databind.ObjectMapper().readTree(r.out());
    assertThat(root.get("blocks")).hasSizeGreaterThanOrEqualTo(8);
    assertThat(root.at("/night/date").asText()).isEqualTo("2026-04-14");

    Run bad = javaIn(tmp, "plan", "--farm", "no-such-farm");
    assertThat(bad.exit()).isEqualTo(2);
    assertThat(bad.err()).startsWith("rimeward: ").doesNotContain("Exception");
  }

  /** calc rate from the jar alone: the need at 12 m/s, and the bundled rule files' wind limit. */
  @Test
  void calcRateInAStrongWindFromTheJarAlone(@org.junit.jupiter.api.io.TempDir java.nio.file.Path tmp)
      throws Exception {
    Run r = javaIn(tmp, "calc", "rate", "--temp", "-4", "--dew-point", "-7", "--wind", "12 m/s", "--json");
    assertThat(r.exit()).as(r.err()).isZero();
    var n = new com.fasterxml.jackson.databind.ObjectMapper().readTree(r.out());
    assertThat(n.get("required_rate_mm_h").asDouble()).isGreaterThan(10).isLessThan(100);
    assertThat(n.get("advised").asBoolean()).isFalse();
    assertThat(n.get("reason").asText()).contains("12.0 m/s at 10 m");
  }

  /** The launcher runs the same jar with start-up options, twice: writing its archive, then using it. */
  @Test
  void theLauncherRunsTheJarAndPassesTheExitCodeOn(@org.junit.jupiter.api.io.TempDir java.nio.file.Path tmp)
      throws Exception {
    String jar = java.nio.file.Path.of(System.getProperty("rimeward.jar", "target/rimeward.jar"))
        .toAbsolutePath().toString();
    for (int i = 0; i < 2; i++) {
      ProcessBuilder pb = new ProcessBuilder("sh", java.nio.file.Path.of("bin/rimeward").toAbsolutePath().toString(),
          "plan", "--farm", "no-such-farm");
      pb.environment().put("RIMEWARD_JAR", jar);
      pb.environment().put("XDG_CACHE_HOME", tmp.toString());
      pb.environment().put("JAVA_HOME", System.getProperty("java.home"));
      ChildProcess.Run r = ChildProcess.run(pb, 120);
      String out = r.out();
      String err = r.err();
      assertThat(r.exit()).as(out + err).isEqualTo(2);
      assertThat(err).startsWith("rimeward: ").contains("no-such-farm");
      assertThat(out).isEmpty();
    }
    try (var files = java.nio.file.Files.list(tmp.resolve("rimeward/cds"))) {
      assertThat(files.map(f -> f.getFileName().toString()).toList())
          .singleElement().satisfies(n -> assertThat(n).endsWith(".jsa"));
    }
  }
}
