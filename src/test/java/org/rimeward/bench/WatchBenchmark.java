package org.rimeward.bench;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Stream;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.Replanner;
import org.rimeward.rules.RuleBook;
import org.rimeward.watch.NightWatch;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;
import org.rimeward.watch.WatchPolicy;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastReader;

/**
 * The night watch's figures, printed, never asserted: a simulated 14-hour demo night (17:00 to
 * 07:00) in which a logger appends one invented reading a minute (the demo forecast, 1.5 °C colder
 * from 22:00), watched at a 1-minute and a 5-minute interval. It prints the warm re-plan time
 * inside the running watch (median and 95th percentile, after ten warm-up passes), the heap used
 * after a full GC at points through the night, and the size of the night's audit trail.
 */
public final class WatchBenchmark {
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  private static final Instant START = OffsetDateTime.parse("2026-04-14T17:00-07:00").toInstant();

  private WatchBenchmark() {}

  public static void main(String[] args) throws Exception {
    Path work = Files.createTempDirectory("rimeward-watch-bench");
    try {
      night(work.resolve("every-1m"), 1);
      night(work.resolve("every-5m"), 5);
    } finally {
      try (Stream<Path> s = Files.walk(work)) {
        s.sorted(Collections.reverseOrder()).forEach(p -> p.toFile().delete());
      }
    }
  }

  private static void night(Path farm, int everyMin) throws Exception {
    Files.createDirectories(farm);
    for (String f : List.of("farm.yaml", "forecast.csv")) {
      Files.copy(Path.of("demo-farm", f), farm.resolve(f));
    }
    Forecast forecast = ForecastReader.read(farm.resolve("forecast.csv"), ZONE);
    Path readings = farm.resolve("readings.csv");
    Files.writeString(readings, "time,air_temp_c,dew_point_c,wind_ms\n");
    Replanner rp = Replanner.load(new PlanRequest(farm, null, Path.of("crop-profiles"),
        Path.of("rules"), null), RuleBook::load);
    StringWriter sink = new StringWriter();
    NightWatch watch = new NightWatch(rp, readings, Optional.empty(),
        WatchPolicy.from(rp.thresholds(), Duration.ofSeconds(10)), UnitFormat.of(UnitSystem.METRIC),
        Optional.of(farm.resolve("audit.db")), Optional.empty(), new PrintWriter(sink),
        new PrintWriter(sink));
    List<Double> ms = new ArrayList<>();
    int minutes = 14 * 60;
    int passes = 0;
    int recorded = 0;
    int alarms = 0;
    StringBuilder heap = new StringBuilder();
    for (int m = 0; m <= minutes; m++) {
      Instant t = START.plus(Duration.ofMinutes(m));
      double air = ForecastCorrection.forecastAirC(forecast, t)
          - (t.isAfter(OffsetDateTime.parse("2026-04-14T22:00-07:00").toInstant()) ? 1.5 : 0);
      Files.writeString(readings, String.format(Locale.ROOT, "%s,%.2f,%.2f,1.0%n",
          OffsetDateTime.ofInstant(t, ZONE), air, Math.min(air, -5.0)), StandardOpenOption.APPEND);
      if (m % everyMin != 0) {
        continue;
      }
      long t0 = System.nanoTime();
      NightWatch.Pass p = watch.pass(t);
      double took = (System.nanoTime() - t0) / 1e6;
      passes++;
      recorded += p.recorded() ? 1 : 0;
      alarms += p.raised().size();
      if (passes > 10 && !p.recorded()) {
        ms.add(took);
      }
      if (m % 210 == 0) {
        System.gc();
        long used = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
        heap.append(String.format(Locale.ROOT, " %s %.1f MB;", OffsetDateTime.ofInstant(t, ZONE)
            .toLocalTime(), used / 1e6));
      }
    }
    watch.close();
    Collections.sort(ms);
    long trail = Files.size(farm.resolve("audit.db"))
        + (Files.exists(farm.resolve("audit.db-wal")) ? Files.size(farm.resolve("audit.db-wal")) : 0);
    System.out.printf(Locale.ROOT, "watch, demo farm, 14-hour night, a reading a minute, pass every"
        + " %d min: %d passes, %d re-plans recorded, %d alarms%n", everyMin, passes, recorded, alarms);
    System.out.printf(Locale.ROOT, "  warm re-plan in the watch (not recorded): median %.1f ms, p95"
        + " %.1f ms, max %.1f ms over %d passes%n", ms.get(ms.size() / 2),
        ms.get((int) (ms.size() * 0.95)), ms.get(ms.size() - 1), ms.size());
    System.out.println("  heap after GC:" + heap);
    System.out.printf(Locale.ROOT, "  audit trail of the night: %.2f MB (%s)%n", trail / 1e6,
        farm.resolve("audit.db").getFileName());
  }
}
