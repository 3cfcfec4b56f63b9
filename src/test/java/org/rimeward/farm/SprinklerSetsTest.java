package org.rimeward.farm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

/** Irrigation sets under a block's sprinklers in farm.yaml. Invented farm. */
class SprinklerSetsTest {
  @TempDir Path dir;

  static final String FARM = """
      farm:
        name: Set Farm
        latitude: -33.9
        longitude: 18.9
        elevation: 200 m
        timezone: Africa/Johannesburg
      water_sources:
        - id: bore
          max_flow: 90 m3/h
      blocks:
        - id: cherry
          crop: sweet-cherry
          stage: full-bloom
          area: 2.5 ha
          sprinklers:
            rate: 4.0 mm/h
            source: bore
            sets:
              - id: top
                area: 1.0 ha
                flow: 41 m3/h
              - id: bottom
                area: 3.7 ac
      """;

  private Path write(String yaml) throws IOException {
    Path farm = dir.resolve("farm");
    Files.createDirectories(farm);
    Files.writeString(farm.resolve("farm.yaml"), yaml, StandardCharsets.UTF_8);
    return farm;
  }

  @Test
  void setsAreReadWithTheirAreasAndFlows() throws IOException {
    Sprinklers s = FarmLoader.load(write(FARM)).block("cherry").orElseThrow().sprinklers().orElseThrow();
    assertThat(s.sets()).extracting(SprinklerSet::id).containsExactly("top", "bottom");
    assertThat(s.sets().get(0).flowM3H()).isCloseTo(41, within(1e-9));
    // 3.7 ac × 0.40468564224 ha/ac (NIST SP 811) = 1.4973 ha; with no flow given, the block's
    // 4.0 mm/h over it: 4.0 × 1.4973 × 10 = 59.89 m³/h.
    assertThat(s.sets().get(1).areaHa()).isCloseTo(1.49733687629, within(1e-9));
    assertThat(s.sets().get(1).flowM3H()).isCloseTo(59.8934750515, within(1e-6));
  }

  @Test
  void aBlockWithoutSetsHasNone() throws IOException {
    String yaml = FARM.substring(0, FARM.indexOf("      sets:"));
    assertThat(FarmLoader.load(write(yaml)).block("cherry").orElseThrow().sprinklers().orElseThrow().sets())
        .isEmpty();
  }

  @Test
  void setsLargerThanTheBlockAreRefused() throws IOException {
    Path farm = write(FARM.replace("area: 1.0 ha", "area: 1.1 ha"));
    assertThatThrownBy(() -> FarmLoader.load(farm)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("farm.yaml:")
        .hasMessageContaining("blocks[cherry].sprinklers.sets")
        .hasMessageContaining("2.60 ha, more than the block's 2.50 ha");
  }

  @Test
  void twoSetsWithOneIdAreRefused() throws IOException {
    Path farm = write(FARM.replace("id: bottom", "id: top"));
    assertThatThrownBy(() -> FarmLoader.load(farm)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("already the id of the set on line");
  }

  @Test
  void aSetWithoutUnitOrWithZeroFlowIsRefused() throws IOException {
    Path noUnit = write(FARM.replace("flow: 41 m3/h", "flow: 41"));
    assertThatThrownBy(() -> FarmLoader.load(noUnit)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("flow").hasMessageContaining("no unit");
    Path zero = write(FARM.replace("flow: 41 m3/h", "flow: 0 m3/h"));
    assertThatThrownBy(() -> FarmLoader.load(zero)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("must be above 0");
  }
}
