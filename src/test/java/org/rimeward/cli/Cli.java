package org.rimeward.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.time.Clock;

/** Runs the command line in-process and keeps what it printed. */
public final class Cli {
  public record Result(int exitCode, String out, String err) {
    @Override
    public String toString() {
      return "exit " + exitCode + "\n--- out\n" + out + "--- err\n" + err;
    }
  }

  private Cli() {}

  public static Result run(String... args) {
    return run(Clock.systemUTC(), args);
  }

  /** As {@link #run(String...)}, with the clock that stamps recorded runs and edits. */
  public static Result run(Clock clock, String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.execute(clock, new PrintWriter(out, true), new PrintWriter(err, true), args);
    return new Result(code, out.toString(), err.toString());
  }
}
