package org.rimeward.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanJson;
import org.rimeward.report.NightPage;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * What the demo night's HTML page adds to a plan, in one JVM: the first page (loading the chart
 * and template libraries, as a single 'plan --format html' run pays) and then warm pages. Prints
 * figures, asserts nothing. Run: java -cp target/test-classes:target/rimeward.jar
 * org.rimeward.bench.PageBenchmark
 */
public final class PageBenchmark {
  private PageBenchmark() {}

  public static void main(String[] args) throws Exception {
    PlanDocument demo = PlanJson.read(Files.readString(
        Path.of("src/test/resources/golden/demo-plan.json")));
    UnitFormat fmt = UnitFormat.of(UnitSystem.METRIC);
    var threads = java.lang.management.ManagementFactory.getThreadMXBean();
    long c0 = threads.getCurrentThreadCpuTime();
    long t0 = System.nanoTime();
    String html = NightPage.html(NightPage.of(demo, fmt, PlanDocument.Rule::explanation, Map.of(), null));
    double first = (System.nanoTime() - t0) / 1e9;
    double firstCpu = (threads.getCurrentThreadCpuTime() - c0) / 1e9;
    int runs = 10;
    double[] warm = new double[runs];
    for (int i = 0; i < runs; i++) {
      long t = System.nanoTime();
      NightPage.html(NightPage.of(demo, fmt, PlanDocument.Rule::explanation, Map.of(), null));
      warm[i] = (System.nanoTime() - t) / 1e9;
    }
    java.util.Arrays.sort(warm);
    System.out.printf(Locale.ROOT, "demo night page (%d charts, %d kB): first %.2f s (%.2f s of"
        + " CPU), then median %.3f s over %d runs; load average %.1f%n",
        html.split("<svg", -1).length - 1, html.length() / 1024, first, firstCpu, warm[runs / 2],
        runs,
        java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
  }
}
