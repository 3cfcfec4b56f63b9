package org.rimeward.farm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

/**
 * farm.yaml's {@code stations:}: which thermometer stands for which block, read and checked like
 * every farm field, each problem with its line. Farms and heights are invented.
 */
class StationsTest {
  @TempDir Path dir;

  static final String FARM = """
      farm:
        name: Test Bench
        latitude: 46.2
        longitude: -119.4
        elevation: 240 m
        timezone: America/Los_Angeles
      blocks:
        - id: hill-apple
          crop: apple
          stage: full-bloom
          area: 2 ha
        - id: hollow-cherry
          crop: sweet-cherry
          stage: full-bloom
          area: 1 ha
          cold_air_offset: -1.0C
        - id: low-berries
          crop: strawberry
          stage: open-blossom
          area: 0.5 ha
      """;

  private Farm load(String stations) throws Exception {
    Path f = dir.resolve("farm.yaml");
    Files.writeString(f, FARM + stations);
    return FarmLoader.load(f);
  }

  private String problems(String stations) {
    return assertThatThrownBy(() -> load(stations)).isInstanceOf(BadInputException.class)
        .actual().getMessage();
  }

  @Test
  void eachBlockHasItsListedStationElseTheDefault() throws Exception {
    Farm farm = load("""
        stations:
          - id: mast
            height: 5 ft
            default: true
          - id: hollow
            height: 1.0 m
            bud_height: 0.8 m
            blocks: [hollow-cherry]
          - id: bed
            height: 0.2 m
            blocks:
              - low-berries
        """);
    assertThat(farm.stations()).extracting(Station::id).containsExactly("mast", "hollow", "bed");
    // 5 ft = 1.524 m (NIST SP 811: ft = 0.3048 m exactly).
    assertThat(farm.station("mast").orElseThrow().heightM()).isCloseTo(1.524, within(1e-9));
    assertThat(farm.station("mast").orElseThrow().budHeightM()).isEmpty();
    assertThat(farm.station("hollow").orElseThrow().budHeightM().getAsDouble()).isEqualTo(0.8);
    assertThat(farm.stationOf("hill-apple").orElseThrow().id()).isEqualTo("mast");
    assertThat(farm.listedStation("hill-apple")).isEmpty();
    assertThat(farm.stationOf("hollow-cherry").orElseThrow().id()).isEqualTo("hollow");
    assertThat(farm.listedStation("low-berries").orElseThrow().id()).isEqualTo("bed");
  }

  @Test
  void aSingleStationIsTheDefaultWithoutSayingSo() throws Exception {
    Farm farm = load("stations:\n  - id: mast\n    height: 1.5 m\n    blocks: [hill-apple]\n");
    assertThat(farm.defaultStation().orElseThrow().id()).isEqualTo("mast");
    assertThat(farm.stationOf("low-berries").orElseThrow().id()).isEqualTo("mast");
    assertThat(farm.listedStation("low-berries")).isEmpty();
  }

  @Test
  void noStationsSectionNoStations() throws Exception {
    Farm farm = load("");
    assertThat(farm.stations()).isEmpty();
    assertThat(farm.stationOf("hill-apple")).isEmpty();
  }

  @Test
  void everyProblemIsReportedAtOnceWithItsLine() {
    String m = problems("""
        stations:
          - id: mast
            height: 1.5 m
            default: true
            blocks: [hill-apple, north-pear]
          - id: mast
            height: 25 m
            blocks: [hill-apple]
          - id: hollow
            height: 1.2
            bud_height: 0 m
            default: maybe
            colour: red
        """);
    // FARM is 20 lines; the stations start on line 21.
    assertThat(m).contains("farm.yaml:25: stations[mast].blocks: 'north-pear' is not a block of"
        + " this farm; blocks: hill-apple, hollow-cherry, low-berries");
    assertThat(m).contains("farm.yaml:26: stations[mast].id: 'mast' is already the id of the"
        + " station on line 22");
    assertThat(m).contains("farm.yaml:27: stations[mast].height: '25 m' (25.00 m) is outside 0 to"
        + " 10 m");
    assertThat(m).contains("farm.yaml:28: stations[mast].blocks: 'hill-apple' is already listed"
        + " under this station");
    assertThat(m).contains("farm.yaml:30: stations[hollow].height:").contains("unit");
    assertThat(m).contains("farm.yaml:31: stations[hollow].bud_height: '0 m' (0.00 m) is outside");
    assertThat(m).contains("farm.yaml:32: stations[hollow].default: 'maybe' is not true or false");
    assertThat(m).contains("farm.yaml:33: stations[hollow].colour: unknown key");
  }

  @Test
  void aBlockClaimedByTwoStationsNamesTheOther() {
    assertThat(problems("""
        stations:
          - id: mast
            height: 1.5 m
            default: true
            blocks: [hollow-cherry]
          - id: hollow
            height: 1.0 m
            blocks: [hollow-cherry]
        """)).contains("farm.yaml:28: stations[hollow].blocks: 'hollow-cherry' is already listed"
            + " under station 'mast'");
  }

  @Test
  void twoDefaultsAreOneTooMany() {
    assertThat(problems("""
        stations:
          - id: mast
            height: 1.5 m
            default: true
          - id: shed
            height: 1.5 m
            default: yes
        """)).contains("farm.yaml:27: stations[shed].default: station 'mast' (line 24) is already"
            + " the default; mark one station default: true");
  }

  @Test
  void withSeveralStationsAndNoDefaultEveryBlockNeedsOne() {
    String m = problems("""
        stations:
          - id: hollow
            height: 1.0 m
            blocks: [hollow-cherry]
          - id: bed
            height: 0.2 m
        """);
    assertThat(m).contains("stations: blocks hill-apple, low-berries have no station; list them"
        + " under a station's blocks, or mark one station default: true");
    assertThat(m).contains("farm.yaml:25: stations[bed]: stands for no block");
  }

  @Test
  void anEmptyListIsSaid() {
    assertThat(problems("stations: []\n")).contains("stations: the list is empty");
  }
}
