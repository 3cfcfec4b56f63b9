package org.rimeward.weather;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.ZoneId;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;

class ReadingsReaderTest {
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  @TempDir Path tmp;

  private Path write(String name, String text) throws Exception {
    Path p = tmp.resolve(name);
    Files.writeString(p, text);
    return p;
  }

  @Test
  void readsTheForecastVocabularyWithOptionalColumnsAndUnits() throws Exception {
    Path p = write("r.csv", "\uFEFFtime,station,air_temp_f,rh_pct,wind_mph,wet_bulb_f,cloud_pct\n"
        + "2026-04-14T22:00-07:00,north,32,80,2.2,30,\n"
        + "2026-04-14 22:10,north,31.1,,,,10\n");
    Readings r = ReadingsReader.read(p, ZONE);
    assertThat(r.skipped()).isEmpty();
    assertThat(r.stations()).containsExactly("north");
    Reading first = r.readings().get(0);
    assertThat(first.airTempC()).isCloseTo(0.0, within(1e-9));
    // Reference 5.2 (Alduchov & Eskridge 1996): 0 °C at 80 % -> about -3.04 °C dew point.
    assertThat(first.dewPointC().getAsDouble()).isCloseTo(-3.04, within(0.02));
    assertThat(first.windMs().getAsDouble()).isCloseTo(0.9835, within(1e-3));
    assertThat(first.wetBulbC().getAsDouble()).isCloseTo(-1.111, within(1e-3));
    assertThat(first.cloudPct()).isEmpty();
    Reading second = r.readings().get(1);
    assertThat(second.time()).isEqualTo(Instant.parse("2026-04-15T05:10:00Z"));
    assertThat(second.dewPointC()).isEmpty();
    assertThat(second.cloudPct().getAsDouble()).isEqualTo(10);
  }

  @Test
  void badRowsAreSkippedWithLineAndReasonAndCountedNeverFatal() throws Exception {
    Path p = write("r.csv", "time,air_temp_c,dew_point_c\n"
        + "2026-04-14T22:00-07:00,1.5,-2\n"
        + "2026-04-14T22:05-07:00,ERR,-2\n"
        + "2026-04-14T22:10-07:00,1.2,3.0\n"
        + "2026-04-14T22:10-07:00,1.2,-2\n"
        + "2026-04-14T22:15-07:00,1.1\n"
        + "yesterday,1.0,-2\n"
        + "2026-04-14T22:20-07:00,1.0,-2\n");
    Readings r = ReadingsReader.read(p, ZONE);
    assertThat(r.readings()).extracting(Reading::line).containsExactly(2, 5, 8);
    assertThat(r.skipped()).extracting(Readings.Skipped::line).containsExactly(3, 4, 6, 7);
    assertThat(r.skipped().get(0).message()).contains("r.csv:3").contains("air_temp_c")
        .contains("'ERR'").contains("not a number").endsWith("row skipped");
    assertThat(r.skipped().get(1).message()).contains("dew point is above the air");
    assertThat(r.skipped().get(2).message()).contains("2 values but the header names 3");
  }

  @Test
  void aHeaderThatCannotBeUsedIsBadInputNamingTheFile() throws Exception {
    assertThatThrownBy(() -> ReadingsReader.read(write("a.csv", "time,temperature\n"), ZONE))
        .isInstanceOf(BadInputException.class).hasMessageContaining("a.csv:1")
        .hasMessageContaining("'temperature' is not a readings column");
    assertThatThrownBy(() -> ReadingsReader.read(write("b.csv", "time,dew_point_c\n"), ZONE))
        .isInstanceOf(BadInputException.class).hasMessageContaining("air_temp_c");
    assertThatThrownBy(() -> ReadingsReader.read(tmp.resolve("none.csv"), ZONE))
        .isInstanceOf(BadInputException.class).hasMessageContaining("no such readings file");
    assertThatThrownBy(() -> ReadingsReader.read(write("e.csv", ""), ZONE))
        .isInstanceOf(BadInputException.class).hasMessageContaining("empty");
  }

