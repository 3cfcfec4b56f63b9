package org.rimeward.cli;

import java.nio.file.Path;
import org.rimeward.io.BundledData;
import picocli.CommandLine.Option;

/** Where the rule files and crop profiles come from: a folder given, or the bundled ones. */
final class DataFolders {
  @Option(names = "--rules", paramLabel = "DIR",
      description = "Folder of .drl rule files (default: ./rules if present, else the bundled rules).")
  Path rules;

  @Option(names = "--crop-profiles", paramLabel = "DIR",
      description = "Folder of crop profile files (default: ./crop-profiles if present, else the bundled ones).")
  Path cropProfiles;

  Path rules() {
    return rules != null ? rules : BundledData.folder("rules");
  }

  Path cropProfiles() {
    return cropProfiles != null ? cropProfiles : BundledData.folder("crop-profiles");
  }
}
