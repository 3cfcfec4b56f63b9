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
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * Reads the night's forecast CSV. The first line names the columns ({@link ForecastColumns});
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

  /** Above this a value in a °C column is taken to be °F: no frost-night air is above 45 °C. */
  static final double SURELY_F_ABOVE_C = 45.0;

  private static final String HEADER_EXAMPLE = "time,air_temp_c,dew_point_c,wind_ms,cloud_pct";

  private final CsvTable table;
  private final ForecastColumns columns;

  private ForecastReader(CsvTable table, ForecastColumns columns) {
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
    ForecastColumns columns = ForecastColumns.of(table);
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
        t = ForecastTimes.resolve(v.row().get("time"), zone, previous);
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
    double airC = temperature(r, columns.air());
    double dewC = columns.humidity().equals("rh_pct") ? dewFromRh(r, airC)
        : dewPoint(r, airC);
    String windCol = columns.wind();
    double inUnit = table.number(r, windCol);
    String unit = ForecastColumns.WIND_UNIT.get(windCol);
    double windMs = Quantities.toCanonical(inUnit, Dimension.SPEED, unit);
    if (!(windMs >= 0 && windMs <= ForecastStep.MAX_WIND_MS)) {
      throw table.bad(r, windCol, String.format(Locale.ROOT, "wind speed must be 0 to %.0f %s"
          + " (%.0f m/s); check the value and the column's unit", ForecastStep.MAX_WIND_MS
          / Quantities.toCanonical(1, Dimension.SPEED, unit), unit, ForecastStep.MAX_WIND_MS));
    }
    double heightM = DEFAULT_WIND_HEIGHT_M;
    if (columns.windHeight()) {
      heightM = table.number(r, "wind_height_m");
      if (!(heightM > 0 && heightM <= ForecastStep.MAX_WIND_HEIGHT_M)) {
        throw table.bad(r, "wind_height_m", "the wind height must be above 0 and at most 100 m;"
            + " give the height of the wind value above ground, e.g. 10 or 2");
      }
    }
    double cloud = table.number(r, "cloud_pct");
    if (!(cloud >= 0 && cloud <= 100)) {
      throw table.bad(r, "cloud_pct", "cloud cover must be 0 to 100 %; give it in percent"
          + " (8 oktas = 100 %)");
    }
    OptionalDouble solar = OptionalDouble.empty();
    if (columns.solar() && !r.get("solar_wm2").isEmpty()) {
      double s = table.number(r, "solar_wm2");
      if (!(s >= 0 && s <= ForecastStep.MAX_SOLAR_WM2)) {
        throw table.bad(r, "solar_wm2", "solar radiation must be 0 to 1400 W/m² (the solar"
            + " constant is about 1361 W/m²); leave the cell empty if unknown");
      }
      solar = OptionalDouble.of(s);
    }
    return new Values(r, airC, dewC, windMs, heightM, cloud, solar);
  }

  /** A temperature column's value in °C; a °C column holding a °F-sized value is refused. */
  private double temperature(CsvTable.Row r, String column) {
    double v = table.number(r, column);
    double c = column.endsWith("_f") ? Quantities.toCanonical(v, Dimension.TEMPERATURE, "F") : v;
    if (column.endsWith("_c") && c > SURELY_F_ABOVE_C) {
      String rename = column.replaceFirst("_c$", "_f");
      throw table.bad(r, column, "looks like °F; rename the column " + rename
          + (column.startsWith("air") ? " (or correct the value: no frost night is above "
              + SURELY_F_ABOVE_C + " °C)" : ""));
    }
    if (!(c >= ForecastStep.MIN_TEMP_C && c <= ForecastStep.MAX_TEMP_C)) {
      throw table.bad(r, column, String.format(Locale.ROOT, "%.1f °C is outside %.0f to %.0f °C;"
          + " %s", c, ForecastStep.MIN_TEMP_C, ForecastStep.MAX_TEMP_C, column.startsWith("air")
          ? "check the value and the column's unit" : "the humidity formulas hold from -40 to 45 °C"));
    }
    return c;
  }

  private double dewPoint(CsvTable.Row r, double airC) {
    String col = columns.humidity();
    double dewC = temperature(r, col);
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

  private double dewFromRh(CsvTable.Row r, double airC) {
    double rh = table.number(r, "rh_pct");
    if (rh > 0 && rh <= 1) {
      throw table.bad(r, "rh_pct", "looks like a fraction; give relative humidity in percent,"
          + " 0–100 (0.7 is 70)");
    }
    if (!(rh > 0 && rh <= 100)) {
      throw table.bad(r, "rh_pct", "relative humidity must be above 0 and at most 100 %; give it"
          + " in percent, 0–100, e.g. 70 (not 0.70)");
    }
    return Psychrometrics.dewPointFromRhC(airC, rh);
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
