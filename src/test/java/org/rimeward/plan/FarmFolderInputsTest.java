package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.units.UnitSystem;

/**
 * The farm folder is the unit: its own crop profiles and rules (named in farm.yaml, or beside
 * it), else the bundled ones; options override; the plan names what it used with a digest.
 */
class FarmFolderInputsTest {
  @TempDir Path tmp;

  static Plan plan(Path farm, Path profiles, Path rules) {
    return new NightPlanner().plan(new PlanRequest(farm, null, profiles, rules, null));
  }

  @Test
  void withoutFoldersOfItsOwnTheFarmUsesTheBundledOnesAndSaysSo() {
    Path farm = TestFarms.copyDemo(tmp);
    Plan p = plan(farm, null, null);
    assertThat(p.inputs().cropProfiles().origin()).isEqualTo(PlanInputs.Origin.BUNDLED);
    assertThat(p.inputs().rules().shown()).isEqualTo("(bundled)");
    assertThat(p.inputs().cropProfiles().sha256())
        .isEqualTo(PlanInputs.digest(p.inputs().files(), PlanInputs.Kind.CROP_PROFILE));
    String text = PlanText.render(p, UnitSystem.METRIC, false);
    assertThat(text).containsPattern("Inputs: forecast forecast.csv \\(csv\\); crop profiles bundled"
        + " #[0-9a-f]{12}; rules bundled #[0-9a-f]{12}\n");
    assertThat(PlanJson.toTree(p).path("inputs").path("rules").path("from").asText()).isEqualTo("bundled");
  }

  @Test
  void aFarmsOwnProfilesBesideItAreUsedAndChangeThePlan() throws IOException {
    Path farm = TestFarms.copyDemo(tmp);
    Path own = copy(BundledData.bundled("crop-profiles"), farm.resolve("crop-profiles"));
    Path cherry = own.resolve("sweet-cherry.yaml");
    Plan before = plan(farm, null, null);
    double t10 = block(before, "hollow-cherry").t10C();
    // A more tender full-bloom T10 in the farm's copy: the plan must take it from there.
    String yaml = Files.readString(cherry);
    assertThat(yaml).contains("full-bloom");
    Files.writeString(cherry, yaml.replaceFirst("(?s)(id: full-bloom.*?t10: )[^\\n#]+", "$1-2.0C"));
    Plan after = plan(farm, null, null);
    assertThat(after.inputs().cropProfiles().origin()).isEqualTo(PlanInputs.Origin.FARM_FOLDER);
    assertThat(after.inputs().cropProfiles().shown()).isEqualTo("crop-profiles");
    assertThat(after.inputs().cropProfiles().sha256()).isNotEqualTo(before.inputs().cropProfiles().sha256());
    assertThat(block(after, "hollow-cherry").t10C()).isCloseTo(-2.0, within(1e-9)).isNotEqualTo(t10);
    assertThat(PlanText.render(after, UnitSystem.METRIC, false))
        .contains("crop profiles crop-profiles (farm folder) #" + after.inputs().cropProfiles().shortHash());
  }

  @Test
  void farmYamlMayNameItsFoldersRelativeToItselfAndOptionsStillOverride() throws IOException {
    Path farm = TestFarms.copyDemo(tmp);
    copy(BundledData.bundled("crop-profiles"), tmp.resolve("shared/profiles"));
    copy(BundledData.bundled("rules"), tmp.resolve("shared/rules"));
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(farm.resolve("farm.yaml"))
        .replace("forecast: forecast.csv", "forecast: forecast.csv\ncrop_profiles: ../shared/profiles\nrules: ../shared/rules"));
    Plan p = plan(farm, null, null);
    assertThat(p.inputs().cropProfiles().origin()).isEqualTo(PlanInputs.Origin.FARM_FILE);
    assertThat(p.inputs().rules().origin()).isEqualTo(PlanInputs.Origin.FARM_FILE);
    assertThat(p.inputs().rules().shown()).endsWith("shared/rules");
    Plan bundled = plan(TestFarms.copyDemo(tmp.resolve("other")), null, null);
    assertThat(p.inputs().rules().sha256()).isEqualTo(bundled.inputs().rules().sha256());
    Plan overridden = plan(farm, TestFarms.CROPS, TestFarms.RULES);
    assertThat(overridden.inputs().cropProfiles().origin()).isEqualTo(PlanInputs.Origin.OPTION);
    assertThat(overridden.inputs().rules().shown()).isEqualTo("rules");
  }

  @Test
  void aFolderFarmYamlNamesThatIsMissingIsBadInputWithItsLine() throws IOException {
    Path farm = TestFarms.copyDemo(tmp);
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(farm.resolve("farm.yaml"))
        .replace("forecast: forecast.csv", "forecast: forecast.csv\nrules: my-rules"));
    assertThatThrownBy(() -> plan(farm, null, null)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("farm.yaml:11: rules:").hasMessageContaining("is not a folder");
  }

  private static BlockPlan block(Plan p, String id) {
    return p.blocks().stream().filter(b -> b.blockId().equals(id)).findFirst().orElseThrow();
  }

  private static Path copy(Path from, Path to) throws IOException {
    try (Stream<Path> walk = Files.walk(from)) {
      for (Path p : walk.toList()) {
        Path target = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    }
    return to;
  }
}
