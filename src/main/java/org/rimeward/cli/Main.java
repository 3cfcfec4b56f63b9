package org.rimeward.cli;

import java.io.PrintWriter;
import java.time.Clock;
import java.util.logging.Level;
import java.util.logging.LogManager;
import java.util.logging.Logger;
import org.rimeward.audit.AuditUnavailableException;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Text;
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
    int code;
    try {
      PrintWriter out = new PrintWriter(System.out, true);
      PrintWriter err = new PrintWriter(System.err, true);
      code = execute(out, err, args);
    } catch (OutOfMemoryError e) {
      // The handlers below could not even word the message: the heap was still full when they
      // ran. Write the line made at start-up, byte for byte, and nothing else.
      System.err.write(OUT_OF_MEMORY_LINE, 0, OUT_OF_MEMORY_LINE.length);
      System.err.flush();
      code = INTERNAL_ERROR;
    }
    System.exit(code);
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
    cmd.registerConverter(java.time.LocalDate.class, new DateConverter());
    cmd.setExecutionStrategy(Main::runQuietly);
    cmd.setParameterExceptionHandler((ex, argv) -> {
      CommandLine c = ex.getCommandLine();
      c.getErr().println("rimeward: " + Text.escape(ex.getMessage()));
      c.getErr().println("Try '" + c.getCommandSpec().qualifiedName() + " --help'.");
      c.getErr().flush();
      return BAD_INPUT;
    });
    cmd.setExecutionExceptionHandler((ex, c, parseResult) -> {
      if (rootCause(ex) instanceof OutOfMemoryError) {
        return outOfMemory(c.getErr());
      }
      Throwable t = rootInput(ex);
      if (t != null) {
        // Messages quote what people wrote; control characters in it never reach the terminal.
        c.getErr().println("rimeward: " + Text.escape(t.getMessage()));
        c.getErr().flush();
        return BAD_INPUT;
      }
      boolean debug = GlobalOptions.of(parseResult).debug;
      AuditUnavailableException audit = audit(ex);
      if (audit != null) {
        // The trail could not be opened or written: a condition of the machine, not a bug.
        c.getErr().println("rimeward: " + Text.escape(audit.getMessage()));
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
    int code;
    try {
      code = cmd.execute(args);
    } catch (OutOfMemoryError e) {
      code = outOfMemory(err);
    }
    out.flush();
    err.flush();
    return code;
  }

  /**
   * One line, and the heap to try: twice what this run had. The audit trail writes a run in one
   * transaction, so a run that ran out of memory left nothing half-written there.
   */
  static int outOfMemory(PrintWriter err) {
    err.println(OUT_OF_MEMORY);
    err.flush();
    return INTERNAL_ERROR;
  }

  /**
   * Worded once, while there is memory: when the heap runs out, building the message could itself
   * run out of memory and let the error escape as a stack trace.
   */
  private static final String OUT_OF_MEMORY = outOfMemoryMessage(Runtime.getRuntime().maxMemory());

  private static final byte[] OUT_OF_MEMORY_LINE =
      (OUT_OF_MEMORY + System.lineSeparator()).getBytes(java.nio.charset.StandardCharsets.UTF_8);

  static String outOfMemoryMessage(long maxHeapBytes) {
    long mb = maxHeapBytes >> 20;
    long next = Math.max(256, Integer.highestOneBit((int) Math.max(1, Math.min(mb, 1 << 30))) * 2L);
    return "rimeward: out of memory with a " + mb + " MB Java heap; nothing was recorded."
        + " Run again with more, e.g. java -Xmx" + next + "m -jar rimeward.jar ... (or"
        + " JAVA_OPTS=-Xmx" + next + "m bin/rimeward ...)";
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

  private static Throwable rootCause(Throwable ex) {
    Throwable t = ex;
    while (t.getCause() != null && t.getCause() != t) {
      t = t.getCause();
    }
    return t;
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
