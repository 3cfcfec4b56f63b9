package org.rimeward.weather;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

/**
 * The weather services' formats, read from small responses written in each service's documented
 * structure with invented values: the demo night's forecast, the same numbers as demo-farm's CSV.
 * Unit factors are exact definitions (1 km/h = 1/3.6 m/s; 1 mph = 0.44704 m/s; 1 kn = 1852/3600
 * m/s; °F = °C × 1.8 + 32).
 */
class ServiceFormatsTest {
  static final Path DIR = Path.of("src/test/resources/forecasts");
  static final Path CSV = Path.of("demo-farm/forecast.csv");
  static final ZoneId LA = ZoneId.of("America/Los_Angeles");
  static final Site FARM = new Site(46.28, -119.45, LA);
  static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path tmp;

  static Forecast read(Path p) {
    return ForecastFiles.readWithContent(p, FARM).value();
  }

  @Test
  void eachServiceGivesTheCsvsStepsAtTheCsvsTimes() {
    Forecast csv = read(CSV);
    assertThat(csv.format()).isEqualTo(ForecastFormat.CSV);
    for (String name : List.of("open-meteo", "nws-gridpoint", "met-norway")) {
      Forecast f = read(DIR.resolve("demo-night-" + name + ".json"));
      assertThat(f.format().id()).isEqualTo(name.replace("-gridpoint", ""));
      assertThat(f.steps()).as(name).hasSize(csv.steps().size());
      for (int i = 0; i < csv.steps().size(); i++) {
        ForecastStep a = csv.steps().get(i);
        ForecastStep b = f.steps().get(i);
        assertThat(b.time()).as("%s step %d", name, i).isEqualTo(a.time());
        assertThat(b.airTempC()).isCloseTo(a.airTempC(), within(1e-9));
        assertThat(b.dewPointC()).isCloseTo(a.dewPointC(), within(1e-9));
        // Wind was written in km/h to 0.01: 0.005 km/h is 0.0014 m/s.
        assertThat(b.windMs()).as("%s wind step %d", name, i).isCloseTo(a.windMs(), within(0.002));
        assertThat(b.cloudPct()).isCloseTo(a.cloudPct(), within(1e-9));
        assertThat(b.windHeightM()).isEqualTo(10.0);
      }
    }
  }

  @Test
  void openMeteoWindAndTemperatureInEveryUnitItOffers() throws IOException {
    Forecast base = read(DIR.resolve("demo-night-open-meteo.json"));
    record Variant(String tempUnit, String windUnit, double windPerMs) {}
    for (Variant v : List.of(new Variant("°F", "mp/h", 1 / 0.44704), new Variant("°C", "m/s", 1),
        new Variant("°F", "kn", 3600 / 1852.0), new Variant("°C", "km/h", 3.6))) {
      ObjectNode root = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
      ObjectNode units = (ObjectNode) root.path("hourly_units");
      units.put("temperature_2m", v.tempUnit()).put("dew_point_2m", v.tempUnit())
          .put("wind_speed_10m", v.windUnit());
      ObjectNode hourly = (ObjectNode) root.path("hourly");
      for (int i = 0; i < base.steps().size(); i++) {
        ForecastStep s = base.steps().get(i);
        boolean f = v.tempUnit().equals("°F");
        ((ArrayNode) hourly.path("temperature_2m")).set(i, f ? s.airTempC() * 1.8 + 32 : s.airTempC());
        ((ArrayNode) hourly.path("dew_point_2m")).set(i, f ? s.dewPointC() * 1.8 + 32 : s.dewPointC());
        ((ArrayNode) hourly.path("wind_speed_10m")).set(i, s.windMs() * v.windPerMs());
      }
      Forecast read = read(write("om-" + v.windUnit().replace('/', '_') + ".json", root));
      for (int i = 0; i < base.steps().size(); i++) {
        assertThat(read.steps().get(i).airTempC()).as(v.toString()).isCloseTo(base.steps().get(i).airTempC(), within(1e-9));
        assertThat(read.steps().get(i).dewPointC()).isCloseTo(base.steps().get(i).dewPointC(), within(1e-9));
        assertThat(read.steps().get(i).windMs()).as(v.toString()).isCloseTo(base.steps().get(i).windMs(), within(1e-9));
      }
    }
  }

