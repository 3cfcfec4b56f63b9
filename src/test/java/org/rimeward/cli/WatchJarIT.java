package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The watch as the packaged jar in its own process: a signal stops it cleanly. */
class WatchJarIT {
  @Test
  void sigtermStopsTheWatchCleanlyAndTheTrailStaysWhole(@TempDir Path tmp) throws Exception {
    Path farm = Files.createDirectories(tmp.resolve("farm"));
    for (String f : List.of("farm.yaml", "forecast.csv", "station-readings.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    String jar = Path.of(System.getProperty("rimeward.jar", "target/rimeward.jar")).toAbsolutePath()
        .toString();
    List<String> cmd = new ArrayList<>(List.of(System.getProperty("java.home") + File.separator
        + "bin" + File.separator + "java", "-jar", jar, "watch", "--farm", farm.toString(),
        "--readings", farm.resolve("station-readings.csv").toString(), "--every", "5s", "--now",
        "2026-04-14T23:00-07:00"));
    Path out = tmp.resolve("out.txt");
    Process p = new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(out.toFile()).start();
    p.getOutputStream().close();
    // Wait for the first pass (its alarm, readings colder than forecast, is on the screen), then
    // send SIGTERM.
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(90);
    while (System.nanoTime() < deadline && !Files.readString(out, StandardCharsets.UTF_8)
        .contains("colder-than-forecast")) {
      Thread.sleep(200);
    }
    assertThat(Files.readString(out)).contains("watching station-readings.csv every 5s")
        .as("the first pass ran and raised its alarm").contains("colder-than-forecast");
    p.destroy();
    assertThat(p.waitFor(30, TimeUnit.SECONDS)).as("stopped within 30 s of SIGTERM").isTrue();
    assertThat(p.exitValue()).as("128 + SIGTERM").isEqualTo(143);
    assertThat(Files.readString(out)).contains("watch stopped");
    PackagedJarIT.Run verify = PackagedJarIT.java("audit", "verify", "--farm", farm.toString());
    assertThat(verify.exit()).as(verify.out() + verify.err()).isZero();
  }
}
