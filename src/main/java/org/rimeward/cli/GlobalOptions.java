package org.rimeward.cli;

import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParseResult;
import picocli.CommandLine.ScopeType;

/** Options every subcommand accepts: units of display and of bare numbers, verbosity. */
public final class GlobalOptions {
  @Option(names = "--units", paramLabel = "metric|us", scope = ScopeType.INHERIT,
      description = "Units shown in output and for bare temperatures on the command line "
          + "(default: ${DEFAULT-VALUE}). JSON is always metric.",
      defaultValue = "metric", converter = UnitSystemConverter.class)
  UnitSystem units = UnitSystem.METRIC;

  @Option(names = "--verbose", scope = ScopeType.INHERIT,
      description = "Show the rule engine's and libraries' log messages.")
  boolean verbose;

  @Option(names = "--debug", scope = ScopeType.INHERIT,
      description = "Print the stack trace of an internal error.")
  boolean debug;

  public UnitSystem units() {
    return units;
  }

  static GlobalOptions of(ParseResult parseResult) {
    Object root = parseResult.commandSpec().root().userObject();
    return root instanceof RimewardCommand r ? r.global : new GlobalOptions();
  }

  static final class UnitSystemConverter implements picocli.CommandLine.ITypeConverter<UnitSystem> {
    @Override
    public UnitSystem convert(String value) {
      return UnitSystem.parse(value);
    }
  }
}
