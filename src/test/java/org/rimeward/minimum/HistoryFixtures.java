package org.rimeward.minimum;

import java.time.Duration;
import java.time.LocalDate;

/** Invented station histories for tests outside this package. */
public final class HistoryFixtures {
  private HistoryFixtures() {}

  /** {@code radiation} nights obeying the law, then {@code cloudy} overcast ones. */
  public static String history(long seed, double a, double b, double c, LocalDate first,
      int radiation, int cloudy, Duration step) {
    HistoryWriter w = new HistoryWriter(seed, a, b, c, 0, false, true, step);
    for (int i = 0; i < radiation + cloudy; i++) {
      w.night(first.plusDays(i), i < radiation ? HistoryWriter.Kind.RADIATION : HistoryWriter.Kind.CLOUDY);
    }
    return w.text();
  }

  /** A mixed season with noise: every third night overcast, every fifth windy. */
  public static String season(long seed, double a, double b, double c, double noiseC,
      LocalDate first, int nights, Duration step) {
    HistoryWriter w = new HistoryWriter(seed, a, b, c, noiseC, false, true, step);
    for (int i = 0; i < nights; i++) {
      w.night(first.plusDays(i), i % 3 == 1 ? HistoryWriter.Kind.CLOUDY
          : i % 5 == 2 ? HistoryWriter.Kind.WINDY : HistoryWriter.Kind.RADIATION);
    }
    return w.text();
  }

  public static String farmYaml() {
    return HistoryWriter.farmYaml();
  }
}
