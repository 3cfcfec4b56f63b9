package org.rimeward.weather;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rimeward.io.BadInputException;

class ForecastReaderTest {
  static final ZoneId LA = ZoneId.of("America/Los_Angeles");
  static final ZoneId PARIS = ZoneId.of("Europe/Paris");
  static final ZoneId SYDNEY = ZoneId.of("Australia/Sydney");

  @TempDir Path dir;

  private Path csv(String text) throws IOException {
    Path p = dir.resolve("forecast.csv");
    Files.writeString(p, text);
    return p;
  }

  @Test
  void readsTimesWithOffsetsAsWritten() throws IOException {
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct,solar_wm2
        2024-04-12T22:00-07:00,3.5,-1.0,1.2,10,0
        2024-04-12T23:00-07:00,2.0,-1.5,0.8,0,
        2024-04-13T00:00-07:00,1.0,-2.0,0.5,0,0
        """);
    Forecast f = ForecastReader.read(p, LA);
    assertThat(f.file()).isEqualTo(p);
    assertThat(f.steps()).hasSize(3);
    ForecastStep s = f.steps().get(0);
    assertThat(s.time()).isEqualTo(Instant.parse("2024-04-13T05:00:00Z"));
    assertThat(s.offset()).isEqualTo(ZoneOffset.ofHours(-7));
    assertThat(s.airTempC()).isEqualTo(3.5);
    assertThat(s.dewPointC()).isEqualTo(-1.0);
    assertThat(s.windMs()).isEqualTo(1.2);
    // No wind_height_m column: the WMO standard 10 m anemometer height.
    assertThat(s.windHeightM()).isEqualTo(10.0);
    assertThat(s.cloudPct()).isEqualTo(10.0);
    assertThat(s.solarWm2()).hasValue(0.0);
    assertThat(s.line()).isEqualTo(2);
    assertThat(f.steps().get(1).solarWm2()).isEmpty();
    assertThat(f.steps().get(2).line()).isEqualTo(4);
    assertThat(f.steps().get(2).localTime(LA).toLocalDateTime())
        .isEqualTo(LocalDateTime.parse("2024-04-13T00:00"));
  }

  @Test
  void localTimesAcrossSpringForwardSkipTheMissingHour() throws IOException {
    // America/Los_Angeles: 2024-03-10 02:00 PST becomes 03:00 PDT (tz database).
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct
        2024-03-10T00:00,1.0,-3.0,1,0
        2024-03-10T01:00,0.5,-3.0,1,0
        2024-03-10T03:00,0.0,-3.0,1,0
        2024-03-10T04:00,-0.5,-3.0,1,0
        """);
    Forecast f = ForecastReader.read(p, LA);
    assertThat(f.steps()).extracting(ForecastStep::time).containsExactly(
        Instant.parse("2024-03-10T08:00:00Z"), Instant.parse("2024-03-10T09:00:00Z"),
        Instant.parse("2024-03-10T10:00:00Z"), Instant.parse("2024-03-10T11:00:00Z"));
    assertThat(f.steps()).extracting(ForecastStep::offset).containsExactly(
        ZoneOffset.ofHours(-8), ZoneOffset.ofHours(-8), ZoneOffset.ofHours(-7), ZoneOffset.ofHours(-7));
    // 01:00 PST to 03:00 PDT is one real hour.
    assertThat(f.maxGapWithin(f.start(), f.end())).isEqualTo(Duration.ofHours(1));
  }

  @Test
  void aLocalTimeInTheSpringGapIsRefusedWithItsLine() throws IOException {
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct
        2024-03-10T01:00,0.5,-3.0,1,0
        2024-03-10T02:30,0.0,-3.0,1,0
        """);
    assertThatThrownBy(() -> ForecastReader.read(p, LA))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(p + ":3: column time, value '2024-03-10T02:30'")
        .hasMessageContaining("does not exist in America/Los_Angeles")
        .hasMessageContaining("clocks jump from 02:00 to 03:00 on 2024-03-10");
  }

  @Test
  void repeatedLocalHourInAutumnIsResolvedByRowOrder() throws IOException {
    // Europe/Paris: 2024-10-27 03:00 CEST (+02:00) becomes 02:00 CET (+01:00), so 02:00–02:59
    // happens twice (tz database; EU summer-time directive 2000/84/EC, last Sunday of October).
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct
        2024-10-27T01:00,4,0,1,0
        2024-10-27T02:00,3.5,0,1,0
        2024-10-27T02:30,3,0,1,0
        2024-10-27T02:00,2.5,0,1,0
        2024-10-27T02:30,2,0,1,0
        2024-10-27T03:00,1.5,0,1,0
        """);
    Forecast f = ForecastReader.read(p, PARIS);
    assertThat(f.steps()).extracting(ForecastStep::time).containsExactly(
        Instant.parse("2024-10-26T23:00:00Z"), Instant.parse("2024-10-27T00:00:00Z"),
        Instant.parse("2024-10-27T00:30:00Z"), Instant.parse("2024-10-27T01:00:00Z"),
        Instant.parse("2024-10-27T01:30:00Z"), Instant.parse("2024-10-27T02:00:00Z"));
    assertThat(f.steps()).extracting(ForecastStep::offset).containsExactly(
        ZoneOffset.ofHours(2), ZoneOffset.ofHours(2), ZoneOffset.ofHours(2),
        ZoneOffset.ofHours(1), ZoneOffset.ofHours(1), ZoneOffset.ofHours(1));
    assertThat(f.maxGapWithin(f.start(), f.end())).isEqualTo(Duration.ofMinutes(60));
  }

  @Test
  void repeatedLocalHourInSydneyAutumn() throws IOException {
    // Australia/Sydney: 2024-04-07 03:00 AEDT (+11:00) becomes 02:00 AEST (+10:00) (tz database).
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct
        2024-04-07 01:00,4,0,1,0
        2024-04-07 02:00,3,0,1,0
        2024-04-07 02:00,2,0,1,0
        2024-04-07 03:00,1,0,1,0
        """);
    Forecast f = ForecastReader.read(p, SYDNEY);
    assertThat(f.steps()).extracting(ForecastStep::time).containsExactly(
        Instant.parse("2024-04-06T14:00:00Z"), Instant.parse("2024-04-06T15:00:00Z"),
        Instant.parse("2024-04-06T16:00:00Z"), Instant.parse("2024-04-06T17:00:00Z"));
    assertThat(f.steps().get(2).localTime(SYDNEY).getOffset()).isEqualTo(ZoneOffset.ofHours(10));
  }

  @Test
  void relativeHumidityIsTurnedIntoADewPoint() throws IOException {
    Path p = csv("""
        time,air_temp_c,rh_pct,wind_ms,cloud_pct
        2024-04-12T22:00-07:00,2,70,1,0
        2024-04-12T23:00-07:00,-2,80,1,0
        """);
    Forecast f = ForecastReader.read(p, LA);
    // Alduchov & Eskridge (1996) AERK: T 2 °C, RH 70 % -> Td -2.90 °C; T -2 °C, RH 80 % ->
    // Td -4.99 °C (docs/reference/check-values.md §5.2 dew-point checks, COMPUTED).
    assertThat(f.steps().get(0).dewPointC()).as("Td at 2 °C, 70 %").isCloseTo(-2.90, within(0.01));
    assertThat(f.steps().get(1).dewPointC()).as("Td at -2 °C, 80 %").isCloseTo(-4.99, within(0.01));
    assertThat(f.steps().get(0).rhPct()).isCloseTo(70.0, within(1e-6));
  }

  @Test
  void fahrenheitAndOtherWindUnitsAreConvertedOnce() throws IOException {
    Path p = csv("""
        time,air_temp_f,dew_point_f,wind_mph,cloud_pct,wind_height_m
        2024-04-12T22:00-07:00,28.4,23,10,50,2
        """);
    ForecastStep s = ForecastReader.read(p, LA).steps().get(0);
    // NIST SP 811 B.9: t/°C = (t/°F − 32)/1.8; B.8: mile per hour = 0.44704 m/s exactly.
    assertThat(s.airTempC()).isCloseTo(-2.0, within(1e-9));
    assertThat(s.dewPointC()).isCloseTo(-5.0, within(1e-9));
    assertThat(s.windMs()).isCloseTo(4.4704, within(1e-9));
    // The height is kept as given; reduction to 2 m (FAO-56 Eq. 47) is the planner's.
    assertThat(s.windHeightM()).isEqualTo(2.0);
    Path k = csv("""
        time,air_temp_c,dew_point_c,wind_kmh,cloud_pct
        2024-04-12T22:00-07:00,1,0,36,50
        """);
    assertThat(ForecastReader.read(k, LA).steps().get(0).windMs()).isCloseTo(10.0, within(1e-9));
  }

  @Test
  void headerIsCaseInsensitiveAndBlankLinesKeepLineNumbers() throws IOException {
    Path p = csv("Time, Air_Temp_C ,DEW_POINT_C,wind_ms,cloud_pct\r\n"
        + "2024-04-12T22:00-07:00,2,0,1,0\r\n"
        + "\r\n"
        + "2024-04-12T23:00-07:00,2,x,1,0\r\n");
    assertThatThrownBy(() -> ForecastReader.read(p, LA))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(p + ":4: column dew_point_c, value 'x': is not a number");
  }

  @Test
  void coverageAndLongestGap() throws IOException {
    Path p = csv("""
        time,air_temp_c,dew_point_c,wind_ms,cloud_pct
        2024-04-12T20:00Z,5,0,1,0
        2024-04-12T21:00Z,4,0,1,0
        2024-04-12T23:00Z,3,0,1,0
        2024-04-12T23:30Z,2,0,1,0
        """);
    Forecast f = ForecastReader.read(p, LA);
    Instant t20 = Instant.parse("2024-04-12T20:00:00Z");
    Instant t2030 = Instant.parse("2024-04-12T20:30:00Z");
    Instant t2130 = Instant.parse("2024-04-12T21:30:00Z");
    Instant t2330 = Instant.parse("2024-04-12T23:30:00Z");
    assertThat(f.covers(t20, t2330)).isTrue();
    assertThat(f.covers(t20, t2330.plusSeconds(1))).isFalse();
    assertThat(f.covers(t20.minusSeconds(1), t2330)).isFalse();
    assertThat(f.maxGapWithin(t20, t2330)).isEqualTo(Duration.ofHours(2));
    // Inside 20:00–21:00 the bracketing steps are one hour apart.
    assertThat(f.maxGapWithin(t2030, Instant.parse("2024-04-12T20:45:00Z"))).isEqualTo(Duration.ofHours(1));
    // 21:30 lies between 21:00 and 23:00.
    assertThat(f.maxGapWithin(t2130, t2130)).isEqualTo(Duration.ofHours(2));
    // Past the end, the uncovered stretch counts in full.
    assertThat(f.maxGapWithin(t2330, t2330.plus(Duration.ofHours(3)))).isEqualTo(Duration.ofHours(3));
    assertThat(f.stepsBetween(t2030, t2330)).extracting(ForecastStep::line).containsExactly(3, 4, 5);
  }

  /** Broken forecasts: the CSV, the line the message must name, and words it must contain. */
  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', quoteCharacter = '"', textBlock = """
      missing column      | time,air_temp_c,dew_point_c,wind_ms\\n2024-04-12T22:00Z,1,0,1                | 1 | no column for the cloud cover, 0-100 %; add 'cloud_pct'
      missing humidity    | time,air_temp_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,1,0                  | 1 | add one of dew_point_c, dew_point_f, rh_pct
      two temperatures    | time,air_temp_c,air_temp_f,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,34,0,1,0 | 1 | columns air_temp_c and air_temp_f both give the air temperature; keep exactly one of air_temp_c, air_temp_f
      two winds           | time,air_temp_c,dew_point_c,wind_ms,wind_mph,cloud_pct\\n2024-04-12T22:00Z,1,0,1,2,0 | 1 | wind_ms and wind_mph both give the wind speed
      unknown column      | time,air_temp_c,dew_point_c,wind_ms,cloud_pct,pressure\\n2024-04-12T22:00Z,1,0,1,0,101 | 1 | column 6 'pressure' is not a forecast column; allowed columns: time, air_temp_c, air_temp_f, dew_point_c
      repeated column     | time,air_temp_c,dew_point_c,wind_ms,cloud_pct,cloud_pct\\n2024-04-12T22:00Z,1,0,1,0,0 | 1 | column 'cloud_pct' appears twice (columns 5 and 6)
      malformed number    | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1.2.3,0,1,0 | 2 | column air_temp_c, value '1.2.3': is not a number
      decimal comma       | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,"2,5",0,1,0 | 2 | value '2,5': is not a number; use a decimal point
      number with unit    | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,2C,0,1,0 | 2 | without its unit
      empty cell          | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,,0,1,0 | 2 | column air_temp_c, value '': a value is required
      short row           | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,1 | 2 | has 4 values but the header names 5 columns
      bad time            | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n12/04/2024 22:00,1,0,1,0 | 2 | column time, value '12/04/2024 22:00': is not an ISO-8601 time
      out of order        | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T23:00Z,1,0,1,0\\n2024-04-12T22:00Z,1,0,1,0 | 3 | is earlier than line 2 (2024-04-12T23:00Z); sort the rows by time
      duplicate time      | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,1,0\\n2024-04-12T15:00-07:00,1,0,1,0 | 3 | is the same time as line 2; keep one row per time
      one °F value in °C  | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,50,0,1,0 | 2 | column air_temp_c, value '50': looks like °F; rename the column air_temp_f
      °F-looking column   | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,44,30,1,0\\n2024-04-12T23:00Z,41,30,1,0\\n2024-04-13T00:00Z,36,30,1,0 | 2 | column air_temp_c: values between 36 and 44 with 2 above 40 look like °F; rename the column air_temp_f
      °F-looking dew      | time,air_temp_f,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,50,46,1,0 | 2 | value '46': looks like °F; rename the column dew_point_f
      dew above air, rounding | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1.0,1.3,1,0 | 2 | the dew point (1.30 °C) is above the air temperature (1.00 °C), which cannot be. It is above by only 0.30 °C, which may be rounding
      dew above air, swapped  | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,-3,1,1,0 | 2 | Check that the two columns are not swapped
      dew above air in °F     | time,air_temp_f,dew_point_f,wind_ms,cloud_pct\\n2024-04-12T22:00Z,30,31,1,0 | 2 | column dew_point_f, value '31': the dew point (-0.56 °C) is above
      RH above 100        | time,air_temp_c,rh_pct,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,105,1,0 | 2 | column rh_pct, value '105': relative humidity must be above 0 and at most 100 %
      RH as a fraction    | time,air_temp_c,rh_pct,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,1,0 | 2 | e.g. 70 (not 0.70)
      negative wind       | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,-1,0 | 2 | column wind_ms, value '-1': wind speed must be 0 to 60 m/s
      wind above 60 m/s   | time,air_temp_c,dew_point_c,wind_mph,cloud_pct\\n2024-04-12T22:00Z,1,0,140,0 | 2 | wind speed must be 0 to 134 mph (60 m/s)
      cloud above 100     | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,1,120 | 2 | column cloud_pct, value '120': cloud cover must be 0 to 100 %
      negative cloud      | time,air_temp_c,dew_point_c,wind_ms,cloud_pct\\n2024-04-12T22:00Z,1,0,1,-5 | 2 | cloud cover must be 0 to 100 %
      negative solar      | time,air_temp_c,dew_point_c,wind_ms,cloud_pct,solar_wm2\\n2024-04-12T22:00Z,1,0,1,0,-3 | 2 | solar radiation must be 0 to 1400 W/m²
      zero wind height    | time,air_temp_c,dew_point_c,wind_ms,cloud_pct,wind_height_m\\n2024-04-12T22:00Z,1,0,1,0,0 | 2 | the wind height must be above 0
      air below -40 °C    | time,air_temp_f,dew_point_f,wind_ms,cloud_pct\\n2024-04-12T22:00Z,-50,-60,1,0 | 2 | column air_temp_f, value '-50': -45.6 °C is outside -40 to 45 °C
      header only         | time,air_temp_c,dew_point_c,wind_ms,cloud_pct | 1 | the file has a header but no forecast rows
      """)
  void brokenForecastIsRefusedWithLineColumnAndValue(String label, String text, int line, String words)
      throws IOException {
    Path p = csv(text.replace("\\n", "\n") + "\n");
    assertThatThrownBy(() -> ForecastReader.read(p, LA))
        .as(label)
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(p + ":" + line + ": ")
        .hasMessageContaining(words);
  }

  @Test
  void emptyAndMissingFilesAreRefused() throws IOException {
    Path empty = csv("\n\n");
    assertThatThrownBy(() -> ForecastReader.read(empty, LA))
        .isInstanceOf(BadInputException.class).hasMessageContaining("the file is empty");
    Path missing = dir.resolve("none.csv");
    assertThatThrownBy(() -> ForecastReader.read(missing, LA))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(missing + ": no such forecast file");
  }

  @Test
  void stepRecordRefusesADewPointAboveTheAir() {
    assertThatThrownBy(() -> new ForecastStep(Instant.EPOCH, ZoneOffset.UTC, 1, 2, 1, 10, 0,
        java.util.OptionalDouble.empty(), 0))
        .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("dew point");
    assertThatThrownBy(() -> new Forecast(Path.of("f.csv"), List.of()))
        .isInstanceOf(IllegalArgumentException.class);
  }

  // Issue 14: exports people make with ordinary tools read as they expect.
  @Test
  void europeanSemicolonExportWithDecimalCommasAndTypographicMinusIsRead() throws IOException {
    Path p = csv("""
        # exported from a spreadsheet
        time;air_temp_c;dew_point_c;wind_ms;cloud_pct
        2024-04-12T22:00-07:00;2,5;−1,5;1,2;0
        """);
    ForecastStep s = ForecastReader.read(p, LA).steps().get(0);
    assertThat(s.airTempC()).isEqualTo(2.5);
    assertThat(s.dewPointC()).isEqualTo(-1.5);
    assertThat(s.windMs()).isEqualTo(1.2);
    assertThat(s.line()).isEqualTo(3);
  }

  @Test
  void tabSeparatedExportIsRead() throws IOException {
    Path p = csv("time\tair_temp_c\tdew_point_c\twind_ms\tcloud_pct\n"
        + "2024-04-12T22:00-07:00\t2\t-1\t1\t0\n");
    assertThat(ForecastReader.read(p, LA).steps().get(0).airTempC()).isEqualTo(2.0);
  }

  @Test
  void relativeHumidityAsAFractionSaysPercent() throws IOException {
    Path p = csv("time,air_temp_c,rh_pct,wind_ms,cloud_pct\n2024-04-12T22:00Z,1,0.7,1,0\n");
    assertThatThrownBy(() -> ForecastReader.read(p, LA))
        .isInstanceOf(BadInputException.class)
        .hasMessage(p + ":2: column rh_pct, value '0.7': looks like a fraction; give relative"
            + " humidity in percent, 0–100 (0.7 is 70)");
  }

  @Test
  void forecastPathThatIsAFolderIsNamed() {
    assertThatThrownBy(() -> ForecastReader.read(dir, LA))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith(dir + ": is a folder, not a forecast file;");
  }
}
