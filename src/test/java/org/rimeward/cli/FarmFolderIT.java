package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The plan depends on the farm folder, never on the folder the job starts in: run as the
 * packaged jar from an empty folder and from one holding broken ./crop-profiles and ./rules, the
 * JSON plans are identical and name the bundled profiles and rules.
 */
class FarmFolderIT {
  @Test
  void thePlanIsIdenticalFromAnyWorkingFolderAndNamesItsProfiles(@TempDir Path tmp) throws Exception {
    Path farm = tmp.resolve("farm");
    Files.createDirectories(farm);
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    Path empty = Files.createDirectories(tmp.resolve("empty"));
    Path hostile = Files.createDirectories(tmp.resolve("hostile"));
    Files.createDirectories(hostile.resolve("crop-profiles"));
    Files.writeString(hostile.resolve("crop-profiles/apple.yaml"), "crop: apple\nstages: [broken\n");
    Files.createDirectories(hostile.resolve("rules"));
    Files.writeString(hostile.resolve("rules/evil.drl"), "package x; rule \"EVIL\" when then System.exit(9); end\n");
    String farmArg = farm.toAbsolutePath().toString();
    PackagedJarIT.Run a = PackagedJarIT.javaIn(empty, "plan", "--farm", farmArg, "--no-audit", "--format", "json");
    PackagedJarIT.Run b = PackagedJarIT.javaIn(hostile, "plan", "--farm", farmArg, "--no-audit", "--format", "json");
    PackagedJarIT.Run c = PackagedJarIT.javaIn(farm, "plan", "--no-audit", "--format", "json");
    assertThat(a.exit()).as(a.err()).isZero();
    assertThat(b.exit()).as(b.err()).isZero();
    assertThat(c.exit()).as(c.err()).isZero();
    assertThat(b.out()).isEqualTo(a.out());
    assertThat(c.out()).isEqualTo(a.out());
    assertThat(a.out()).contains("\"crop_profiles\" : {\n      \"from\" : \"bundled\"")
        .contains("\"rules\" : {\n      \"from\" : \"bundled\"");
    PackagedJarIT.Run text = PackagedJarIT.javaIn(hostile, "plan", "--farm", farmArg, "--no-audit");
    assertThat(text.out()).containsPattern("crop profiles bundled #[0-9a-f]{12}; rules bundled #[0-9a-f]{12}");
  }
}
