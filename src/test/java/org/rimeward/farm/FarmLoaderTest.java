package org.rimeward.farm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.stream.Stream;
import org.assertj.core.data.Offset;
import org.rimeward.io.BadInputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class FarmLoaderTest {
  @TempDir Path dir;

  // Metric and US spellings of the same farm. Conversion factors are exact by definition, from
  // NIST SP 811 (2008), Appendix B.8/B.9: ft = 0.3048 m; in = 0.0254 m; US gallon = 231 in³ =
  // 3.785411784 L; acre = 43 560 ft² = 4046.8564224 m² and acre-foot = 1233.48183754752 m³ with
  // the international foot (SP 811 lists 4.046 873 E+03 m² and 1.233 489 E+03 m³ for the US
  // survey foot, 2 ppm larger; NIST retired the survey foot in 2023); oz/yd² = 33.905 75 g/m²;
  // t/°C = (t/°F − 32)/1.8 and a difference of 1 °F is 1/1.8 °C.
  static final String METRIC = """
      farm:
        name: Hillside Orchard
        latitude: 46.21
        longitude: -119.76
        elevation: 243.84 m
        timezone: America/Los_Angeles
      forecast: tonight.csv
      policy:
        target: -2C
        start_margin: 1.0C
        stop_rule: wet-bulb-above-target
      water_sources:
        - id: pond
          max_flow: 136.27482422399999 m3/h
          volume: 2466.96367509504 m3
        - id: well
          max_flow: 45.424941408 m3/h
      blocks:
        - id: north-gala
          crop: apple
          variety: gala
          stage: full-bloom
          area: 4.0468564224 ha
          cold_air_offset: -0.5C
          crop_value: 29652.645776059842 per ha
          sprinklers:
            rate: 3.81 mm/h
            source: pond
            water_temp: 8C
        - id: east-berries
          crop: strawberry
          stage: open-blossom
          area: 0.80937128448 ha
          covers:
            fabric: 50.8586205 g/m2
            deploy_hours: 2
        - id: west-cherry
          crop: sweet-cherry
          stage: first-white
          area: 2.0234282112 ha
          sprinklers:
            rate: 3.81 mm/h
            source: well
          covers:
            protection: 2.0C
            deploy_hours: 1.5
      """;

  static final String US = """
      farm:
        name: Hillside Orchard
        latitude: 46.21
        longitude: -119.76
        elevation: 800 ft
        timezone: America/Los_Angeles
      forecast: tonight.csv
      policy:
        target: 28.4F
        start_margin: 1.8F
        stop_rule: wet-bulb-above-target
      water_sources:
        - id: pond
          max_flow: 600 gpm
          volume: 2 acre-ft
        - id: well
          max_flow: 200 gpm
      blocks:
        - id: north-gala
          crop: apple
          variety: gala
          stage: full-bloom
          area: 10 ac
          cold_air_offset: -0.9F
          crop_value: 12000 per ac
          sprinklers:
            rate: 0.15 in/h
            source: pond
            water_temp: 46.4F
        - id: east-berries
          crop: strawberry
          stage: open-blossom
          area: 2 ac
          covers:
            fabric: 1.5 oz/yd2
            deploy_hours: 2
        - id: west-cherry
          crop: sweet-cherry
          stage: first-white
          area: 5 ac
          sprinklers:
            rate: 0.15 in/h
            source: well
          covers:
            protection: 3.6F
            deploy_hours: 1.5
      """;

  private Path write(String name, String yaml) throws IOException {
    Path folder = Files.createDirectories(dir.resolve(name));
    Files.writeString(folder.resolve("farm.yaml"), yaml, StandardCharsets.UTF_8);
    return folder;
  }

  @Test
  void metricFarmReadsToCanonicalValues() throws IOException {
    Path folder = write("metric", METRIC);
    Farm f = FarmLoader.load(folder);
    Offset<Double> tight = within(1e-9);
    assertThat(f.name()).isEqualTo("Hillside Orchard");
    assertThat(f.latitude()).isEqualTo(46.21);
    assertThat(f.longitude()).isEqualTo(-119.76);
    assertThat(f.elevationM()).isCloseTo(243.84, tight);
    assertThat(f.zone()).isEqualTo(ZoneId.of("America/Los_Angeles"));
    assertThat(f.folder()).isEqualTo(folder.toAbsolutePath());
    assertThat(f.forecastFile()).isEqualTo(folder.toAbsolutePath().resolve("tonight.csv"));
    assertThat(f.sourceFile()).isEqualTo(folder.resolve("farm.yaml"));
    assertThat(f.origin()).isEqualTo(new SourceRef(folder.resolve("farm.yaml").toString(), 1));
    assertThat(f.policy().target()).isEqualTo(Target.fixed(-2.0));
    assertThat(f.policy().startMarginC()).isCloseTo(1.0, tight);
    assertThat(f.policy().stopRule()).isEqualTo(StopRule.WET_BULB_ABOVE_TARGET);
    assertThat(f.waterSources()).extracting(WaterSource::id).containsExactly("pond", "well");
    assertThat(f.blocks()).extracting(Block::id).containsExactly("north-gala", "east-berries", "west-cherry");

    Block gala = f.block("north-gala").orElseThrow();
    assertThat(gala.crop()).isEqualTo("apple");
    assertThat(gala.variety()).isEqualTo("gala");
    assertThat(gala.stage()).isEqualTo("full-bloom");
    assertThat(gala.coldAirOffsetC()).isCloseTo(-0.5, tight);
    assertThat(gala.sprinklers().orElseThrow().waterTempC()).isCloseTo(8.0, tight);
    assertThat(gala.covers()).isEmpty();
    assertThat(f.blocksOn("pond")).containsExactly(gala);
    assertThat(f.blocksOn("well")).extracting(Block::id).containsExactly("west-cherry");
    assertThat(f.waterSource("well").orElseThrow().volumeM3()).isEmpty();
    assertThat(f.blocksById().keySet()).containsExactly("north-gala", "east-berries", "west-cherry");
  }

  @Test
  void usFarmGivesTheSameCanonicalValuesAsTheMetricOne() throws IOException {
    Farm m = FarmLoader.load(write("metric", METRIC));
    Farm u = FarmLoader.load(write("us", US));
    Offset<Double> tight = within(1e-9);
    // NIST SP 811 B.8: 800 ft × 0.3048 m/ft.
    assertThat(u.elevationM()).isCloseTo(243.84, tight).isCloseTo(m.elevationM(), tight);
    // (28.4 − 32)/1.8 = −2 °C; 1.8 °F of difference = 1 °C.
    assertThat(u.policy().target().tempC().getAsDouble()).isCloseTo(-2.0, tight);
    assertThat(u.policy().startMarginC()).isCloseTo(1.0, tight);
    assertThat(u.policy()).usingRecursiveComparison().withComparatorForType(
        (a, b) -> Math.abs(a - b) < 1e-9 ? 0 : Double.compare(a, b), Double.class).isEqualTo(m.policy());
    for (int i = 0; i < 2; i++) {
      WaterSource ws = u.waterSources().get(i);
      WaterSource wm = m.waterSources().get(i);
      assertThat(ws.maxFlowM3H()).isCloseTo(wm.maxFlowM3H(), tight);
      assertThat(ws.volumeM3().isPresent()).isEqualTo(wm.volumeM3().isPresent());
    }
    // 600 gpm = 600 × 3.785411784 L/min = 136.274824224 m³/h (NIST SP 811 B.8, gallon).
    assertThat(u.waterSources().get(0).maxFlowM3H()).isCloseTo(136.274824224, tight);
    // 2 acre-ft = 2 × 43 560 ft³ × 0.3048³ = 2466.963675 m³.
    assertThat(u.waterSources().get(0).volumeM3().getAsDouble()).isCloseTo(2466.96367509504, within(1e-6));
    for (int i = 0; i < 3; i++) {
      Block bu = u.blocks().get(i);
      Block bm = m.blocks().get(i);
      assertThat(bu.areaHa()).as(bu.id()).isCloseTo(bm.areaHa(), tight);
      assertThat(bu.coldAirOffsetC()).as(bu.id()).isCloseTo(bm.coldAirOffsetC(), tight);
      assertThat(bu.cropValuePerHa().isPresent()).isEqualTo(bm.cropValuePerHa().isPresent());
      if (bu.cropValuePerHa().isPresent()) {
        assertThat(bu.cropValuePerHa().getAsDouble()).isCloseTo(bm.cropValuePerHa().getAsDouble(), within(1e-6));
      }
      assertThat(bu.sprinklers().isPresent()).isEqualTo(bm.sprinklers().isPresent());
      bu.sprinklers().ifPresent(s -> {
        Sprinklers sm = bm.sprinklers().orElseThrow();
        assertThat(s.rateMmH()).isCloseTo(sm.rateMmH(), tight);
        assertThat(s.sourceId()).isEqualTo(sm.sourceId());
        assertThat(s.waterTempC()).isCloseTo(sm.waterTempC(), tight);
      });
      assertThat(bu.covers().isPresent()).isEqualTo(bm.covers().isPresent());
      bu.covers().ifPresent(c -> {
        Covers cm = bm.covers().orElseThrow();
        assertThat(c.protectionC()).isCloseTo(cm.protectionC(), within(1e-6));
        assertThat(c.deployHours()).isEqualTo(cm.deployHours());
      });
    }
    // 10 ac = 10 × 4046.8564224 m² = 4.0468564224 ha.
    assertThat(u.blocks().get(0).areaHa()).isCloseTo(4.0468564224, tight);
    // 12000 per ac = 12000 / 0.40468564224 ha = 29 652.65 per ha.
    assertThat(u.blocks().get(0).cropValuePerHa().getAsDouble()).isCloseTo(29652.65, within(0.01));
    // 0.15 in/h × 25.4 mm/in = 3.81 mm/h.
    assertThat(u.blocks().get(0).sprinklers().orElseThrow().rateMmH()).isCloseTo(3.81, tight);
    // 3.6 °F of difference = 2.0 °C.
    assertThat(u.blocks().get(2).covers().orElseThrow().protectionC()).isCloseTo(2.0, tight);
  }

  @Test
  void blocksCarryTheLinesOfTheirFields() throws IOException {
    Path folder = write("metric", METRIC);
    Farm f = FarmLoader.load(folder);
    String file = folder.resolve("farm.yaml").toString();
    Block gala = f.block("north-gala").orElseThrow();
    assertThat(gala.origin()).isEqualTo(new SourceRef(file, lineOf(METRIC, "- id: north-gala")));
    assertThat(gala.cropRef()).isEqualTo(new SourceRef(file, lineOf(METRIC, "crop: apple")));
    assertThat(gala.varietyRef()).isEqualTo(new SourceRef(file, lineOf(METRIC, "variety: gala")));
    assertThat(gala.stageRef()).isEqualTo(new SourceRef(file, lineOf(METRIC, "stage: full-bloom")));
    assertThat(gala.lineOf("sprinklers.source").line()).isEqualTo(lineOf(METRIC, "source: pond"));
    assertThat(gala.stageRef().toString()).isEqualTo(file + ":" + lineOf(METRIC, "stage: full-bloom"));
    Block berries = f.block("east-berries").orElseThrow();
    assertThat(berries.variety()).isNull();
    // No variety line: the planner's message points at the crop.
    assertThat(berries.varietyRef()).isEqualTo(berries.cropRef());
  }

  @Test
  void omittedOptionalFieldsTakeTheirDocumentedDefaults() throws IOException {
    String yaml = """
        farm:
          name: Small Farm
          latitude: -33.9
          longitude: 151.2
          elevation: 30 m
          timezone: Australia/Sydney
        water_sources:
          - id: bore
            max_flow: 30 m3/h
        blocks:
          - id: b1
            crop: peach
            stage: first-bloom
            area: 1 ha
            sprinklers:
              rate: 4 mm/h
              source: bore
        """;
    Farm f = FarmLoader.load(write("small", yaml).resolve("farm.yaml"));
    assertThat(f.policy()).isEqualTo(Policy.DEFAULT);
    assertThat(f.policy().target().isT10()).isTrue();
    // No start margin of the farm's own: the rules' default applies (rules/policy/thresholds.drl).
    assertThat(f.policy().startMarginC()).isNaN();
    // UF/IFAS Circular 348: stop when the wet bulb is 32 °F or higher.
    assertThat(f.policy().stopRule()).isEqualTo(StopRule.WET_BULB_ABOVE_FREEZING);
    assertThat(f.forecastFile().getFileName().toString()).isEqualTo("forecast.csv");
    Block b = f.blocks().get(0);
    assertThat(b.coldAirOffsetC()).isZero();
    assertThat(b.cropValuePerHa()).isEmpty();
    assertThat(b.covers()).isEmpty();
    // Common practice / assumption: 5 °C night supply water (inside the 35–45 °F range in
    // Good Fruit Grower, "Frost control options", R. G. Evans).
    assertThat(b.sprinklers().orElseThrow().waterTempC()).isEqualTo(5.0);
    assertThat(f.waterSource("bore").orElseThrow().limited()).isFalse();
  }

  @Test
  void fabricWeightIsMappedWithItsSource() throws IOException {
    Farm f = FarmLoader.load(write("us", US));
    Covers c = f.block("east-berries").orElseThrow().covers().orElseThrow();
    // 1.5 oz/yd² table point: 5 °F (Purdue observed ≈5.5 °F, UGA 3–5 °F; lower figure).
    assertThat(c.protectionC()).isCloseTo(5.0 / 1.8, within(1e-6));
    assertThat(c.protectionSource()).contains("Purdue").contains("UGA").contains("1.5 oz/yd²");
    Covers given = f.block("west-cherry").orElseThrow().covers().orElseThrow();
    assertThat(given.protectionSource()).isEqualTo("given in farm.yaml line " + lineOf(US, "protection: 3.6F"));
  }

  /** A change to the valid metric farm, the line the message must name, and words it must contain. */
  static Stream<Arguments> badFarms() {
    return Stream.of(
        bad("unknown key", "    crop: apple\n", "    crop: apple\n    colour: red\n", "colour: red",
            "blocks[north-gala].colour", "unknown key", "allowed here: id, crop, variety, stage, area"),
        bad("unknown top-level key", "forecast: tonight.csv\n", "forecast: tonight.csv\nforcast: x.csv\n",
            "forcast: x.csv", "forcast", "allowed here: farm, forecast, policy, water_sources, blocks"),
        bad("missing required stage", "    stage: full-bloom\n", "", "- id: north-gala",
            "blocks[north-gala]", "'stage' is required"),
        bad("missing area", "    area: 0.80937128448 ha\n", "", "- id: east-berries",
            "'area' is required", "4.5 ha or 11 ac"),
        bad("missing time zone", "  timezone: America/Los_Angeles\n", "", "farm:",
            "'timezone' is required", "America/Los_Angeles"),
        bad("latitude out of range", "latitude: 46.21", "latitude: 96.21", "latitude: 96.21",
            "farm.latitude", "'96.21'", "outside -90 to 90"),
        bad("latitude with letters", "latitude: 46.21", "latitude: 46.21 N", "latitude: 46.21 N",
            "farm.latitude", "'46.21 N' is not a number"),
        bad("longitude out of range", "longitude: -119.76", "longitude: -199.76", "longitude: -199.76",
            "farm.longitude", "outside -180 to 180"),
        bad("unknown time zone", "America/Los_Angeles", "America/Los_Angles", "timezone:",
            "farm.timezone", "'America/Los_Angles' is not an IANA time zone", "Region/City"),
        bad("time zone in wrong case", "America/Los_Angeles", "america/los_angeles", "timezone:",
            "did you mean America/Los_Angeles?"),
        bad("fixed offset instead of a zone", "America/Los_Angeles", "'-08:00'", "timezone:",
            "not an IANA time zone", "daylight-saving"),
        bad("duplicate block id", "- id: east-berries", "- id: north-gala", "- id: north-gala\n    crop: strawberry",
            "blocks[north-gala].id", "already the id of the block on line " + lineOf(METRIC, "- id: north-gala")),
        bad("duplicate source id", "- id: well", "- id: pond", "- id: pond\n    max_flow: 45.424941408",
            "water_sources[pond].id", "already the id of the water source on line " + lineOf(METRIC, "- id: pond")),
        bad("sprinkler source not among sources", "source: pond", "source: creek", "source: creek",
            "blocks[north-gala].sprinklers.source", "'creek' is not among water_sources", "pond, well"),
        bad("zero area", "area: 4.0468564224 ha", "area: 0 ha", "area: 0 ha",
            "blocks[north-gala].area", "'0 ha' must be above 0"),
        bad("negative area", "area: 4.0468564224 ha", "area: -4.5 ha", "area: -4.5 ha",
            "'-4.5 ha' must be above 0"),
        bad("zero rate", "rate: 3.81 mm/h\n      source: pond", "rate: 0 mm/h\n      source: pond", "rate: 0 mm/h",
            "blocks[north-gala].sprinklers.rate", "'0 mm/h' must be above 0"),
        bad("rate written in the wrong unit", "rate: 3.81 mm/h\n      source: pond",
            "rate: 0.15 mm/h\n      source: pond", "rate: 0.15 mm/h", "outside 1 to 25 mm/h", "check the unit"),
        bad("zero flow", "max_flow: 45.424941408 m3/h", "max_flow: 0 gpm", "max_flow: 0 gpm",
            "water_sources[well].max_flow", "'0 gpm' must be above 0"),
        bad("negative flow", "max_flow: 45.424941408 m3/h", "max_flow: -5 m3/h", "max_flow: -5 m3/h",
            "must be above 0"),
        bad("zero volume", "volume: 2466.96367509504 m3", "volume: 0 m3", "volume: 0 m3",
            "water_sources[pond].volume", "leave volume out for a well"),
        bad("unknown stop rule", "stop_rule: wet-bulb-above-target", "stop_rule: when-ice-melts",
            "stop_rule:", "policy.stop_rule", "'when-ice-melts' is not a stop rule",
            "wet-bulb-above-freezing, wet-bulb-above-target"),
        bad("unknown target", "target: -2C", "target: t90", "target: t90", "policy.target",
            "'t90' is neither t10 nor a temperature", "-1.5C"),
        bad("bare-number target", "target: -2C", "target: -2", "target: -2", "policy.target",
            "neither t10 nor a temperature"),
        bad("deploy hours above 12", "deploy_hours: 2", "deploy_hours: 13", "deploy_hours: 13",
            "blocks[east-berries].covers.deploy_hours", "'13' is outside 0 to 12 hours"),
        bad("negative deploy hours", "deploy_hours: 2", "deploy_hours: -1", "deploy_hours: -1",
            "outside 0 to 12 hours"),
        bad("deploy hours with a word", "deploy_hours: 2", "deploy_hours: two", "deploy_hours: two",
            "'two' is not a number"),
        bad("crop value without area unit", "crop_value: 29652.645776059842 per ha", "crop_value: 30000",
            "crop_value: 30000", "blocks[north-gala].crop_value", "'30000' is not a value per area",
            "30000 per ha or 12000 per ac"),
        bad("crop value per square metre", "crop_value: 29652.645776059842 per ha", "crop_value: 3 per m2",
            "crop_value: 3 per m2", "not a value per area"),
        bad("negative crop value", "crop_value: 29652.645776059842 per ha", "crop_value: -5 per ha",
            "crop_value: -5 per ha", "must be 0 or more"),
        bad("bare number for a quantity", "elevation: 243.84 m", "elevation: 240", "elevation: 240",
            "farm.elevation: '240' has no unit; write it as 240 m or 800 ft"),
        bad("unknown unit", "area: 4.0468564224 ha", "area: 4 hectars", "area: 4 hectars",
            "blocks[north-gala].area: unit 'hectars'", "4.5 ha or 11 ac"),
        bad("fabric too heavy", "fabric: 50.8586205 g/m2", "fabric: 3 oz/yd2", "fabric: 3 oz/yd2",
            "blocks[east-berries].covers.fabric", "outside the fabric weights", "protection: 2.0C"),
        bad("fabric too light", "fabric: 50.8586205 g/m2", "fabric: 10 g/m2", "fabric: 10 g/m2",
            "17.0 to 67.8 g/m²"),
        bad("protection and fabric both", "fabric: 50.8586205 g/m2", "fabric: 50 g/m2\n      protection: 2C",
            "fabric: 50 g/m2", "either protection or fabric, not both"),
        bad("covers with neither", "      fabric: 50.8586205 g/m2\n", "", "covers:\n      deploy_hours: 2",
            "blocks[east-berries].covers", "needs protection"),
        bad("zero protection", "protection: 2.0C", "protection: 0C", "protection: 0C",
            "must be above 0 and at most 6 °C"),
        bad("duplicate key", "    variety: gala\n", "    variety: gala\n    variety: fuji\n", "variety: fuji",
            "'variety' is given twice in the same mapping (first on line " + lineOf(METRIC, "variety: gala") + ")"),
        bad("empty value", "variety: gala", "variety:", "variety:", "blocks[north-gala].variety",
            "expected a value, found nothing"),
        bad("bad block id", "- id: north-gala", "- id: north gala!", "- id: north gala!",
            "'north gala!' is not a usable id"),
        bad("start margin out of range", "start_margin: 1.0C", "start_margin: 9C", "start_margin: 9C",
            "policy.start_margin", "outside 0 to 5 °C"),
        bad("water temperature frozen", "water_temp: 8C", "water_temp: 20F", "water_temp: 20F",
            "blocks[north-gala].sprinklers.water_temp", "outside 0 to 40 °C"),
        bad("cold-air offset too large", "cold_air_offset: -0.5C", "cold_air_offset: -15C",
            "cold_air_offset: -15C", "outside -10 to 10 °C"),
        bad("elevation out of range", "elevation: 243.84 m", "elevation: 9000 m", "elevation: 9000 m",
            "outside -420 to 4500 m"),
        bad("not YAML", "  name: Hillside Orchard\n", "  name: Hillside Orchard\n   bad indent: [\n",
            "bad indent", "not valid YAML"),
        // Issue 14's bad inputs: each names the file, the line, the field and what to write.
        bad("block area that is surely a typo", "area: 4.0468564224 ha", "area: 4500 ha", "area: 4500 ha",
            "blocks[north-gala].area", "'4500 ha' (4500 ha) is more than 1000 ha", "decimal point"),
        bad("infinite area", "area: 4.0468564224 ha", "area: 1e999 ha", "area: 1e999 ha",
            "blocks[north-gala].area", "not a finite number"),
        bad("area written as YAML infinity", "area: 4.0468564224 ha", "area: .inf", "area: .inf",
            "blocks[north-gala].area", "is not a quantity"),
        bad("flow no pump delivers", "max_flow: 45.424941408 m3/h", "max_flow: 4.5e6 m3/h",
            "max_flow: 4.5e6 m3/h", "water_sources[well].max_flow", "more than 20000 m3/h"),
        bad("volume no reservoir holds", "volume: 2466.96367509504 m3", "volume: 9e12 m3",
            "volume: 9e12 m3", "water_sources[pond].volume", "more than 50000000 m3"),
        bad("millilitres are not megalitres", "volume: 2466.96367509504 m3", "volume: 9 ml",
            "volume: 9 ml", "water_sources[pond].volume", "unit 'ml'", "9 ML"),
        bad("decimal comma in a quantity", "cold_air_offset: -0.5C", "cold_air_offset: -2,5C",
            "cold_air_offset: -2,5C", "blocks[north-gala].cold_air_offset", "use a decimal point"),
        bad("Kelvin below absolute zero", "water_temp: 8C", "water_temp: -5K", "water_temp: -5K",
            "blocks[north-gala].sprinklers.water_temp", "below absolute zero"),
        bad("tab indentation", "  latitude: 46.21", "\tlatitude: 46.21", "latitude: 46.21",
            "indented with a tab", "spaces"),
        bad("escape character in the farm name", "name: Hillside Orchard", "name: \"Hill\\e[31mside\"",
            "name: \"Hill", "farm.name", "control character U+001B"));
  }

  private static Arguments bad(String label, String find, String replace, String lineFragment, String... words) {
    return Arguments.of(label, find, replace, lineFragment, List.of(words));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("badFarms")
  void badFarmFileIsRefusedWithFileLineFieldAndRemedy(String label, String find, String replace,
      String lineFragment, List<String> words) throws IOException {
    assertThat(METRIC).as("test setup for " + label).contains(find);
    String yaml = METRIC.replaceFirst(java.util.regex.Pattern.quote(find),
        java.util.regex.Matcher.quoteReplacement(replace));
    Path folder = write("bad", yaml);
    int line = lineOf(yaml, lineFragment);
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .satisfies(e -> {
          assertThat(e.getMessage()).startsWith(folder.resolve("farm.yaml") + ":" + line + ": ");
          for (String w : words) {
            assertThat(e.getMessage()).contains(w);
          }
        });
  }

  @Test
  void everyProblemInTheFileIsReportedAtOnce() throws IOException {
    String yaml = METRIC.replace("latitude: 46.21", "latitude: 96.21")
        .replace("area: 4.0468564224 ha", "area: 0 ha")
        .replace("deploy_hours: 2", "deploy_hours: two");
    Path folder = write("many", yaml);
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .satisfies(e -> assertThat(e.getMessage().lines().toList()).hasSize(3)
            .anySatisfy(l -> assertThat(l).contains(":" + lineOf(yaml, "latitude: 96.21") + ": farm.latitude"))
            .anySatisfy(l -> assertThat(l).contains(":" + lineOf(yaml, "area: 0 ha") + ": blocks[north-gala].area"))
            .anySatisfy(l -> assertThat(l).contains(":" + lineOf(yaml, "deploy_hours: two") + ": blocks[east-berries]")));
  }

  @Test
  void typographicMinusFromAWordProcessorIsAMinus() throws IOException {
    Farm f = FarmLoader.load(write("minus", METRIC.replace("cold_air_offset: -0.5C", "cold_air_offset: \u22120.5C")
        .replace("longitude: -119.76", "longitude: \u2212119.76")));
    assertThat(f.block("north-gala").orElseThrow().coldAirOffsetC()).isEqualTo(-0.5);
    assertThat(f.longitude()).isEqualTo(-119.76);
  }

  @Test
  void yamlMergeKeysShareSettingsBetweenBlocks() throws IOException {
    String yaml = METRIC.replace("""
            sprinklers:
              rate: 3.81 mm/h
              source: pond
              water_temp: 8C
        """, """
            sprinklers: &pond-set
              rate: 3.81 mm/h
              source: pond
              water_temp: 8C
        """).replace("""
            sprinklers:
              rate: 3.81 mm/h
              source: well
        """, """
            sprinklers:
              <<: *pond-set
              source: well
        """);
    assertThat(yaml).contains("<<: *pond-set");
    Farm f = FarmLoader.load(write("merge", yaml));
    Sprinklers s = f.block("west-cherry").orElseThrow().sprinklers().orElseThrow();
    assertThat(s.sourceId()).as("a key beside the merge wins").isEqualTo("well");
    assertThat(s.rateMmH()).isEqualTo(3.81);
    assertThat(s.waterTempC()).as("merged from the anchor").isEqualTo(8.0);
  }

  @Test
  void farmFileThatIsNotUtf8SaysSoWithItsLine() throws IOException {
    Path folder = dir.resolve("latin1");
    Files.createDirectories(folder);
    Files.write(folder.resolve("farm.yaml"), METRIC.replace("Hillside Orchard", "Verger du Coteau \u00e9t\u00e9")
        .getBytes(StandardCharsets.ISO_8859_1));
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(folder.resolve("farm.yaml") + ":" + lineOf(METRIC, "name: Hillside") + ": not UTF-8")
        .hasMessageContaining("save the file as UTF-8");
  }

  @Test
  void byteOrderMarkIsDropped() throws IOException {
    Farm f = FarmLoader.load(write("bom", "\uFEFF" + METRIC));
    assertThat(f.name()).isEqualTo("Hillside Orchard");
  }

  @Test
  void emptyBlockListIsRefused() throws IOException {
    String yaml = METRIC.substring(0, METRIC.indexOf("blocks:")) + "blocks: []\n";
    Path folder = write("empty", yaml);
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(folder.resolve("farm.yaml") + ":" + lineOf(yaml, "blocks: []"))
        .hasMessageContaining("the list is empty");
  }

  @Test
  void blocksMustBeAList() throws IOException {
    String yaml = METRIC.substring(0, METRIC.indexOf("blocks:")) + "blocks: none\n";
    Path folder = write("notalist", yaml);
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(folder.resolve("farm.yaml") + ":" + lineOf(yaml, "blocks: none") + ": blocks:")
        .hasMessageContaining("expected a list ('- ' items), found 'none'");
  }

  @Test
  void sprinklersWithNoWaterSourcesSayToAddOne() throws IOException {
    String yaml = METRIC.replaceAll("(?s)water_sources:.*?blocks:", "blocks:");
    Path folder = write("nowater", yaml);
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining(":" + lineOf(yaml, "source: pond") + ": ")
        .hasMessageContaining("the farm has no water_sources; add one");
  }

  @Test
  void missingFarmFileSaysWhereItLooked() {
    assertThatThrownBy(() -> FarmLoader.load(dir))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(dir.resolve("farm.yaml").toString())
        .hasMessageContaining("has no farm.yaml");
    assertThatThrownBy(() -> FarmLoader.load(dir.resolve("nowhere.yaml")))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("no such farm file");
  }

  @Test
  void emptyFileIsRefused() throws IOException {
    Path folder = write("blank", "");
    assertThatThrownBy(() -> FarmLoader.load(folder))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("the file is empty");
  }

  /** The 1-based line of the first line containing {@code fragment} (fragments may span lines). */
  static int lineOf(String text, String fragment) {
    int at = text.indexOf(fragment);
    if (at < 0) {
      throw new IllegalArgumentException("not in text: " + fragment);
    }
    return (int) text.substring(0, at).chars().filter(c -> c == '\n').count() + 1;
  }
}
