package org.rimeward.weather;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.time.zone.ZoneOffsetTransition;
import java.util.ArrayList;
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
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * Reads a station's readings CSV, whole or as a logger appends it. The columns are the forecast's
 * vocabulary: {@code time} and one of {@code air_temp_c}/{@code air_temp_f} are required; at most
 * one of {@code dew_point_c}/{@code dew_point_f}/{@code rh_pct}, of {@code wind_ms}/
 * {@code wind_kmh}/{@code wind_mph}, of {@code wet_bulb_c}/{@code wet_bulb_f}; optionally
 * {@code station}, {@code wind_height_m} (default 2 m, the usual height of a farm station's
 * anemometer), {@code cloud_pct} and {@code solar_wm2}. Empty cells of optional columns are fine.
 *
 * <p>A header that cannot be used stops the read ({@link BadInputException}: nothing can be read
 * without it). A bad data row never does: it is skipped with its line and reason, and counted, so
 * a logger glitch at 3 am costs one reading and not the plan. Within a station, times must
 * increase; a repeat or a row out of order is skipped.
 */
public final class ReadingsReader {
  /** Wind height when the file gives none, m: a farm station's anemometer is usually at 2 m. */
  public static final double DEFAULT_WIND_HEIGHT_M = 2.0;

  private static final List<String> ALLOWED = List.of("time", "station", "air_temp_c",
      "air_temp_f", "dew_point_c", "dew_point_f", "rh_pct", "wind_ms", "wind_kmh", "wind_mph",
      "wind_height_m", "cloud_pct", "solar_wm2", "wet_bulb_c", "wet_bulb_f");
  private static final List<String> AIR = List.of("air_temp_c", "air_temp_f");
  private static final List<String> HUMIDITY = List.of("dew_point_c", "dew_point_f", "rh_pct");
  private static final List<String> WIND = List.of("wind_ms", "wind_kmh", "wind_mph");
  private static final List<String> WET = List.of("wet_bulb_c", "wet_bulb_f");
  private static final Pattern NUMBER =
      Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
  private static final Pattern SPACE_SEPARATED = Pattern.compile("\\d{4}-\\d{2}-\\d{2} \\d.*");
  private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder().setTrim(true).get();

  private final Path csv;
  private final String file;
  private final ZoneId zone;
  private long offset;
  private int line;
  private Map<String, Integer> columns;
  private final Map<String, Reading> lastByStation = new HashMap<>();

  /** A reader that follows {@code csv} as it grows; local times are in {@code zone}. */
  public ReadingsReader(Path csv, ZoneId zone) {
    this.csv = Objects.requireNonNull(csv, "csv");
    this.file = csv.toString();
    this.zone = Objects.requireNonNull(zone, "zone");
  }

  /** Reads the whole file. */
  public static Readings read(Path csv, ZoneId zone) {
    ReadingsReader r = new ReadingsReader(csv, zone);
    Batch b = r.poll(true);
    return new Readings(csv, b.readings(), b.skipped());
  }

  /** What one poll found: new readings and skipped rows, and whether the file was started over. */
  public record Batch(List<Reading> readings, List<Readings.Skipped> skipped, boolean restarted) {}

  /**
   * Reads what was appended since the last poll: complete lines only, so a line the logger is
   * still writing waits for the next poll. A file that shrank was replaced and is read anew.
   */
  public Batch poll() {
    return poll(false);
  }

