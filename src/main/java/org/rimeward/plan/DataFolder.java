package org.rimeward.plan;

import java.nio.file.Path;
import java.util.Optional;
import org.rimeward.farm.Farm;
import org.rimeward.io.BundledData;

/** A crop-profiles or rules folder chosen for a run, and where the choice came from. */
record DataFolder(Path dir, PlanInputs.Origin origin, Farm farm) {
  /**
   * The folder given on the command line; else the farm's own (named in farm.yaml, or beside it);
   * else the bundled copy. The working folder is never looked at.
   */
  static DataFolder choose(Path given, Optional<Path> farmOwn, String bundledName, Farm farm) {
    if (given != null) {
      return new DataFolder(given, PlanInputs.Origin.OPTION, farm);
    }
    if (farmOwn.isPresent()) {
      boolean named = bundledName.equals(Farm.DEFAULT_RULES) ? farm.rulesDir().isPresent()
          : farm.cropProfilesDir().isPresent();
      return new DataFolder(farmOwn.get(), named ? PlanInputs.Origin.FARM_FILE
          : PlanInputs.Origin.FARM_FOLDER, farm);
    }
    return new DataFolder(BundledData.bundled(bundledName), PlanInputs.Origin.BUNDLED, farm);
  }

  PlanInputs.Folder describe(String sha256) {
    return new PlanInputs.Folder(origin, origin == PlanInputs.Origin.BUNDLED ? "(bundled)"
        : shown(dir, farm), sha256);
  }

  /** A path relative to the farm folder when inside it, else as given. */
  static String shown(Path p, Farm farm) {
    if (!"file".equals(p.getFileSystem().provider().getScheme())) {
      return p.toString();
    }
    Path abs = p.toAbsolutePath().normalize();
    Path folder = farm.folder().toAbsolutePath().normalize();
    return abs.startsWith(folder) ? folder.relativize(abs).toString().replace('\\', '/') : p.toString();
  }
}
