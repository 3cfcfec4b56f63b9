package org.rimeward.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "forecast",
    description = {"Forecasts from public weather services, saved for the farm."},
    subcommands = {ForecastFetchCommand.class},
    footer = {"", Cautions.HELP_FOOTER})
final class ForecastCommand implements Runnable {
  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(), "a subcommand is required: fetch");
  }
}