  private Batch poll(boolean toEnd) {
    byte[] bytes;
    boolean restarted = false;
    try (FileChannel ch = FileChannel.open(csv, StandardOpenOption.READ)) {
      long size = ch.size();
      if (size < offset) {
        offset = 0;
        line = 0;
        columns = null;
        lastByStation.clear();
        restarted = true;
      }
      bytes = new byte[(int) Math.min(Integer.MAX_VALUE - 8, size - offset)];
      ByteBuffer buf = ByteBuffer.wrap(bytes);
      ch.position(offset);
      while (buf.hasRemaining() && ch.read(buf) >= 0) {
        // keep reading until the snapshot of the size is read
      }
    } catch (NoSuchFileException e) {
      throw BadInputException.at(file, "no such readings file; give the CSV the station's logger"
          + " writes (--readings FILE)");
    } catch (IOException e) {
      throw new BadInputException(file + ": could not read the readings: " + e, e);
    }
    List<Reading> found = new ArrayList<>();
    List<Readings.Skipped> skipped = new ArrayList<>();
    int start = 0;
    while (start < bytes.length) {
      int end = start;
      while (end < bytes.length && bytes[end] != '\n') {
        end++;
      }
      if (end == bytes.length && !toEnd) {
        break;
      }
      int next = Math.min(end + 1, bytes.length);
      line++;
      handle(bytes, start, end, found, skipped);
      offset += next - start;
      start = next;
    }
    if (toEnd && columns == null) {
      throw BadInputException.at(file, "the file is empty; the first line must name the columns,"
          + " e.g. time,air_temp_c,dew_point_c,wind_ms");
    }
    return new Batch(found, skipped, restarted);
  }

