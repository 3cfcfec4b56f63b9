package org.rimeward.weather;

import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;
import java.util.function.ToDoubleFunction;
import org.rimeward.io.BadInputException;
import org.rimeward.io.CsvTable;
import org.rimeward.io.Loaded;
import org.rimeward.io.TextFile;

/**
 * Reads the night's forecast CSV. The first line names the columns ({@link WeatherColumns});
 * each later line is one time step. Every problem is a {@link BadInputException} naming the file,
 * the line, the column and the value, and what to write instead.
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

  private static final String HEADER_EXAMPLE = "time,air_temp_c,dew_point_c,wind_ms,cloud_pct";

  private final CsvTable table;
  private final WeatherColumns columns;

  private ForecastReader(CsvTable table, WeatherColumns columns) {
    this.table = table;
    this.columns = columns;
  }

  /** Reads {@code csv}; local times without an offset are taken in {@code zone} (the farm's). */
  public static Forecast read(Path csv, ZoneId zone) {
    return readWithContent(csv, zone).value();
  }

  /** As {@link #read(Path, ZoneId)}, with the bytes of the file as read. */
  public static Loaded<Forecast> readWithContent(Path csv, ZoneId zone) {
    Objects.requireNonNull(csv, "csv");
    Objects.requireNonNull(zone, "zone");
    TextFile file = TextFile.read(csv, TextFile.MAX_TABLE_BYTES, "forecast file", "put the"
        + " night's forecast CSV there or name it in farm.yaml (forecast: ...)");
    return new Loaded<>(read(csv, file, zone), file.bytes());
  }

  /** Parses a file already read and decoded; see {@link ForecastFiles}. */
  static Forecast parse(Path csv, TextFile file, ZoneId zone) {
    return read(csv, file, zone);
  }

  private static Forecast read(Path csv, TextFile file, ZoneId zone) {
    CsvTable table = CsvTable.read(file, HEADER_EXAMPLE);
    WeatherColumns columns = WeatherColumns.forecast(table);
    if (table.rows().isEmpty()) {
      throw BadInputException.at(file.label() + ":" + table.headerLine(), "the file has a header"
          + " but no forecast rows; add one row per time step");
    }
    ForecastReader reader = new ForecastReader(table, columns);
    List<Values> rows = new ArrayList<>();
    for (CsvTable.Row r : table.rows()) {
      rows.add(reader.values(r));
    }
    reader.checkLooksLikeFahrenheit(rows, "air_temp_c", "air_temp_f", Values::airC);
    reader.checkLooksLikeFahrenheit(rows, "dew_point_c", "dew_point_f", Values::dewC);
    List<ForecastStep> steps = new ArrayList<>();
    ForecastStep previous = null;
    for (Values v : rows) {
      ForecastTimes.Resolved t;
      try {
        t = ForecastTimes.resolve(v.row().get("time"), zone,
          previous == null ? null : previous.time());
      } catch (IllegalArgumentException e) {
        throw table.bad(v.row(), "time", e.getMessage());
      }
      if (previous != null && !t.instant().isAfter(previous.time())) {
        throw table.bad(v.row(), "time", t.instant().equals(previous.time())
            ? "is the same time as line " + previous.line() + "; keep one row per time"
            : "is earlier than line " + previous.line() + " ("
                + previous.writtenTime().toOffsetDateTime() + "); sort the rows by time");
      }
      ForecastStep step = new ForecastStep(t.instant(), t.offset(), v.airC(), v.dewC(),
          v.windMs(), v.windHeightM(), v.cloudPct(), v.solar(), v.row().line());
      steps.add(step);
      previous = step;
    }
    return new Forecast(csv, steps);
  }

  /** One data line read into canonical units, before its time is resolved. */
  private record Values(CsvTable.Row row, double airC, double dewC, double windMs,
      double windHeightM, double cloudPct, OptionalDouble solar) {}

  private Values values(CsvTable.Row r) {
    table.requireWidth(r);
    if (r.get("time").isEmpty()) {
      throw table.bad(r, "time", "a time is required on every row");
    }
    double airC = WeatherColumns.temperatureC(table, r, columns.air());
    double dewC = columns.humidity().equals("rh_pct") ? WeatherColumns.dewFromRhC(table, r, airC)
        : dewPoint(r, airC);
    double windMs = WeatherColumns.windMs(table, r, columns.wind());
    double heightM = columns.windHeight() ? WeatherColumns.windHeightM(table, r)
        : DEFAULT_WIND_HEIGHT_M;
    double cloud = WeatherColumns.cloudPct(table, r);
    OptionalDouble solar = columns.solar() && !r.get("solar_wm2").isEmpty()
        ? OptionalDouble.of(WeatherColumns.solarWm2(table, r)) : OptionalDouble.empty();
    return new Values(r, airC, dewC, windMs, heightM, cloud, solar);
  }

  private double dewPoint(CsvTable.Row r, double airC) {
    String col = columns.humidity();
    double dewC = WeatherColumns.temperatureC(table, r, col);
    if (dewC > airC + 1e-9) {
      double by = dewC - airC;
      String rounding = by <= 0.5
          ? String.format(Locale.ROOT, " It is above by only %.2f °C, which may be rounding in the"
              + " source; if the air is saturated, give the dew point equal to the air"
              + " temperature.", by)
          : " Check that the two columns are not swapped.";
      throw table.bad(r, col, String.format(Locale.ROOT, "the dew point (%.2f °C) is above the"
          + " air temperature (%.2f °C), which cannot be.%s", dewC, airC, rounding));
    }
    return dewC;
  }

  /**
   * A whole °C column whose values all sit between 20 and 60 with at least two above 40 is a
   * °F column for a frost night: in °C that would be a heat wave, not a night to protect buds.
   */
  private void checkLooksLikeFahrenheit(List<Values> rows, String column, String rename,
      ToDoubleFunction<Values> value) {
    if (!column.equals(columns.air()) && !column.equals(columns.humidity())) {
      return;
    }
    boolean allWarm = rows.stream().allMatch(r -> value.applyAsDouble(r) >= 20
        && value.applyAsDouble(r) <= 60);
    List<Values> above40 = rows.stream().filter(r -> value.applyAsDouble(r) > 40).toList();
    if (allWarm && above40.size() >= 2) {
      throw BadInputException.at(table.label() + ":" + above40.get(0).row().line(),
          String.format(Locale.ROOT, "column %s: values between %.0f and %.0f with %d above 40"
              + " look like °F; rename the column %s", column,
              rows.stream().mapToDouble(value).min().orElseThrow(),
              rows.stream().mapToDouble(value).max().orElseThrow(), above40.size(), rename));
    }
  }
}
