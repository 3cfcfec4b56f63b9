package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A plan that runs out of memory, in a real JVM with a heap too small for it: one line that says
 * so and names the {@code -Xmx} to try, no stack trace, and no half run in the audit trail.
 */
class OutOfMemoryIT {
  @TempDir Path tmp;

  @Test
  void outOfMemorySaysSoInOneLineAndLeavesTheTrailWhole() throws Exception {
    Path farm = demoFarm();
    // A first run with room records one whole run, and leaves the compiled rules in a cache of the
    // test's own: the run that runs out of memory then does so while planning, not inside the rule
    // compiler, which reports a failure of its worker threads without the error that caused it.
    String cache = "-Drimeward.cache=" + tmp.resolve("rules-cache");
    ChildProcess.Run ok = ChildProcess.run(new ProcessBuilder(ChildProcess.jar(List.of(cache),
        "plan", "--farm", farm.toString())).directory(tmp.toFile()), 300);
    assertThat(ok.exit()).as(ok.err()).isZero();
    ChildProcess.Run r = ChildProcess.run(new ProcessBuilder(ChildProcess.jar(
        List.of("-Xmx12m", "-XX:+UseSerialGC", cache), "plan", "--farm", farm.toString()))
        .directory(tmp.toFile()), 300);
    assertThat(r.exit()).as(r.err()).isEqualTo(1);
    assertThat(r.err().strip().lines().toList()).as(r.err()).singleElement().satisfies(line ->
        assertThat(line).startsWith("rimeward: out of memory with a ").contains("-Xmx")
            .doesNotContain("Exception", "java.lang"));
    assertThat(r.out()).isEmpty();
    ChildProcess.Run verify = ChildProcess.run(new ProcessBuilder(ChildProcess.jar(List.of(),
        "audit", "verify", "--farm", farm.toString())).directory(tmp.toFile()), 300);
    assertThat(verify.exit()).as(verify.out() + verify.err()).isZero();
    ChildProcess.Run list = ChildProcess.run(new ProcessBuilder(ChildProcess.jar(List.of(),
        "audit", "list", "--farm", farm.toString())).directory(tmp.toFile()), 300);
    assertThat(list.out()).as("the first run only").contains("2026-04-14");
  }

  /**
   * Out of memory inside the rule compiler, with no compiled rules cached: the compiler's worker
   * threads once swallowed the error into "compilation failed" (an internal error), or threw it
   * again from the pool's handler and left the JVM hanging until killed.
   */
  @Test
  void outOfMemoryWhileCompilingTheRulesSaysSoToo() throws Exception {
    Path farm = demoFarm();
    for (String gc : List.of("-XX:+UseSerialGC", "-XX:+UseG1GC")) {
      String cache = "-Drimeward.cache=" + tmp.resolve("empty-cache" + gc.hashCode());
      ChildProcess.Run r = ChildProcess.run(new ProcessBuilder(ChildProcess.jar(
          List.of("-Xmx16m", gc, cache), "plan", "--farm", farm.toString()))
          .directory(tmp.toFile()), 300);
      assertThat(r.exit()).as(gc + ": " + r.err()).isEqualTo(1);
      assertThat(r.err().strip().lines().toList()).as(r.err()).singleElement().satisfies(line ->
          assertThat(line).startsWith("rimeward: out of memory with a ").contains("-Xmx")
              .doesNotContain("internal error", "Exception", "java.lang"));
    }
    assertThat(farm.resolve("audit.db")).as("nothing recorded").satisfiesAnyOf(
        db -> assertThat(db).doesNotExist(),
        db -> assertThat(ChildProcess.run(new ProcessBuilder(ChildProcess.jar(List.of(), "audit",
            "list", "--farm", farm.toString())).directory(tmp.toFile()), 300).out())
            .doesNotContain("2026-04-14"));
  }

  /** The demo farm's farm.yaml and forecast in a folder of the test's own, with no trail yet. */
  private Path demoFarm() throws java.io.IOException {
    Path farm = tmp.resolve("farm");
    Files.createDirectories(farm);
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    return farm;
  }
}
