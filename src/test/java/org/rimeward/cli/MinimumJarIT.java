package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The site-minimum fit from the packaged jar: Commons Math must be inside it. */
class MinimumJarIT {
  @Test
  void fitsTheDemoHistoryAndPredicts(@TempDir Path tmp) throws Exception {
    Path farm = tmp.resolve("demo-farm");
    Files.createDirectories(farm);
    for (String f : new String[] {"farm.yaml", "forecast.csv", "station-history.csv"}) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    PackagedJarIT.Run fit = PackagedJarIT.javaIn(tmp, "minimum", "fit", "--farm", "demo-farm",
        "--history", "demo-farm/station-history.csv");
    assertThat(fit.exit()).as(fit.err()).isZero();
    assertThat(fit.out()).contains("19 radiation nights of 36");
    PackagedJarIT.Run p = PackagedJarIT.javaIn(tmp, "minimum", "predict", "--farm", "demo-farm",
        "--temp", "5.5", "--dew-point", "-2", "--json");
    assertThat(p.exit()).as(p.err()).isZero();
    assertThat(p.out()).contains("\"min_air_c\":-0.5");
  }
}
