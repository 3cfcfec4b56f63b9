package org.rimeward.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "minimum",
    description = {"The site's own forecast of the night's minimum (FAO 2005 ch. 6, after Allen"
        + " 1957): fitted to the farm station's history of clear calm nights, read two hours"
        + " after sunset.",
        "Valid on radiation nights only; decision support: thermometers at bud height decide."},
    subcommands = {MinimumFitCommand.class, MinimumPredictCommand.class},
    footer = {"", Cautions.HELP_FOOTER})
final class MinimumCommand implements Runnable {
  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(), "a subcommand is required: fit or predict");
  }
}
