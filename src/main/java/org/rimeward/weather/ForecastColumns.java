package org.rimeward.weather;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.rimeward.io.BadInputException;
import org.rimeward.io.CsvTable;
import org.rimeward.io.Text;

/**
 * The forecast CSV's header: which columns are allowed, and which one of each group (air
 * temperature, humidity, wind) this file gives. Column names carry the unit, so a value is
 * converted by its column and never guessed from its size.
 *
 * @param air {@code air_temp_c} or {@code air_temp_f}
 * @param humidity {@code dew_point_c}, {@code dew_point_f} or {@code rh_pct}
 * @param wind {@code wind_ms}, {@code wind_kmh} or {@code wind_mph}
 * @param windHeight whether a {@code wind_height_m} column is given
 * @param solar whether a {@code solar_wm2} column is given
 */
record ForecastColumns(String air, String humidity, String wind, boolean windHeight, boolean solar) {
  static final List<String> ALLOWED = List.of("time", "air_temp_c", "air_temp_f",
      "dew_point_c", "dew_point_f", "rh_pct", "wind_ms", "wind_kmh", "wind_mph", "wind_height_m",
      "cloud_pct", "solar_wm2");
  static final List<String> AIR = List.of("air_temp_c", "air_temp_f");
  static final List<String> HUMIDITY = List.of("dew_point_c", "dew_point_f", "rh_pct");
  static final List<String> WIND = List.of("wind_ms", "wind_kmh", "wind_mph");
  /** The unit of each wind column, as the unit table spells it. */
  static final Map<String, String> WIND_UNIT = Map.of("wind_ms", "m/s", "wind_kmh", "km/h",
      "wind_mph", "mph");

  /** The columns of {@code table}, checked: only known ones, exactly one of each group. */
  static ForecastColumns of(CsvTable table) {
    String where = table.label() + ":" + table.headerLine();
    List<String> names = table.columnsLowerCase();
    for (int i = 0; i < names.size(); i++) {
      if (!ALLOWED.contains(names.get(i))) {
        throw BadInputException.at(where, "column " + (i + 1) + " "
            + Text.quote(table.columns().get(i)) + " is not a forecast column; allowed columns: "
            + String.join(", ", ALLOWED));
      }
    }
    one(names, where, List.of("time"), "the time of each step, e.g. 2024-04-12T22:00-07:00");
    String air = one(names, where, AIR, "the air temperature");
    String humidity = one(names, where, HUMIDITY, "the humidity, as a dew point or relative"
        + " humidity");
    String wind = one(names, where, WIND, "the wind speed");
    one(names, where, List.of("cloud_pct"), "the cloud cover, 0-100 %");
    return new ForecastColumns(air, humidity, wind, names.contains("wind_height_m"),
        names.contains("solar_wm2"));
  }

  private static String one(List<String> names, String where, List<String> group, String what) {
    List<String> present = new ArrayList<>(group.stream().filter(names::contains).toList());
    String choices = group.size() == 1 ? "'" + group.get(0) + "'" : "one of " + String.join(", ", group);
    if (present.isEmpty()) {
      throw BadInputException.at(where, "no column for " + what + "; add " + choices);
    }
    if (present.size() > 1) {
      throw BadInputException.at(where, "columns " + String.join(" and ", present)
          + " both give " + what + "; keep exactly " + choices);
    }
    return present.get(0);
  }
}
