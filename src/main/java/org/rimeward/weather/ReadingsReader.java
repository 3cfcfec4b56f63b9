package org.rimeward.weather;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rimeward.io.BadInputException;
import org.rimeward.io.CsvTable;

/**
 * Reads a station's readings CSV, whole or as a logger appends it. The columns are the forecast's
 * vocabulary ({@link WeatherColumns}): {@code time} and one of {@code air_temp_c}/{@code air_temp_f}
 * are required; at most one of {@code dew_point_c}/{@code dew_point_f}/{@code rh_pct}, of
 * {@code wind_ms}/{@code wind_kmh}/{@code wind_mph}, of {@code wet_bulb_c}/{@code wet_bulb_f};
 * optionally {@code station}, {@code wind_height_m} (default 2 m, the usual height of a farm
 * station's anemometer), {@code cloud_pct} and {@code solar_wm2}. Empty cells of optional columns
 * are fine. The header is read by {@link CsvTable} as every table is (comma, semicolon or tab,
 * decimal commas, comment lines), and each data line under it on its own.
 *
 * <p>A header that cannot be used stops the read ({@link BadInputException}: nothing can be read
 * without it). A bad data row never does: it is skipped with its line and reason, and counted, so
 * a logger glitch at 3 am costs one reading and not the plan. Within a station, times must
 * increase; a repeat or a row out of order is skipped.
 */
public final class ReadingsReader {
  /** Wind height when the file gives none, m: a farm station's anemometer is usually at 2 m. */
  public static final double DEFAULT_WIND_HEIGHT_M = 2.0;

  private static final String HEADER_EXAMPLE = "time,air_temp_c,dew_point_c,wind_ms";

  private final Path csv;
  private final String file;
  private final ZoneId zone;
  private final CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
      .onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
  private long offset;
  private int line;
  private CsvTable header;
  private WeatherColumns columns;
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
        header = null;
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
    if (toEnd && header == null) {
      throw BadInputException.at(file, "the file is empty; the first line must name the columns,"
          + " e.g. " + HEADER_EXAMPLE);
    }
    return new Batch(found, skipped, restarted);
  }

  private void handle(byte[] bytes, int start, int end, List<Reading> found,
      List<Readings.Skipped> skipped) {
    String text;
    try {
      text = utf8.decode(ByteBuffer.wrap(bytes, start, end - start)).toString();
    } catch (CharacterCodingException e) {
      if (header == null) {
        throw BadInputException.at(file + ":" + line, "is not UTF-8 text; save the CSV as UTF-8");
      }
      skipped.add(new Readings.Skipped(line, file + ":" + line + ": is not UTF-8 text; row skipped"));
      return;
    }
    if (text.startsWith("\uFEFF")) {
      text = text.substring(1);
    }
    if (header == null) {
      String t = text.strip();
      if (!t.isEmpty() && !t.startsWith("#")) {
        header = CsvTable.header(file, text, line, HEADER_EXAMPLE);
        columns = WeatherColumns.readings(header);
      }
      return;
    }
    try {
      Optional<CsvTable.Row> row = header.row(text, line);
      if (row.isEmpty()) {
        return;
      }
      Reading r = reading(row.get());
      lastByStation.put(r.station(), r);
      found.add(r);
    } catch (BadInputException e) {
      skipped.add(new Readings.Skipped(line, e.getMessage() + "; row skipped"));
    }
  }

  /** One data row as a reading, in canonical units; a row that cannot be used is bad input. */
  private Reading reading(CsvTable.Row r) {
    header.requireWidth(r);
    String timeText = r.get("time");
    if (timeText.isEmpty()) {
      throw header.bad(r, "time", "a time is required on every row");
    }
    String station = columns.station() ? r.get("station") : "";
    double airC = WeatherColumns.temperatureC(header, r, columns.air());
    OptionalDouble dew = OptionalDouble.empty();
    String humidity = columns.humidity();
    if (filled(r, humidity)) {
      if (humidity.equals("rh_pct")) {
        dew = OptionalDouble.of(Math.min(airC, WeatherColumns.dewFromRhC(header, r, airC)));
      } else {
        dew = OptionalDouble.of(notAboveAir(r, humidity, airC, "the dew point"));
      }
    }
    OptionalDouble wind = filled(r, columns.wind())
        ? OptionalDouble.of(WeatherColumns.windMs(header, r, columns.wind())) : OptionalDouble.empty();
    double heightM = filled(r, columns.windHeight() ? "wind_height_m" : null)
        ? WeatherColumns.windHeightM(header, r) : DEFAULT_WIND_HEIGHT_M;
    OptionalDouble cloud = filled(r, columns.cloud() ? "cloud_pct" : null)
        ? OptionalDouble.of(WeatherColumns.cloudPct(header, r)) : OptionalDouble.empty();
    OptionalDouble wet = filled(r, columns.wetBulb())
        ? OptionalDouble.of(notAboveAir(r, columns.wetBulb(), airC, "the wet bulb"))
        : OptionalDouble.empty();
    Reading previous = lastByStation.get(station);
    ForecastTimes.Resolved t;
    try {
      t = ForecastTimes.resolve(timeText, zone, previous == null ? null : previous.time());
    } catch (IllegalArgumentException e) {
      throw header.bad(r, "time", e.getMessage());
    }
    if (previous != null && !t.instant().isAfter(previous.time())) {
      throw header.bad(r, "time", (t.instant().equals(previous.time())
          ? "is the same time as line " : "is earlier than line ") + previous.line()
          + (station.isEmpty() ? "" : " of station " + station));
    }
    return new Reading(t.instant(), t.offset(), station, airC, dew, wind, heightM, cloud, wet,
        r.line());
  }

  private static boolean filled(CsvTable.Row r, String column) {
    return column != null && !r.get(column).isEmpty();
  }

  private double notAboveAir(CsvTable.Row r, String column, double airC, String what) {
    double c = WeatherColumns.temperatureC(header, r, column);
    if (c > airC + 1e-9) {
      throw header.bad(r, column, what + " is above the air temperature");
    }
    return c;
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
