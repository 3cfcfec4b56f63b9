package org.rimeward.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** {@code --farm}: the farm folder (or its farm.yaml) a command works on, declared once. */
final class FarmOption {
  @Option(names = "--farm", paramLabel = "DIR", defaultValue = ".",
      description = "Farm folder, or its farm.yaml (default: the current folder).")
  Path farm;

  Path farm() {
    return farm;
  }
}
