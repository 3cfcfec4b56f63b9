package org.rimeward.weather;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rimeward.io.BadInputException;
import org.rimeward.io.CsvTable;
import org.rimeward.io.Text;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * The column vocabulary Rimeward's weather CSVs share, the forecast's and the station readings',
 * and how a cell of each column is read into canonical units. Column names carry the unit, so a
 * value is converted by its column and never guessed from its size. Which columns a file must
 * have differs: a forecast gives every quantity on every step; a logger may record only the air.
 *
 * @param air {@code air_temp_c} or {@code air_temp_f}
 * @param humidity {@code dew_point_c}, {@code dew_point_f} or {@code rh_pct}; null when none
 * @param wind {@code wind_ms}, {@code wind_kmh} or {@code wind_mph}; null when none
 * @param wetBulb {@code wet_bulb_c} or {@code wet_bulb_f}; null when none
 * @param windHeight whether a {@code wind_height_m} column is given
 * @param cloud whether a {@code cloud_pct} column is given
 * @param solar whether a {@code solar_wm2} column is given
 * @param station whether a {@code station} column is given
 */
record WeatherColumns(String air, String humidity, String wind, String wetBulb, boolean windHeight,
    boolean cloud, boolean solar, boolean station) {
  static final List<String> AIR = List.of("air_temp_c", "air_temp_f");
  static final List<String> HUMIDITY = List.of("dew_point_c", "dew_point_f", "rh_pct");
  static final List<String> WIND = List.of("wind_ms", "wind_kmh", "wind_mph");
  static final List<String> WET_BULB = List.of("wet_bulb_c", "wet_bulb_f");
  /** The unit of each wind column, as the unit table spells it. */
  static final Map<String, String> WIND_UNIT = Map.of("wind_ms", "m/s", "wind_kmh", "km/h",
      "wind_mph", "mph");

  /** A forecast's columns: every step has a time, air, humidity, wind and cloud. */
  static final List<String> FORECAST = List.of("time", "air_temp_c", "air_temp_f",
      "dew_point_c", "dew_point_f", "rh_pct", "wind_ms", "wind_kmh", "wind_mph", "wind_height_m",
      "cloud_pct", "solar_wm2");
  /** A station's columns: the forecast's, the station's id and a psychrometer's wet bulb. */
  static final List<String> READINGS = List.of("time", "station", "air_temp_c", "air_temp_f",
      "dew_point_c", "dew_point_f", "rh_pct", "wind_ms", "wind_kmh", "wind_mph", "wind_height_m",
      "cloud_pct", "solar_wm2", "wet_bulb_c", "wet_bulb_f");

  /** Above this a value in a °C column is taken to be °F: no frost-night air is above 45 °C. */
  static final double SURELY_F_ABOVE_C = 45.0;

  /** The forecast's header, checked: only known columns, exactly one of each group. */
  static WeatherColumns forecast(CsvTable table) {
    String where = where(table);
    List<String> names = known(table, FORECAST, "forecast");
    exactlyOne(names, where, List.of("time"), "the time of each step, e.g. 2024-04-12T22:00-07:00");
    String air = exactlyOne(names, where, AIR, "the air temperature");
    String humidity = exactlyOne(names, where, HUMIDITY, "the humidity, as a dew point or relative"
        + " humidity");
    String wind = exactlyOne(names, where, WIND, "the wind speed");
    exactlyOne(names, where, List.of("cloud_pct"), "the cloud cover, 0-100 %");
    return new WeatherColumns(air, humidity, wind, null, names.contains("wind_height_m"), true,
        names.contains("solar_wm2"), false);
  }

  /** A station's header, checked: a time and the air are required, at most one of each group. */
  static WeatherColumns readings(CsvTable table) {
    String where = where(table);
    List<String> names = known(table, READINGS, "readings");
    exactlyOne(names, where, List.of("time"), "the time of each reading, e.g."
        + " 2026-04-14T22:10-07:00");
    String air = exactlyOne(names, where, AIR, "the air temperature");
    return new WeatherColumns(air, atMostOne(names, where, HUMIDITY, "the humidity"),
        atMostOne(names, where, WIND, "the wind speed"), atMostOne(names, where, WET_BULB,
            "the wet bulb"), names.contains("wind_height_m"), names.contains("cloud_pct"),
        names.contains("solar_wm2"), names.contains("station"));
  }

  private static String where(CsvTable table) {
    return table.label() + ":" + table.headerLine();
  }

  private static List<String> known(CsvTable table, List<String> allowed, String kind) {
    List<String> names = table.columnsLowerCase();
    for (int i = 0; i < names.size(); i++) {
      if (!allowed.contains(names.get(i))) {
        throw BadInputException.at(where(table), "column " + (i + 1) + " "
            + Text.quote(table.columns().get(i)) + " is not a " + kind + " column; allowed"
            + " columns: " + String.join(", ", allowed));
      }
    }
    return names;
  }

  private static String exactlyOne(List<String> names, String where, List<String> group,
      String what) {
    String choices = group.size() == 1 ? "'" + group.get(0) + "'" : "one of " + String.join(", ", group);
    List<String> present = new ArrayList<>(group.stream().filter(names::contains).toList());
    if (present.isEmpty()) {
      throw BadInputException.at(where, "no column for " + what + "; add " + choices);
    }
    if (present.size() > 1) {
      throw BadInputException.at(where, "columns " + String.join(" and ", present)
          + " both give " + what + "; keep exactly " + choices);
    }
    return present.get(0);
  }

  private static String atMostOne(List<String> names, String where, List<String> group,
      String what) {
    List<String> present = group.stream().filter(names::contains).toList();
    if (present.size() > 1) {
      throw BadInputException.at(where, "columns " + String.join(" and ", present) + " both give "
          + what + "; keep one");
    }
    return present.isEmpty() ? null : present.get(0);
  }

  /** A temperature column's value in °C; a °C column holding a °F-sized value is refused. */
  static double temperatureC(CsvTable table, CsvTable.Row r, String column) {
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

  /** The dew point from relative humidity in percent (Alduchov & Eskridge 1996), °C. */
  static double dewFromRhC(CsvTable table, CsvTable.Row r, double airC) {
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

  /** A wind column's value in m/s, 0 to {@link ForecastStep#MAX_WIND_MS}. */
  static double windMs(CsvTable table, CsvTable.Row r, String column) {
    double inUnit = table.number(r, column);
    String unit = WIND_UNIT.get(column);
    double ms = Quantities.toCanonical(inUnit, Dimension.SPEED, unit);
    if (!(ms >= 0 && ms <= ForecastStep.MAX_WIND_MS)) {
      throw table.bad(r, column, String.format(Locale.ROOT, "wind speed must be 0 to %.0f %s"
          + " (%.0f m/s); check the value and the column's unit", ForecastStep.MAX_WIND_MS
          / Quantities.toCanonical(1, Dimension.SPEED, unit), unit, ForecastStep.MAX_WIND_MS));
    }
    return ms;
  }

  /** The height of the wind value above ground, m. */
  static double windHeightM(CsvTable table, CsvTable.Row r) {
    double heightM = table.number(r, "wind_height_m");
    if (!(heightM > 0 && heightM <= ForecastStep.MAX_WIND_HEIGHT_M)) {
      throw table.bad(r, "wind_height_m", "the wind height must be above 0 and at most 100 m;"
          + " give the height of the wind value above ground, e.g. 10 or 2");
    }
    return heightM;
  }

  /** Cloud cover, %. */
  static double cloudPct(CsvTable table, CsvTable.Row r) {
    double cloud = table.number(r, "cloud_pct");
    if (!(cloud >= 0 && cloud <= 100)) {
      throw table.bad(r, "cloud_pct", "cloud cover must be 0 to 100 %; give it in percent"
          + " (8 oktas = 100 %)");
    }
    return cloud;
  }

  /** Global solar radiation, W/m². */
  static double solarWm2(CsvTable table, CsvTable.Row r) {
    double s = table.number(r, "solar_wm2");
    if (!(s >= 0 && s <= ForecastStep.MAX_SOLAR_WM2)) {
      throw table.bad(r, "solar_wm2", "solar radiation must be 0 to 1400 W/m² (the solar"
          + " constant is about 1361 W/m²); leave the cell empty if unknown");
    }
    return s;
  }
}
