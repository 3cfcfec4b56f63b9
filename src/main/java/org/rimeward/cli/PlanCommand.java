package org.rimeward.cli;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "plan", mixinStandardHelpOptions = true, versionProvider = RimewardCommand.Version.class,
    description = "TODO")
final class PlanCommand implements Runnable {
  @Spec CommandSpec spec;

  @Override
  public void run() {
    throw new ParameterException(spec.commandLine(), "a subcommand is required");
  }
}
