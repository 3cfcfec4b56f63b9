package org.rimeward.cli;

import java.time.Clock;
import java.util.Objects;
import picocli.CommandLine.Command;
import picocli.CommandLine.ScopeType;
import picocli.CommandLine.IVersionProvider;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "rimeward", mixinStandardHelpOptions = true, scope = ScopeType.INHERIT,
    versionProvider = RimewardCommand.Version.class,
    description = "Frost-protection decision support for orchards, vineyards and berry fields.",
    subcommands = {PlanCommand.class, ProfileCommand.class, AuditCommand.class, CalcCommand.class,
        MinimumCommand.class, ActionCommand.class, WatchCommand.class, ForecastCommand.class},
    footer = {"", Cautions.HELP_FOOTER})
public final class RimewardCommand implements Runnable {
  @Mixin GlobalOptions global = new GlobalOptions();
  @Mixin UnitsOption units = new UnitsOption();
  @Spec CommandSpec spec;

  /** The clock that stamps recorded runs and edits; fixed in tests for repeatable records. */
  final Clock clock;

  public RimewardCommand() {
    this(Clock.systemUTC());
  }

  public RimewardCommand(Clock clock) {
    this.clock = Objects.requireNonNull(clock, "clock");
  }

  /** The clock of the command tree {@code spec} belongs to. */
  static Clock clock(CommandSpec spec) {
    return spec.root().userObject() instanceof RimewardCommand r ? r.clock : Clock.systemUTC();
  }

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(), "a command is required: plan, watch,"
        + " action, profile, audit, calc, minimum or forecast");
  }

  /** The version written into the jar's manifest, or the build's properties when not in a jar. */
  static final class Version implements IVersionProvider {
    @Override
    public String[] getVersion() {
      return new String[] {"rimeward " + org.rimeward.BuildInfo.version()};
    }
  }
}
