package org.rimeward.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "calc",
    description = {"One frost-night calculation at a time: air humidity and wet bulb, sun times,"
        + " bud temperature, sprinkler rate, bud kill.",
        "Decision support: check the numbers against thermometers in the block."},
    subcommands = {CalcAirCommand.class, CalcSunCommand.class, CalcBudCommand.class,
        CalcRateCommand.class, CalcKillCommand.class},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcCommand implements Runnable {
  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(), "a subcommand is required: air, sun, bud, rate or kill");
  }
}
