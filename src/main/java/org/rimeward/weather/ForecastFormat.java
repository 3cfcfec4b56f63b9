package org.rimeward.weather;

import java.util.Arrays;
import java.util.stream.Collectors;

/** The forecast formats Rimeward reads, each recognised by its content. */
public enum ForecastFormat {
  CSV("csv", "Rimeward forecast CSV (time,air_temp_c,dew_point_c,wind_ms,cloud_pct,...)"),
  OPEN_METEO("open-meteo", "Open-Meteo forecast JSON (hourly arrays with hourly_units)"),
  NWS_GRIDPOINT("nws", "US National Weather Service gridpoint JSON (api.weather.gov/gridpoints/...)"),
  MET_NORWAY("met-norway", "MET Norway locationforecast JSON (properties.timeseries)");

  private final String id;
  private final String description;

  ForecastFormat(String id, String description) {
    this.id = id;
    this.description = description;
  }

  /** The short name used in plans, file names and {@code forecast fetch --source}. */
  public String id() {
    return id;
  }

  public String description() {
    return description;
  }

  /** Every known format, one per line, for a message about a file that matches none. */
  public static String known() {
    return Arrays.stream(values()).map(f -> "  " + f.description).collect(Collectors.joining("\n"));
  }
}
