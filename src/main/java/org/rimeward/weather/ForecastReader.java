package org.rimeward.weather;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.time.zone.ZoneOffsetTransition;
import java.time.zone.ZoneRules;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Loaded;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * Reads the night's forecast CSV. The first line names the columns; each later line is one time
 * step. Every problem is a {@link BadInputException} naming the file, the line, the column and the
 * value, and what to write instead.
 *
 * <p>Columns: {@code time} (ISO-8601 with an offset, or a local date-time in the farm's zone);
 * exactly one of {@code air_temp_c}/{@code air_temp_f}; exactly one of {@code dew_point_c}/
 * {@code dew_point_f}/{@code rh_pct}; exactly one of {@code wind_ms}/{@code wind_kmh}/
 * {@code wind_mph}; {@code cloud_pct}; optionally {@code wind_height_m} (default 10 m, the
 * WMO standard anemometer height) and {@code solar_wm2} (may be left empty on a row).
 */
public final class ForecastReader {
  /** Wind height when no {@code wind_height_m} column is given, m: WMO standard anemometer height. */
  public static final double DEFAULT_WIND_HEIGHT_M = 10.0;

  /** Above this a value in a °C column is taken to be °F: no frost-night air is above 45 °C. */
  static final double SURELY_F_ABOVE_C = 45.0;

  private static final List<String> ALLOWED = List.of("time", "air_temp_c", "air_temp_f",
      "dew_point_c", "dew_point_f", "rh_pct", "wind_ms", "wind_kmh", "wind_mph", "wind_height_m",
      "cloud_pct", "solar_wm2");
  private static final List<String> AIR = List.of("air_temp_c", "air_temp_f");
  private static final List<String> HUMIDITY = List.of("dew_point_c", "dew_point_f", "rh_pct");
  private static final List<String> WIND = List.of("wind_ms", "wind_kmh", "wind_mph");
  private static final Pattern NUMBER =
      Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
  private static final Pattern SPACE_SEPARATED = Pattern.compile("\\d{4}-\\d{2}-\\d{2} \\d.*");

  private final Path csv;
  private final String file;
  private final ZoneId zone;
  private int[] lineStarts;
  private String text;

  private ForecastReader(Path csv, ZoneId zone) {
    this.csv = csv;
    this.file = csv.toString();
    this.zone = zone;
  }

  /**
   * Reads {@code csv}; local times without an offset are taken in {@code zone} (the farm's).
   */
  public static Forecast read(Path csv, ZoneId zone) {
    return readWithContent(csv, zone).value();
  }

  /** As {@link #read(Path, ZoneId)}, with the bytes of the file as read. */
  public static Loaded<Forecast> readWithContent(Path csv, ZoneId zone) {
    Objects.requireNonNull(csv, "csv");
    Objects.requireNonNull(zone, "zone");
    ForecastReader reader = new ForecastReader(csv, zone);
    byte[] bytes = reader.readBytes();
    return new Loaded<>(reader.read(bytes), bytes);
  }

  private Forecast read(byte[] bytes) {
    text = decode(bytes);
    lineStarts = lineStarts(text);
    List<CSVRecord> records = new ArrayList<>();
    CSVFormat format = CSVFormat.DEFAULT.builder().setIgnoreEmptyLines(true).setTrim(true).get();
    try (CSVParser parser = CSVParser.parse(text, format)) {
      for (CSVRecord r : parser) {
        if (!isBlank(r)) {
          records.add(r);
        }
      }
    } catch (IOException | UncheckedIOException | IllegalStateException e) {
      // Commons CSV reports a broken quote as an unchecked exception with its own line count.
      throw new BadInputException(file + ": not readable as CSV (" + e.getMessage()
          + "); check that every quote that opens a value also closes it", e);
    }
    if (records.isEmpty()) {
      throw BadInputException.at(file, "the file is empty; the first line must name the columns,"
          + " e.g. time,air_temp_c,dew_point_c,wind_ms,cloud_pct");
    }
    Map<String, Integer> columns = header(records.get(0));
    if (records.size() == 1) {
      throw BadInputException.at(file + ":" + lineOf(records.get(0)), "the file has a header but no"
          + " forecast rows; add one row per time step");
    }
    List<Row> rows = new ArrayList<>();
    for (CSVRecord r : records.subList(1, records.size())) {
      rows.add(row(r, columns));
    }
    checkLooksLikeFahrenheit(rows, columns, "air_temp_c", "air_temp_f", Row::airC);
    if (columns.containsKey("dew_point_c")) {
      checkLooksLikeFahrenheit(rows, columns, "dew_point_c", "dew_point_f", Row::dewC);
    }
    List<ForecastStep> steps = new ArrayList<>();
    ForecastStep previous = null;
    for (Row row : rows) {
      Resolved t = resolve(row, previous);
      if (previous != null && !t.instant().isAfter(previous.time())) {
        String what = t.instant().equals(previous.time())
            ? "is the same time as line " + previous.line() + "; keep one row per time"
            : "is earlier than line " + previous.line() + " (" + previous.writtenTime().toOffsetDateTime()
                + "); sort the rows by time";
        throw bad(row.line(), "time", row.timeText(), what);
      }
      ForecastStep step = new ForecastStep(t.instant(), t.offset(), row.airC(), row.dewC(), row.windMs(),
          row.windHeightM(), row.cloudPct(), row.solar(), row.line());
      steps.add(step);
      previous = step;
    }
    return new Forecast(csv, steps);
  }

  private byte[] readBytes() {
    try {
      return Files.readAllBytes(csv);
    } catch (NoSuchFileException e) {
      throw BadInputException.at(file, "no such forecast file; put the night's forecast CSV there or"
          + " name it in farm.yaml (forecast: ...)");
    } catch (IOException e) {
      throw new BadInputException(file + ": could not read the forecast: " + e, e);
    }
  }

  private String decode(byte[] bytes) {
    try {
      String s = StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(bytes)).toString();
      return s.startsWith("\uFEFF") ? s.substring(1) : s;
    } catch (CharacterCodingException e) {
      throw new BadInputException(file + ": is not UTF-8 text; save the CSV as UTF-8", e);
    }
  }

  private Map<String, Integer> header(CSVRecord r) {
    int line = lineOf(r);
    Map<String, Integer> columns = new LinkedHashMap<>();
    for (int i = 0; i < r.size(); i++) {
      String name = r.get(i).trim().toLowerCase(Locale.ROOT);
      if (!ALLOWED.contains(name)) {
        throw BadInputException.at(file + ":" + line, "column " + (i + 1) + " '" + r.get(i)
            + "' is not a forecast column; allowed columns: " + String.join(", ", ALLOWED));
      }
      Integer previous = columns.putIfAbsent(name, i);
      if (previous != null) {
        throw BadInputException.at(file + ":" + line, "column '" + name + "' appears twice (columns "
            + (previous + 1) + " and " + (i + 1) + "); keep one");
      }
    }
    requireOne(columns, line, List.of("time"), "the time of each step, e.g. 2024-04-12T22:00-07:00");
    requireOne(columns, line, AIR, "the air temperature");
    requireOne(columns, line, HUMIDITY, "the humidity, as a dew point or relative humidity");
    requireOne(columns, line, WIND, "the wind speed");
    requireOne(columns, line, List.of("cloud_pct"), "the cloud cover, 0-100 %");
    return columns;
  }

  private void requireOne(Map<String, Integer> columns, int line, List<String> group, String what) {
    List<String> present = group.stream().filter(columns::containsKey).toList();
    String choices = group.size() == 1 ? "'" + group.get(0) + "'" : "one of " + String.join(", ", group);
    if (present.isEmpty()) {
      throw BadInputException.at(file + ":" + line, "no column for " + what + "; add " + choices);
    }
    if (present.size() > 1) {
      throw BadInputException.at(file + ":" + line, "columns " + String.join(" and ", present)
          + " both give " + what + "; keep exactly " + choices);
    }
  }

  /** One data line read into canonical units, before its time is resolved. */
  private record Row(int line, String timeText, double airC, double dewC, double windMs,
      double windHeightM, double cloudPct, OptionalDouble solar) {}

  private Row row(CSVRecord r, Map<String, Integer> columns) {
    int line = lineOf(r);
    if (r.size() != columns.size()) {
      throw BadInputException.at(file + ":" + line, "has " + r.size() + " values but the header names "
          + columns.size() + " columns; give one value per column, in the header's order");
    }
    Map<String, String> v = new HashMap<>();
    columns.forEach((name, i) -> v.put(name, r.get(i)));
    String timeText = v.get("time");
    if (timeText.isEmpty()) {
      throw bad(line, "time", timeText, "a time is required on every row");
    }

    double airC;
    if (columns.containsKey("air_temp_c")) {
      airC = number(line, "air_temp_c", v);
      if (airC > SURELY_F_ABOVE_C) {
        throw bad(line, "air_temp_c", v.get("air_temp_c"), "looks like °F; rename the column"
            + " air_temp_f (or correct the value: no frost night is above " + SURELY_F_ABOVE_C + " °C)");
      }
    } else {
      airC = fahrenheit(number(line, "air_temp_f", v));
    }
    range(line, AIR, v, airC, ForecastStep.MIN_TEMP_C, ForecastStep.MAX_TEMP_C, "°C",
        "check the value and the column's unit");

    double dewC;
    if (columns.containsKey("rh_pct")) {
      double rh = number(line, "rh_pct", v);
      if (!(rh > 0 && rh <= 100)) {
        throw bad(line, "rh_pct", v.get("rh_pct"), "relative humidity must be above 0 and at most 100 %;"
            + " give it in percent, e.g. 70 (not 0.70)");
      }
      dewC = Psychrometrics.dewPointFromRhC(airC, rh);
    } else {
      if (columns.containsKey("dew_point_c")) {
        dewC = number(line, "dew_point_c", v);
        if (dewC > SURELY_F_ABOVE_C) {
          throw bad(line, "dew_point_c", v.get("dew_point_c"), "looks like °F; rename the column"
              + " dew_point_f");
        }
      } else {
        dewC = fahrenheit(number(line, "dew_point_f", v));
      }
      range(line, HUMIDITY, v, dewC, ForecastStep.MIN_TEMP_C, ForecastStep.MAX_TEMP_C, "°C",
          "the humidity formulas hold from -40 to 45 °C");
      if (dewC > airC + 1e-9) {
        String dewCol = columns.containsKey("dew_point_c") ? "dew_point_c" : "dew_point_f";
        double by = dewC - airC;
        String rounding = by <= 0.5
            ? String.format(Locale.ROOT, " It is above by only %.2f °C, which may be rounding in the"
                + " source; if the air is saturated, give the dew point equal to the air temperature.", by)
            : " Check that the two columns are not swapped.";
        throw bad(line, dewCol, v.get(dewCol), String.format(Locale.ROOT,
            "the dew point (%.2f °C) is above the air temperature (%.2f °C), which cannot be.%s",
            dewC, airC, rounding));
      }
    }

    String windCol = WIND.stream().filter(columns::containsKey).findFirst().orElseThrow();
    number(line, windCol, v);
    String unit = switch (windCol) {
      case "wind_ms" -> "m/s";
      case "wind_kmh" -> "km/h";
      default -> "mph";
    };
    double windMs = Quantities.parse(v.get(windCol) + " " + unit, Dimension.SPEED, windCol);
    if (!(windMs >= 0 && windMs <= ForecastStep.MAX_WIND_MS)) {
      double maxInUnit = ForecastStep.MAX_WIND_MS / Quantities.parse("1 " + unit, Dimension.SPEED, unit);
      throw bad(line, windCol, v.get(windCol), String.format(Locale.ROOT, "wind speed must be 0 to %.0f %s"
          + " (%.0f m/s); check the value and the column's unit", maxInUnit, unit,
          ForecastStep.MAX_WIND_MS));
    }

    double heightM = DEFAULT_WIND_HEIGHT_M;
    if (columns.containsKey("wind_height_m")) {
      heightM = number(line, "wind_height_m", v);
      if (!(heightM > 0 && heightM <= ForecastStep.MAX_WIND_HEIGHT_M)) {
        throw bad(line, "wind_height_m", v.get("wind_height_m"), "the wind height must be above 0 and at"
            + " most 100 m; give the height of the wind value above ground, e.g. 10 or 2");
      }
    }

    double cloud = number(line, "cloud_pct", v);
    if (!(cloud >= 0 && cloud <= 100)) {
      throw bad(line, "cloud_pct", v.get("cloud_pct"), "cloud cover must be 0 to 100 %; give it in"
          + " percent (8 oktas = 100 %)");
    }

    OptionalDouble solar = OptionalDouble.empty();
    if (columns.containsKey("solar_wm2") && !v.get("solar_wm2").isEmpty()) {
      double s = number(line, "solar_wm2", v);
      if (!(s >= 0 && s <= ForecastStep.MAX_SOLAR_WM2)) {
        throw bad(line, "solar_wm2", v.get("solar_wm2"), "solar radiation must be 0 to 1400 W/m²"
            + " (the solar constant is about 1361 W/m²); leave the cell empty if unknown");
      }
      solar = OptionalDouble.of(s);
    }
    return new Row(line, timeText, airC, dewC, windMs, heightM, cloud, solar);
  }

  private void range(int line, List<String> group, Map<String, String> v, double valueC, double min,
      double max, String unit, String hint) {
    if (!(valueC >= min && valueC <= max)) {
      String col = group.stream().filter(v::containsKey).findFirst().orElseThrow();
      throw bad(line, col, v.get(col), String.format(Locale.ROOT, "%.1f %s is outside %.0f to %.0f %s; %s",
          valueC, unit, min, max, unit, hint));
    }
  }

  private static double fahrenheit(double f) {
    return Quantities.parse(f + " F", Dimension.TEMPERATURE, "°F");
  }

  private double number(int line, String column, Map<String, String> v) {
    String s = v.get(column);
    if (s.isEmpty()) {
      throw bad(line, column, s, "a value is required; fill the cell");
    }
    if (!NUMBER.matcher(s).matches()) {
      String hint = s.contains(",") ? "use a point as the decimal separator, e.g. 2.5"
          : "write a plain number without its unit (the unit is in the column name), e.g. 2.5";
      throw bad(line, column, s, "is not a number; " + hint);
    }
    return Double.parseDouble(s);
  }

  /**
   * A whole °C column whose values all sit between 20 and 60 with at least two above 40 is a
   * °F column for a frost night: in °C that would be a heat wave, not a night to protect buds.
   */
  private void checkLooksLikeFahrenheit(List<Row> rows, Map<String, Integer> columns, String column,
      String rename, java.util.function.ToDoubleFunction<Row> value) {
    if (!columns.containsKey(column)) {
      return;
    }
    boolean allWarm = rows.stream().allMatch(r -> value.applyAsDouble(r) >= 20 && value.applyAsDouble(r) <= 60);
    List<Row> above40 = rows.stream().filter(r -> value.applyAsDouble(r) > 40).toList();
    if (allWarm && above40.size() >= 2) {
      Row first = above40.get(0);
      throw BadInputException.at(file + ":" + first.line(), String.format(Locale.ROOT,
          "column %s: values between %.0f and %.0f with %d above 40 look like °F; rename the column %s",
          column, rows.stream().mapToDouble(value).min().orElseThrow(),
          rows.stream().mapToDouble(value).max().orElseThrow(), above40.size(), rename));
    }
  }

  private record Resolved(Instant instant, ZoneOffset offset) {}

  /**
   * A time with an offset is taken as written. A local time is placed in the farm's zone: a time
   * in the spring-forward gap does not exist and is refused; a time in the autumn overlap happens
   * twice, and rows in time order settle which: the first occurrence takes the earlier offset,
   * and a repeat that would not come after the previous row takes the later one.
   */
  private Resolved resolve(Row row, ForecastStep previous) {
    String t = row.timeText();
    if (SPACE_SEPARATED.matcher(t).matches()) {
      t = t.replaceFirst(" ", "T");
    }
    try {
      OffsetDateTime odt = OffsetDateTime.parse(t);
      return new Resolved(odt.toInstant(), odt.getOffset());
    } catch (DateTimeParseException notWithOffset) {
      // fall through to a local time
    }
    LocalDateTime ldt;
    try {
      ldt = LocalDateTime.parse(t);
    } catch (DateTimeParseException e) {
      throw bad(row.line(), "time", row.timeText(), "is not an ISO-8601 time; write it with its offset,"
          + " e.g. 2024-04-12T22:00-07:00, or as local time in " + zone + ", e.g. 2024-04-12T22:00");
    }
    ZoneRules rules = zone.getRules();
    List<ZoneOffset> valid = rules.getValidOffsets(ldt);
    if (valid.isEmpty()) {
      ZoneOffsetTransition gap = rules.getTransition(ldt);
      throw bad(row.line(), "time", row.timeText(), String.format(Locale.ROOT,
          "does not exist in %s: clocks jump from %s to %s on %s (%s to %s); remove the row or write"
              + " the time with its offset",
          zone, gap.getDateTimeBefore().toLocalTime(), gap.getDateTimeAfter().toLocalTime(),
          gap.getDateTimeBefore().toLocalDate(), gap.getOffsetBefore(), gap.getOffsetAfter()));
    }
    if (valid.size() == 1) {
      return new Resolved(ldt.toInstant(valid.get(0)), valid.get(0));
    }
    ZoneOffsetTransition overlap = rules.getTransition(ldt);
    ZoneOffset first = overlap.getOffsetBefore();
    ZoneOffset second = overlap.getOffsetAfter();
    Instant early = ldt.toInstant(first);
    if (previous != null && !early.isAfter(previous.time())) {
      return new Resolved(ldt.toInstant(second), second);
    }
    return new Resolved(early, first);
  }

  private BadInputException bad(int line, String column, String value, String what) {
    return BadInputException.at(file + ":" + line, "column " + column + ", value '" + value + "': " + what);
  }

  private static boolean isBlank(CSVRecord r) {
    return Arrays.stream(r.values()).allMatch(String::isBlank);
  }

  /** The 1-based line on which the record's first value is written (blank lines skipped). */
  private int lineOf(CSVRecord r) {
    int pos = (int) r.getCharacterPosition();
    while (pos < text.length() && Character.isWhitespace(text.charAt(pos))) {
      pos++;
    }
    int i = Arrays.binarySearch(lineStarts, pos);
    return (i >= 0 ? i : -i - 2) + 1;
  }

  private static int[] lineStarts(String s) {
    List<Integer> starts = new ArrayList<>();
    starts.add(0);
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c == '\n' || (c == '\r' && (i + 1 >= s.length() || s.charAt(i + 1) != '\n'))) {
        starts.add(i + 1);
      }
    }
    return starts.stream().mapToInt(Integer::intValue).toArray();
  }
}
