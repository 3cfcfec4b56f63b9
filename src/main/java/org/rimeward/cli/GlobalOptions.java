package org.rimeward.cli;

import picocli.CommandLine.Option;
import picocli.CommandLine.ParseResult;
import picocli.CommandLine.ScopeType;

/** Options every command accepts: verbosity and stack traces. */
public final class GlobalOptions {
  @Option(names = "--verbose", scope = ScopeType.INHERIT,
      description = "Show the rule engine's and libraries' log messages.")
  boolean verbose;

  @Option(names = "--debug", scope = ScopeType.INHERIT,
      description = "Print the stack trace of an internal error.")
  boolean debug;

  static GlobalOptions of(ParseResult parseResult) {
    Object root = parseResult.commandSpec().root().userObject();
    return root instanceof RimewardCommand r ? r.global : new GlobalOptions();
  }
}
