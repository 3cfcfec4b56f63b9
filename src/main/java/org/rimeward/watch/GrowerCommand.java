package org.rimeward.watch;

import java.io.IOException;
import java.time.Duration;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/**
 * The grower's own command for an alarm (a phone message, a siren, a relay), run through the
 * shell with the alarm in its environment. A command that fails or hangs is reported and stopped;
 * it never stops the watch.
 */
final class GrowerCommand {
  private final String command;
  private final Duration timeout;

  GrowerCommand(String command, Duration timeout) {
    this.command = command;
    this.timeout = timeout;
  }

  /** Runs it for {@code alarm}; returns what happened, e.g. "exit 0" or "timed out after 10 s". */
  String run(Alarm alarm, ZoneId zone) {
    ProcessBuilder pb = new ProcessBuilder("/bin/sh", "-c", command);
    Map<String, String> env = pb.environment();
    env.put("RIMEWARD_BLOCK", alarm.blockId());
    env.put("RIMEWARD_ALARM", alarm.kind().word());
    env.put("RIMEWARD_AT", OffsetDateTime.ofInstant(
        alarm.at().truncatedTo(java.time.temporal.ChronoUnit.SECONDS), zone).toString());
    env.put("RIMEWARD_MESSAGE", alarm.message());
    pb.redirectInput(ProcessBuilder.Redirect.from(new java.io.File("/dev/null")));
    pb.redirectOutput(ProcessBuilder.Redirect.INHERIT);
    pb.redirectError(ProcessBuilder.Redirect.INHERIT);
    Process p;
    try {
      p = pb.start();
    } catch (IOException e) {
      return "could not start: " + e.getMessage();
    }
    try {
      if (!p.waitFor(timeout.toMillis(), TimeUnit.MILLISECONDS)) {
        // The shell's children too: a hanging 'sleep' or modem call must not outlive the alarm.
        p.descendants().forEach(ProcessHandle::destroyForcibly);
        p.destroyForcibly();
        p.waitFor(5, TimeUnit.SECONDS);
        return "timed out after " + timeout.toSeconds() + " s and was stopped";
      }
      return "exit " + p.exitValue();
    } catch (InterruptedException e) {
      p.descendants().forEach(ProcessHandle::destroyForcibly);
      p.destroyForcibly();
      Thread.currentThread().interrupt();
      return "stopped with the watch";
    }
  }
}
