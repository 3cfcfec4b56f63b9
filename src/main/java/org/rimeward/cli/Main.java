package org.rimeward.cli;

import java.io.PrintWriter;
import java.time.Clock;
import java.util.logging.Level;
import java.util.logging.LogManager;
import java.util.logging.Logger;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.OutOfRangeException;
import org.rimeward.units.QuantityException;
import picocli.CommandLine;
import picocli.CommandLine.ParseResult;

/** Entry point: wires the command tree, exit codes and logging. */
public final class Main {
  /** Exit codes, as the README documents them. */
  public static final int OK = 0;
  public static final int INTERNAL_ERROR = 1;
  public static final int BAD_INPUT = 2;
  public static final int ACTION_NEEDED = 3;

  private Main() {}

  public static void main(String[] args) {
    PrintWriter out = new PrintWriter(System.out, true);
    PrintWriter err = new PrintWriter(System.err, true);
    System.exit(execute(out, err, args));
  }

  /** Runs one command line with the given streams and returns its exit code. */
  public static int execute(PrintWriter out, PrintWriter err, String... args) {
    return execute(Clock.systemUTC(), out, err, args);
  }

  /** As {@link #execute(PrintWriter, PrintWriter, String...)}, stamping records with {@code clock}. */
  public static int execute(Clock clock, PrintWriter out, PrintWriter err, String... args) {
    CommandLine cmd = new CommandLine(new RimewardCommand(clock));
    cmd.setOut(out);
    cmd.setErr(err);
    cmd.setCaseInsensitiveEnumValuesAllowed(true);
    cmd.setExecutionStrategy(Main::runQuietly);
    cmd.setParameterExceptionHandler((ex, argv) -> {
      CommandLine c = ex.getCommandLine();
      c.getErr().println("rimeward: " + ex.getMessage());
      c.getErr().println("Try '" + c.getCommandSpec().qualifiedName() + " --help'.");
      c.getErr().flush();
      return BAD_INPUT;
    });
    cmd.setExecutionExceptionHandler((ex, c, parseResult) -> {
      Throwable t = rootInput(ex);
      if (t != null) {
        c.getErr().println("rimeward: " + t.getMessage());
        c.getErr().flush();
        return BAD_INPUT;
      }
      boolean debug = GlobalOptions.of(parseResult).debug;
      AuditUnavailableException audit = audit(ex);
      if (audit != null) {
        // The trail could not be opened or written: a condition of the machine, not a bug.
        c.getErr().println("rimeward: " + audit.getMessage());
        if (debug) {
          ex.printStackTrace(c.getErr());
        }
        c.getErr().flush();
        return INTERNAL_ERROR;
      }
      c.getErr().println("rimeward: internal error: " + ex
          + (debug ? "" : " (run again with --debug for details)"));
      if (debug) {
        ex.printStackTrace(c.getErr());
      }
      c.getErr().flush();
      return INTERNAL_ERROR;
    });
    int code = cmd.execute(args);
    out.flush();
    err.flush();
    return code;
  }

  private static Throwable rootInput(Throwable ex) {
    for (Throwable t = ex; t != null; t = t.getCause()) {
      if (t instanceof BadInputException || t instanceof QuantityException
          || t instanceof OutOfRangeException) {
        return t;
      }
    }
    return null;
  }

  private static AuditUnavailableException audit(Throwable ex) {
    for (Throwable t = ex; t != null; t = t.getCause()) {
      if (t instanceof AuditUnavailableException a) {
        return a;
      }
    }
    return null;
  }

  private static int runQuietly(ParseResult parseResult) {
    configureLogging(GlobalOptions.of(parseResult).verbose);
    return new CommandLine.RunLast().execute(parseResult);
  }

  /** Drools and its libraries log through JUL; a normal run shows none of it. */
  static void configureLogging(boolean verbose) {
    LogManager.getLogManager().reset();
    Logger root = Logger.getLogger("");
    root.setLevel(verbose ? Level.INFO : Level.OFF);
    if (verbose) {
      java.util.logging.ConsoleHandler h = new java.util.logging.ConsoleHandler();
      h.setLevel(Level.ALL);
      root.addHandler(h);
    }
  }
}