  @Test
  void nwsUnitCodesConvert() throws IOException {
    ObjectNode root = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-nws-gridpoint.json").toFile());
    ObjectNode temp = (ObjectNode) root.path("properties").path("temperature");
    temp.put("uom", "wmoUnit:degF");
    for (var v : temp.path("values")) {
      ((ObjectNode) v).put("value", v.path("value").asDouble() * 1.8 + 32);
    }
    ObjectNode wind = (ObjectNode) root.path("properties").path("windSpeed");
    wind.put("uom", "wmoUnit:m_s-1");
    for (var v : wind.path("values")) {
      ((ObjectNode) v).put("value", v.path("value").asDouble() / 3.6);
    }
    Forecast base = read(DIR.resolve("demo-night-nws-gridpoint.json"));
    Forecast f = read(write("nws-f.json", root));
    for (int i = 0; i < base.steps().size(); i++) {
      assertThat(f.steps().get(i).airTempC()).isCloseTo(base.steps().get(i).airTempC(), within(1e-9));
      assertThat(f.steps().get(i).windMs()).isCloseTo(base.steps().get(i).windMs(), within(1e-9));
    }
    temp.put("uom", "wmoUnit:degR");
    Path bad = write("nws-r.json", root);
    assertThatThrownBy(() -> read(bad)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("nws-r.json").hasMessageContaining("properties.temperature.uom")
        .hasMessageContaining("wmoUnit:degR").hasMessageContaining("wmoUnit:degC");
  }

  @Test
  void nwsIntervalsAreSpreadOverTheHoursAndReportedWhenCoarse() throws IOException {
    Forecast f = read(DIR.resolve("demo-night-nws-gridpoint.json"));
    assertThat(f.coarse()).extracting(CoarseSpan::property).contains("skyCover", "windSpeed")
        .doesNotContain("temperature", "dewpoint");
    assertThat(f.coarse()).anyMatch(c -> c.property().equals("skyCover")
        && c.length().equals(Duration.ofHours(6)) && !c.interpolated());
    // A 3-hour temperature interval: linear between the starts of this interval and the next.
    ObjectNode root = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-nws-gridpoint.json").toFile());
    ArrayNode temps = (ArrayNode) root.path("properties").path("temperature").path("values");
    // 22:00 local (05:00Z) 1.6 °C, then 01:00 local (08:00Z) -0.8 °C: remove 23:00 and 00:00.
    int at = indexOf(temps, "2026-04-15T05:00:00+00:00");
    ((ObjectNode) temps.get(at)).put("validTime", "2026-04-15T05:00:00+00:00/PT3H");
    temps.remove(at + 2);
    temps.remove(at + 1);
    Forecast g = read(write("nws-3h.json", root));
    ForecastStep h23 = g.steps().stream().filter(s -> s.time().equals(Instant.parse("2026-04-15T06:00:00Z")))
        .findFirst().orElseThrow();
    assertThat(h23.airTempC()).isCloseTo(1.6 + (-0.8 - 1.6) / 3, within(1e-9));
    assertThat(g.coarse()).anyMatch(c -> c.property().equals("temperature") && c.interpolated()
        && c.length().equals(Duration.ofHours(3)));
  }

  @Test
  void metNorwayWithRelativeHumidityOnly() throws IOException {
    ObjectNode root = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-met-norway.json").toFile());
    for (var e : root.path("properties").path("timeseries")) {
      ((ObjectNode) e.path("data").path("instant").path("details")).remove("dew_point_temperature");
    }
    Forecast f = read(write("met-compact.json", root));
    // 60 % at 9.0 °C: dew point 1.65 °C by the Magnus form with Alduchov & Eskridge (1996)
    // coefficients, worked by hand: g = ln 0.60 + 17.625·9/(243.04+9) = 0.1186;
    // Td = 243.04·g/(17.625 − g) = 1.65 °C.
    assertThat(f.steps().get(0).dewPointC()).isCloseTo(1.65, within(0.05));
  }

  @Test
  void aMissingQuantityNamesThePropertyAndTheFile() throws IOException {
    ObjectNode om = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
    ((ObjectNode) om.path("hourly")).remove("dew_point_2m");
    Path a = write("om-no-dew.json", om);
    assertThatThrownBy(() -> read(a)).isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(a.toString()).hasMessageContaining("hourly.dew_point_2m or hourly.relative_humidity_2m");
    ObjectNode om2 = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
    ((ObjectNode) om2.path("hourly_units")).remove("wind_speed_10m");
    Path b = write("om-no-unit.json", om2);
    assertThatThrownBy(() -> read(b)).hasMessageContaining("hourly_units.wind_speed_10m");
    ObjectNode nws = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-nws-gridpoint.json").toFile());
    ((ObjectNode) nws.path("properties")).remove("skyCover");
    Path c = write("nws-no-sky.json", nws);
    assertThatThrownBy(() -> read(c)).hasMessageStartingWith(c.toString()).hasMessageContaining("properties.skyCover");
    ObjectNode met = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-met-norway.json").toFile());
    ((ObjectNode) met.path("properties").path("timeseries").get(3).path("data").path("instant")
        .path("details")).remove("wind_speed");
    Path d = write("met-no-wind.json", met);
    assertThatThrownBy(() -> read(d)).hasMessageStartingWith(d.toString())
        .hasMessageContaining("properties.timeseries[3].data.instant.details.wind_speed");
  }

  @Test
  void anUnknownJsonListsTheKnownFormats() throws IOException {
    Path p = tmp.resolve("other.json");
    Files.writeString(p, "{\"list\": [{\"dt\": 1, \"main\": {\"temp\": 3}}]}");
    assertThatThrownBy(() -> read(p)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("other.json").hasMessageContaining("Open-Meteo")
        .hasMessageContaining("National Weather Service").hasMessageContaining("MET Norway")
        .hasMessageContaining("CSV");
    Path points = tmp.resolve("points.json");
    Files.writeString(points, "{\"properties\": {\"forecastGridData\": \"https://example.invalid/gridpoints/X/1,2\"}}");
    assertThatThrownBy(() -> read(points)).hasMessageContaining("forecastGridData");
  }

  @Test
  void aResponseForAnotherPointIsRefusedAndANearbyOneNoted() throws IOException {
    ObjectNode om = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
    om.put("latitude", 47.0);
    Path far = write("om-far.json", om);
    assertThatThrownBy(() -> read(far)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("80 km from the farm");
    om.put("latitude", 46.35); // about 7.8 km north
    Forecast near = read(write("om-near.json", om));
    assertThat(near.notes()).anyMatch(n -> n.contains("7.8 km from the farm"));
    ObjectNode met = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-met-norway.json").toFile());
    ((ArrayNode) met.path("geometry").path("coordinates")).set(0, 10.75);
    Path oslo = write("met-oslo.json", met);
    assertThatThrownBy(() -> read(oslo)).hasMessageContaining("km from the farm");
  }

  @Test
  void anOpenMeteoResponseInAnotherZoneOrInUnixSecondsGivesTheSameInstants() throws IOException {
    Forecast base = read(DIR.resolve("demo-night-open-meteo.json"));
    ObjectNode om = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
    om.put("timezone", "Europe/Berlin").put("utc_offset_seconds", 7200);
    ArrayNode times = (ArrayNode) om.path("hourly").path("time");
    ObjectNode unix = om.deepCopy();
    ArrayNode unixTimes = (ArrayNode) unix.path("hourly").path("time");
    for (int i = 0; i < times.size(); i++) {
      Instant t = base.steps().get(i).time();
      times.set(i, t.atOffset(java.time.ZoneOffset.ofHours(2)).toLocalDateTime().toString());
      unixTimes.set(i, t.getEpochSecond());
    }
    ((ObjectNode) unix.path("hourly_units")).put("time", "unixtime");
    Forecast berlin = read(write("om-berlin.json", om));
    Forecast epoch = read(write("om-unix.json", unix));
    for (int i = 0; i < base.steps().size(); i++) {
      assertThat(berlin.steps().get(i).time()).isEqualTo(base.steps().get(i).time());
      assertThat(epoch.steps().get(i).time()).isEqualTo(base.steps().get(i).time());
    }
    assertThat(berlin.notes()).anyMatch(n -> n.contains("Europe/Berlin") && n.contains("America/Los_Angeles"));
  }

  @Test
  void openMeteoKeepsOneOffsetAcrossADaylightSavingChange() throws IOException {
    // Clocks in Paris go from 02:00 CET to 03:00 CEST on 2026-03-29. Open-Meteo applies the one
    // offset valid when asked (+01:00 here) to every hour, so its "04:00" is 03:00Z, 05:00 CEST.
    ObjectNode om = (ObjectNode) JSON.readTree(DIR.resolve("demo-night-open-meteo.json").toFile());
    om.put("latitude", 48.85).put("longitude", 2.35).put("timezone", "Europe/Paris")
        .put("utc_offset_seconds", 3600);
    ArrayNode times = (ArrayNode) om.path("hourly").path("time");
    for (int i = 0; i < times.size(); i++) {
      times.set(i, java.time.LocalDateTime.parse("2026-03-28T16:00").plusHours(i).toString());
    }
    Site paris = new Site(48.85, 2.35, ZoneId.of("Europe/Paris"));
    Forecast f = ForecastFiles.readWithContent(write("om-paris.json", om), paris).value();
    assertThat(f.steps().get(12).time()).isEqualTo(Instant.parse("2026-03-29T03:00:00Z"));
    assertThat(f.steps().get(12).localTime(paris.zone()).toLocalTime()).hasToString("05:00");
    for (int i = 1; i < f.steps().size(); i++) {
      assertThat(Duration.between(f.steps().get(i - 1).time(), f.steps().get(i).time()))
          .isEqualTo(Duration.ofHours(1));
    }
  }

  @Test
  void theNewestFetchedForecastInAFolderIsUsed() throws IOException {
    Files.writeString(tmp.resolve("open-meteo-20260414T180000Z.json"), "{}");
    Files.writeString(tmp.resolve("nws-20260414T190500Z.json"), "{}");
    Files.writeString(tmp.resolve("notes.json"), "{}");
    Files.writeString(tmp.resolve(".nws-20260415T000000Z.json.123.tmp"), "{}");
    assertThat(ForecastFiles.resolve(tmp)).isEqualTo(tmp.resolve("nws-20260414T190500Z.json"));
    Path empty = Files.createDirectory(tmp.resolve("empty"));
    assertThatThrownBy(() -> ForecastFiles.resolve(empty)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("forecast fetch");
  }

  private static int indexOf(ArrayNode values, String start) {
    for (int i = 0; i < values.size(); i++) {
      if (values.get(i).path("validTime").asText().startsWith(start)) {
        return i;
      }
    }
    throw new AssertionError(start);
  }

  private Path write(String name, ObjectNode root) throws IOException {
    Path p = tmp.resolve(name);
    Files.writeString(p, JSON.writeValueAsString(root));
    return p;
  }
}
