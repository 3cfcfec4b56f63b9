package org.rimeward.plan;

import java.util.Locale;

/** Writes small forecast CSV texts for tests: invented weather, one row per hour. */
final class Forecasts {
  private Forecasts() {}

  /**
   * Hourly rows from {@code firstHour} (0–23) on {@code date}, with the given UTC offset (e.g.
   * "-07:00"); the hour rolls into the next day.
   */
  static String hourly(String date, int firstHour, String offset, double[] air, double[] dew,
      double[] wind, double[] cloud) {
    StringBuilder sb = new StringBuilder("time,air_temp_c,dew_point_c,wind_ms,cloud_pct\n");
    java.time.LocalDateTime t = java.time.LocalDate.parse(date).atTime(firstHour, 0);
    for (int i = 0; i < air.length; i++) {
      sb.append(String.format(Locale.ROOT, "%s%s,%.2f,%.2f,%.2f,%.0f%n", t.plusHours(i), offset,
          air[i], dew[i], wind[i], cloud[i]));
    }
    return sb.toString();
  }

  static double[] fill(int n, double v) {
    double[] a = new double[n];
    java.util.Arrays.fill(a, v);
    return a;
  }
}