  private void handle(byte[] bytes, int start, int end, List<Reading> found,
      List<Readings.Skipped> skipped) {
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(bytes, start, end - start)).toString();
    } catch (CharacterCodingException e) {
      if (columns == null) {
        throw BadInputException.at(file + ":" + line, "is not UTF-8 text; save the CSV as UTF-8");
      }
      skipped.add(new Readings.Skipped(line, file + ":" + line + ": is not UTF-8 text; row skipped"));
      return;
    }
    if (text.startsWith("\uFEFF")) {
      text = text.substring(1);
    }
    if (text.isBlank()) {
      return;
    }
    List<String> values;
    try (CSVParser p = CSVParser.parse(text, FORMAT)) {
      List<CSVRecord> records = p.getRecords();
      values = records.isEmpty() ? List.of() : records.get(0).toList();
    } catch (IOException | UncheckedIOException | IllegalStateException e) {
      if (columns == null) {
        throw BadInputException.at(file + ":" + line, "not readable as CSV (" + e.getMessage() + ")");
      }
      skipped.add(new Readings.Skipped(line, file + ":" + line + ": not readable as CSV; row skipped"));
      return;
    }
    if (columns == null) {
      columns = header(values);
      return;
    }
    try {
      Reading r = row(values);
      Reading previous = lastByStation.get(r.station());
      if (previous != null && !r.time().isAfter(previous.time())) {
        throw new Skip("time", values.get(columns.get("time")), (r.time().equals(previous.time())
            ? "is the same time as line " : "is earlier than line ") + previous.line()
            + (r.station().isEmpty() ? "" : " of station " + r.station()));
      }
      lastByStation.put(r.station(), r);
      found.add(r);
    } catch (Skip s) {
      skipped.add(new Readings.Skipped(line, file + ":" + line + ": " + s.getMessage() + "; row skipped"));
    }
  }

  private Map<String, Integer> header(List<String> names) {
    Map<String, Integer> cols = new LinkedHashMap<>();
    String where = file + ":" + line;
    for (int i = 0; i < names.size(); i++) {
      String name = names.get(i).trim().toLowerCase(Locale.ROOT);
      if (!ALLOWED.contains(name)) {
        throw BadInputException.at(where, "column " + (i + 1) + " '" + names.get(i)
            + "' is not a readings column; allowed columns: " + String.join(", ", ALLOWED));
      }
      if (cols.putIfAbsent(name, i) != null) {
        throw BadInputException.at(where, "column '" + name + "' appears twice; keep one");
      }
    }
    if (!cols.containsKey("time")) {
      throw BadInputException.at(where, "no 'time' column; add the time of each reading, e.g."
          + " 2026-04-14T22:10-07:00");
    }
    atMostOne(cols, where, AIR, true, "the air temperature");
    atMostOne(cols, where, HUMIDITY, false, "the humidity");
    atMostOne(cols, where, WIND, false, "the wind speed");
    atMostOne(cols, where, WET, false, "the wet bulb");
    return cols;
  }

  private static void atMostOne(Map<String, Integer> cols, String where, List<String> group,
      boolean required, String what) {
    List<String> present = group.stream().filter(cols::containsKey).toList();
    if (required && present.isEmpty()) {
      throw BadInputException.at(where, "no column for " + what + "; add one of "
          + String.join(", ", group));
    }
    if (present.size() > 1) {
      throw BadInputException.at(where, "columns " + String.join(" and ", present) + " both give "
          + what + "; keep one");
    }
  }

  /** A row that cannot be used: the column, the value and why. */
  private static final class Skip extends Exception {
    private static final long serialVersionUID = 1L;

    Skip(String column, String value, String why) {
      super("column " + column + ", value '" + value + "': " + why, null, false, false);
    }
  }

  private Reading row(List<String> values) throws Skip {
    if (values.size() != columns.size()) {
      throw new Skip("*", String.join(",", values), "has " + values.size()
          + " values but the header names " + columns.size() + " columns");
    }
    Map<String, String> v = new HashMap<>();
    columns.forEach((name, i) -> v.put(name, values.get(i)));
    String station = v.getOrDefault("station", "");
    double airC = temperature(v, AIR, true).orElseThrow();
    OptionalDouble dew = OptionalDouble.empty();
    if (v.containsKey("rh_pct") && !v.get("rh_pct").isEmpty()) {
      double rh = number(v, "rh_pct");
      if (!(rh > 0 && rh <= 100)) {
        throw new Skip("rh_pct", v.get("rh_pct"), "relative humidity must be above 0 and at most 100 %");
      }
      dew = OptionalDouble.of(Math.min(airC, Psychrometrics.dewPointFromRhC(airC, rh)));
    } else {
      dew = temperature(v, HUMIDITY, false);
      if (dew.isPresent() && dew.getAsDouble() > airC + 1e-9) {
        String col = HUMIDITY.stream().filter(v::containsKey).findFirst().orElseThrow();
        throw new Skip(col, v.get(col), "the dew point is above the air temperature");
      }
    }
    OptionalDouble wind = OptionalDouble.empty();
    String windCol = WIND.stream().filter(v::containsKey).findFirst().orElse(null);
    if (windCol != null && !v.get(windCol).isEmpty()) {
      number(v, windCol);
      String unit = windCol.equals("wind_ms") ? "m/s" : windCol.equals("wind_kmh") ? "km/h" : "mph";
      double ms = Quantities.parse(v.get(windCol) + " " + unit, Dimension.SPEED, windCol);
      if (!(ms >= 0 && ms <= ForecastStep.MAX_WIND_MS)) {
        throw new Skip(windCol, v.get(windCol), "wind speed must be 0 to 60 m/s");
      }
      wind = OptionalDouble.of(ms);
    }
    double heightM = DEFAULT_WIND_HEIGHT_M;
    if (v.containsKey("wind_height_m") && !v.get("wind_height_m").isEmpty()) {
      heightM = number(v, "wind_height_m");
      if (!(heightM > 0 && heightM <= ForecastStep.MAX_WIND_HEIGHT_M)) {
        throw new Skip("wind_height_m", v.get("wind_height_m"), "must be above 0 and at most 100 m");
      }
    }
    OptionalDouble cloud = OptionalDouble.empty();
    if (v.containsKey("cloud_pct") && !v.get("cloud_pct").isEmpty()) {
      double c = number(v, "cloud_pct");
      if (!(c >= 0 && c <= 100)) {
        throw new Skip("cloud_pct", v.get("cloud_pct"), "cloud cover must be 0 to 100 %");
      }
      cloud = OptionalDouble.of(c);
    }
    OptionalDouble wet = temperature(v, WET, false);
    if (wet.isPresent() && wet.getAsDouble() > airC + 1e-9) {
      String col = WET.stream().filter(v::containsKey).findFirst().orElseThrow();
      throw new Skip(col, v.get(col), "the wet bulb is above the air temperature");
    }
    String timeText = v.get("time");
    if (timeText.isEmpty()) {
      throw new Skip("time", timeText, "a time is required on every row");
    }
    Reading previous = lastByStation.get(station);
    Instant[] at = new Instant[1];
    ZoneOffset off = resolve(timeText, previous, at);
    return new Reading(at[0], off, station, airC, dew, wind, heightM, cloud, wet, line);
  }

  private OptionalDouble temperature(Map<String, String> v, List<String> group, boolean required)
      throws Skip {
    String col = group.stream().filter(v::containsKey).findFirst().orElse(null);
    if (col == null || (!required && v.get(col).isEmpty())) {
      return OptionalDouble.empty();
    }
    double x = number(v, col);
    double c = col.endsWith("_f") ? Quantities.parse(x + " F", Dimension.TEMPERATURE, col) : x;
    if (!(c >= ForecastStep.MIN_TEMP_C && c <= ForecastStep.MAX_TEMP_C)) {
      throw new Skip(col, v.get(col), String.format(Locale.ROOT,
          "%.1f °C is outside -40 to 45 °C; check the value and the column's unit", c));
    }
    return OptionalDouble.of(c);
  }

  private static double number(Map<String, String> v, String column) throws Skip {
    String s = v.get(column);
    if (s.isEmpty()) {
      throw new Skip(column, s, "a value is required");
    }
    if (!NUMBER.matcher(s).matches()) {
      throw new Skip(column, s, "is not a number");
    }
    return Double.parseDouble(s);
  }

  /**
   * A time with an offset is taken as written. A local time is placed in the farm's zone: one in
   * the spring-forward gap does not exist; one in the autumn overlap takes the earlier offset
   * unless that would not come after the station's previous reading.
   */
  private ZoneOffset resolve(String text, Reading previous, Instant[] at) throws Skip {
    String t = SPACE_SEPARATED.matcher(text).matches() ? text.replaceFirst(" ", "T") : text;
    try {
      OffsetDateTime odt = OffsetDateTime.parse(t);
      at[0] = odt.toInstant();
      return odt.getOffset();
    } catch (DateTimeParseException notWithOffset) {
      // a local time, below
    }
    LocalDateTime ldt;
    try {
      ldt = LocalDateTime.parse(t);
    } catch (DateTimeParseException e) {
      throw new Skip("time", text, "is not an ISO-8601 time such as 2026-04-14T22:10-07:00");
    }
    List<ZoneOffset> valid = zone.getRules().getValidOffsets(ldt);
    if (valid.isEmpty()) {
      throw new Skip("time", text, "does not exist in " + zone + " (clocks jump forward then)");
    }
    if (valid.size() == 1) {
      at[0] = ldt.toInstant(valid.get(0));
      return valid.get(0);
    }
    ZoneOffsetTransition overlap = zone.getRules().getTransition(ldt);
    Instant early = ldt.toInstant(overlap.getOffsetBefore());
    if (previous != null && !early.isAfter(previous.time())) {
      at[0] = ldt.toInstant(overlap.getOffsetAfter());
      return overlap.getOffsetAfter();
    }
    at[0] = early;
    return overlap.getOffsetBefore();
  }

  /** The bytes of the file as read in full, for the audit trail. */
  public static byte[] bytes(Path csv) {
    try {
      return Files.readAllBytes(csv);
    } catch (IOException e) {
      throw new BadInputException(csv + ": could not read the readings: " + e, e);
    }
  }
}
