package org.rimeward.cli;

import java.nio.file.Path;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.io.BundledData;
import picocli.CommandLine.Option;

/**
 * Where the rule files and crop profiles come from: a folder given, else the farm's own (named
 * in farm.yaml, or beside it), else the bundled ones. The working folder is never consulted.
 */
final class DataFolders {
  @Option(names = "--rules", paramLabel = "DIR",
      description = "Folder of .drl rule files (default: the farm's own: farm.yaml's rules:, else"
          + " <farm>/rules if present, else the bundled rules).")
  Path rules;

  @Option(names = "--crop-profiles", paramLabel = "DIR",
      description = "Folder of crop profile files (default: the farm's own: farm.yaml's"
          + " crop_profiles:, else <farm>/crop-profiles if present, else the bundled ones).")
  Path cropProfiles;

  /** The rules for a farm: --rules, else the farm's own, else the bundled ones. */
  Path rules(Path farm) {
    return rules != null ? rules : own(farm).ownRules().orElseGet(() -> BundledData.bundled("rules"));
  }

  /** The crop profiles for a farm: --crop-profiles, else the farm's own, else the bundled ones. */
  Path cropProfiles(Path farm) {
    return cropProfiles != null ? cropProfiles
        : own(farm).ownCropProfiles().orElseGet(() -> BundledData.bundled("crop-profiles"));
  }

  private static Farm own(Path farm) {
    return FarmLoader.load(farm);
  }
}