  @Test
  void pollReadsOnlyWhatWasAppendedAndWaitsForAHalfWrittenLine() throws Exception {
    Path p = write("log.csv", "time,air_temp_c\n2026-04-14T22:00-07:00,2.0\n2026-04-14T22:0");
    ReadingsReader tail = new ReadingsReader(p, ZONE);
    ReadingsReader.Batch b1 = tail.poll();
    assertThat(b1.readings()).hasSize(1);
    assertThat(b1.skipped()).isEmpty();
    Files.writeString(p, "5-07:00,1.8\n2026-04-14T22:10-07:00,1.6\n", StandardOpenOption.APPEND);
    ReadingsReader.Batch b2 = tail.poll();
    assertThat(b2.readings()).extracting(Reading::airTempC).containsExactly(1.8, 1.6);
    assertThat(b2.readings()).extracting(Reading::line).containsExactly(3, 4);
    assertThat(tail.poll().readings()).isEmpty();
    Files.writeString(p, "time,air_temp_c\n2026-04-14T23:00-07:00,0.5\n");
    ReadingsReader.Batch b3 = tail.poll();
    assertThat(b3.restarted()).isTrue();
    assertThat(b3.readings()).extracting(Reading::airTempC).containsExactly(0.5);
  }

  @Test
  void localTimesInTheAutumnOverlapFollowEachStationsOwnOrder() throws Exception {
    Path p = write("r.csv", "time,station,air_temp_c\n"
        + "2026-11-01T01:30,a,1\n2026-11-01T01:30,b,1\n2026-11-01T01:30,a,0.5\n");
    Readings r = ReadingsReader.read(p, ZONE);
    assertThat(r.skipped()).isEmpty();
    assertThat(r.of("a")).extracting(Reading::time).containsExactly(
        Instant.parse("2026-11-01T08:30:00Z"), Instant.parse("2026-11-01T09:30:00Z"));
    assertThat(r.of("b")).extracting(Reading::time).containsExactly(Instant.parse("2026-11-01T08:30:00Z"));
  }

  @Test
  void readsAsEveryTableIsReadSemicolonsDecimalCommasAndCommentsWithTheirLines() throws Exception {
    // A European logger's export: semicolons, decimal commas, a comment line kept by the logger.
    Path p = write("eu.csv", "# logger 7, firmware 2.1\nTime;Air_Temp_C;RH_Pct\n"
        + "2026-04-14T22:00-07:00;1,5;80\n# battery swapped\n2026-04-14T22:10-07:00;\u22120,5;85\n");
    Readings r = ReadingsReader.read(p, ZONE);
    assertThat(r.skipped()).isEmpty();
    assertThat(r.readings()).extracting(Reading::airTempC).containsExactly(1.5, -0.5);
    assertThat(r.readings()).extracting(Reading::line).containsExactly(3, 5);
  }

  @Test
  void aStrayQuoteOrAFahrenheitValueCostsOneRowNotTheRowsAfterIt() throws Exception {
    Path p = write("q.csv", "time,air_temp_c\n"
        + "2026-04-14T22:00-07:00,\"1.5\n"
        + "2026-04-14T22:10-07:00,33.8\n"
        + "2026-04-14T22:20-07:00,49\n"
        + "2026-04-14T22:30-07:00,1.0\n");
    Readings r = ReadingsReader.read(p, ZONE);
    assertThat(r.readings()).extracting(Reading::line).containsExactly(3, 5);
    assertThat(r.skipped()).extracting(Readings.Skipped::line).containsExactly(2, 4);
    assertThat(r.skipped().get(0).message()).startsWith(p + ":2: a quote (\") opens here");
    assertThat(r.skipped().get(1).message()).contains("column air_temp_c, value '49': looks like °F");
  }

  @Test
  void pollStartsOverWhenTheHeaderComesLaterThanTheFirstPoll() throws Exception {
    // A logger that creates the file and writes the header a moment later.
    Path p = write("late.csv", "");
    ReadingsReader tail = new ReadingsReader(p, ZONE);
    assertThat(tail.poll().readings()).isEmpty();
    Files.writeString(p, "time;air_temp_f\n2026-04-14T22:00-07:00;32\n", StandardOpenOption.APPEND);
    ReadingsReader.Batch b = tail.poll();
    assertThat(b.readings()).extracting(Reading::airTempC).containsExactly(0.0);
    assertThat(b.readings().get(0).line()).isEqualTo(2);
  }
}
