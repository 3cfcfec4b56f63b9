package org.rimeward.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

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
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
    return new Result(code, out.toString(), err.toString());
  }
}
