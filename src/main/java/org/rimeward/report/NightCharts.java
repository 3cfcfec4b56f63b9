package org.rimeward.report;

import java.text.SimpleDateFormat;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TimeZone;
import java.util.TreeSet;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.rimeward.plan.PlanDocument;
import org.rimeward.units.Dimension;
import org.rimeward.units.UnitFormat;

/**
 * The night's charts, drawn by JFreeChart into SVG: one per block at risk (its temperatures over
 * the night against its target, T10 and T90, with sprinkling and covers as bands) and one per
 * water source (planned flow against its limit, volume used against what it holds).
 */
final class NightCharts {
  static final int WIDTH = 760;
  static final int HEIGHT = 340;

  private NightCharts() {}

  /**
   * One block's chart; {@code readings} are the air readings of the block's station in a re-plan
   * (empty at dusk), drawn as points at the block: the reading plus the block's cold-air offset,
   * or the reading itself where the thermometer hangs in the block ({@code inBlock}).
   */
  static String block(PlanDocument.Block b, UnitFormat fmt, ZoneId zone, OffsetDateTime now,
      List<PlanDocument.Point> readings, boolean inBlock) {
    double offsetC = inBlock ? 0.0 : b.coldAirOffsetC();
    XYSeries air = new XYSeries("forecast air");
    XYSeries bud = new XYSeries("bud, estimated (dry)");
    XYSeries wet = new XYSeries("wet bulb");
    double lo = Math.min(b.t90C(), b.targetC());
    double hi = b.t10C();
    for (PlanDocument.Step s : b.series()) {
      long x = millis(s.at());
      air.add(x, fmt.tempValue(s.airC()));
      bud.add(x, fmt.tempValue(s.budC()));
      wet.add(x, fmt.tempValue(s.wetBulbC()));
      lo = Math.min(lo, Math.min(s.budC(), s.wetBulbC()));
      hi = Math.max(hi, s.airC());
    }
    XYSeries read = new XYSeries(inBlock ? "readings at the block"
        : "readings (station + block offset)");
    long first = b.series().isEmpty() ? Long.MIN_VALUE : millis(b.series().get(0).at());
    for (PlanDocument.Point p : readings) {
      if (millis(p.at()) < first) {
        continue;
      }
      double atBlockC = p.airC() + offsetC;
      read.add(millis(p.at()), fmt.tempValue(atBlockC));
      lo = Math.min(lo, atBlockC);
      hi = Math.max(hi, atBlockC);
    }
    XYSeriesCollection data = new XYSeriesCollection();
    data.addSeries(air);
    data.addSeries(bud);
    data.addSeries(wet);
    XYLineAndShapeRenderer lines = new XYLineAndShapeRenderer(true, false);
    style(lines, 0, ChartSvg.INK, ChartSvg.SOLID);
    style(lines, 1, ChartSvg.BLUE, ChartSvg.DASHED);
    style(lines, 2, ChartSvg.VERMILLION, ChartSvg.DOTTED);
    if (!readings.isEmpty()) {
      // Points, not a line: each is a thermometer's reading, the curves are estimates.
      data.addSeries(read);
      lines.setSeriesLinesVisible(3, false);
      lines.setSeriesShapesVisible(3, true);
      lines.setSeriesShape(3, new java.awt.geom.Ellipse2D.Double(-3, -3, 6, 6));
      lines.setSeriesPaint(3, ChartSvg.GREEN);
    }
    NumberAxis y = new NumberAxis("temperature (" + fmt.symbol(Dimension.TEMPERATURE) + ")");
    y.setLabelFont(ChartSvg.LABEL);
    y.setRange(fmt.tempValue(lo) - 1.5, fmt.tempValue(hi) + 1.0);
    XYPlot plot = new XYPlot(data, timeAxis(zone), y, lines);
    plain(plot);
    for (PlanDocument.Action a : b.actions()) {
      if (a instanceof PlanDocument.Sprinkle s && s.waterGranted() && s.start() != null) {
        long stop = s.stop() != null ? millis(s.stop()) : millis(last(b));
        plot.addDomainMarker(ChartSvg.band(millis(s.start()), stop, "sprinkling", ChartSvg.SKY),
            ChartSvg.BEHIND);
        plot.addDomainMarker(ChartSvg.line(millis(s.start()), "start " + fmt.clock(s.start()),
            ChartSvg.INK, ChartSvg.SOLID, RectangleAnchor.BOTTOM, TextAnchor.BOTTOM_LEFT));
        if (s.stop() != null) {
          plot.addDomainMarker(ChartSvg.line(stop, "stop " + fmt.clock(s.stop()), ChartSvg.INK,
              ChartSvg.SOLID, RectangleAnchor.BOTTOM, TextAnchor.BOTTOM_RIGHT));
        }
      } else if (a instanceof PlanDocument.Cover c) {
        long on = millis(c.deployBy() != null ? c.deployBy() : c.deployStart());
        long off = c.remove() != null ? millis(c.remove()) : millis(last(b));
        var band = ChartSvg.band(on, off, "covers on", ChartSvg.GREEN);
        band.setLabelAnchor(RectangleAnchor.BOTTOM_LEFT);
        band.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
        band.setAlpha(0.18f);
        plot.addDomainMarker(band, ChartSvg.BEHIND);
      }
    }
    if (now != null) {
      // A re-plan from the station's readings: the curves left of now follow the readings.
      plot.addDomainMarker(ChartSvg.line(millis(now), "now " + fmt.clock(now) + " (readings to here)",
          ChartSvg.GREEN, ChartSvg.DASHED, RectangleAnchor.TOP, TextAnchor.TOP_RIGHT));
    }
    plot.addRangeMarker(ChartSvg.line(fmt.tempValue(b.targetC()), "target " + fmt.temp(b.targetC()),
        ChartSvg.PURPLE, ChartSvg.SOLID, RectangleAnchor.TOP_RIGHT, TextAnchor.BOTTOM_RIGHT));
    if (Math.abs(b.t10C() - b.targetC()) > 0.05) {
      plot.addRangeMarker(ChartSvg.line(fmt.tempValue(b.t10C()), "T10 " + fmt.temp(b.t10C()),
          ChartSvg.INK, ChartSvg.THIN_DASH, RectangleAnchor.TOP_RIGHT, TextAnchor.BOTTOM_RIGHT));
    } else {
      // The target is T10 itself: one line, named for both.
      plot.clearRangeMarkers();
      plot.addRangeMarker(ChartSvg.line(fmt.tempValue(b.targetC()), "target = T10 "
          + fmt.temp(b.targetC()), ChartSvg.PURPLE, ChartSvg.SOLID, RectangleAnchor.TOP_RIGHT,
          TextAnchor.BOTTOM_RIGHT));
    }
    plot.addRangeMarker(ChartSvg.line(fmt.tempValue(b.t90C()), "T90 " + fmt.temp(b.t90C()),
        ChartSvg.INK, ChartSvg.THIN_DASH, RectangleAnchor.BOTTOM_RIGHT, TextAnchor.TOP_RIGHT));
    JFreeChart chart = new JFreeChart(null, ChartSvg.TITLE, plot, true);
    chart.setBackgroundPaint(java.awt.Color.WHITE);
    chart.getLegend().setItemFont(ChartSvg.LABEL);
    chart.setTitle(new TextTitle(b.block() + ": temperatures through the night", ChartSvg.TITLE));
    return ChartSvg.svg(chart, WIDTH, HEIGHT, "chart-" + b.block());
  }

  /**
   * Planned flow from a source through the night, summed over the sprinkling it carries, against
   * its maximum; below it, the volume drawn so far against what the source holds.
   */
  static String water(PlanDocument plan, PlanDocument.Water w, UnitFormat fmt, ZoneId zone) {
    List<PlanDocument.Sprinkle> runs = new ArrayList<>();
    for (PlanDocument.Block b : plan.blocks()) {
      b.sprinkle().filter(s -> s.waterGranted() && s.start() != null && s.stop() != null
          && w.source().equals(s.source())).ifPresent(runs::add);
    }
    TreeSet<Long> moments = new TreeSet<>();
    moments.add(millis(plan.night().sunset()));
    moments.add(millis(plan.night().sunrise()) + 4 * 3_600_000L);
    for (PlanDocument.Sprinkle s : runs) {
      moments.add(millis(s.start()));
      moments.add(millis(s.stop()));
    }
    XYSeries flow = new XYSeries("planned flow", false);
    XYSeries volume = new XYSeries("volume drawn", false);
    double drawnM3 = 0;
    Long prev = null;
    double prevFlow = 0;
    for (long t : moments) {
      if (prev != null) {
        drawnM3 += prevFlow * (t - prev) / 3_600_000.0;
      }
      double now = 0;
      for (PlanDocument.Sprinkle s : runs) {
        if (millis(s.start()) <= t && t < millis(s.stop())) {
          now += s.flowM3H();
        }
      }
      flow.add(t, fmt.flowValue(prevFlow));
      flow.add(t, fmt.flowValue(now));
      volume.add(t, fmt.volumeValue(drawnM3));
      prev = t;
      prevFlow = now;
    }
    XYLineAndShapeRenderer flowLine = new XYLineAndShapeRenderer(true, false);
    style(flowLine, 0, ChartSvg.BLUE, ChartSvg.SOLID);
    NumberAxis flowAxis = new NumberAxis("flow (" + fmt.symbol(Dimension.FLOW) + ")");
    flowAxis.setLabelFont(ChartSvg.LABEL);
    flowAxis.setUpperBound(Math.max(fmt.flowValue(w.maxFlowM3H()),
        fmt.flowValue(w.wantedPeakFlowM3H())) * 1.15);
    XYPlot top = new XYPlot(new XYSeriesCollection(flow), null, flowAxis, flowLine);
    plain(top);
    top.addRangeMarker(ChartSvg.line(fmt.flowValue(w.maxFlowM3H()), "max flow "
        + fmt.flow(w.maxFlowM3H()), ChartSvg.VERMILLION, ChartSvg.DASHED, RectangleAnchor.TOP_LEFT,
        TextAnchor.BOTTOM_LEFT));
    XYLineAndShapeRenderer volLine = new XYLineAndShapeRenderer(true, false);
    style(volLine, 0, ChartSvg.INK, ChartSvg.SOLID);
    NumberAxis volAxis = new NumberAxis("volume (" + fmt.symbol(Dimension.VOLUME) + ")");
    volAxis.setLabelFont(ChartSvg.LABEL);
    XYPlot bottom = new XYPlot(new XYSeriesCollection(volume), null, volAxis, volLine);
    plain(bottom);
    double top3 = w.volumeM3();
    if (w.availableM3() != null) {
      bottom.addRangeMarker(ChartSvg.line(fmt.volumeValue(w.availableM3()), "available "
          + fmt.volume(w.availableM3()), ChartSvg.VERMILLION, ChartSvg.DASHED,
          RectangleAnchor.TOP_LEFT, TextAnchor.BOTTOM_LEFT));
      top3 = Math.max(top3, w.availableM3());
    }
    volAxis.setRange(0, Math.max(1, fmt.volumeValue(top3) * 1.15));
    CombinedDomainXYPlot plot = new CombinedDomainXYPlot(timeAxis(zone));
    plot.add(top, 1);
    plot.add(bottom, 1);
    plot.setGap(12);
    JFreeChart chart = new JFreeChart(null, ChartSvg.TITLE, plot, true);
    chart.setBackgroundPaint(java.awt.Color.WHITE);
    chart.getLegend().setItemFont(ChartSvg.LABEL);
    chart.setTitle(new TextTitle(w.source() + ": planned flow and volume", ChartSvg.TITLE));
    return ChartSvg.svg(chart, WIDTH, HEIGHT + 60, "water-" + w.source());
  }

  private static DateAxis timeAxis(ZoneId zone) {
    DateAxis x = new DateAxis("local time (" + zone.getId() + ")");
    TimeZone tz = TimeZone.getTimeZone(zone);
    x.setTimeZone(tz);
    SimpleDateFormat hhmm = new SimpleDateFormat("HH:mm", Locale.ROOT);
    hhmm.setTimeZone(tz);
    x.setDateFormatOverride(hhmm);
    x.setLabelFont(ChartSvg.LABEL);
    return x;
  }

  private static void plain(XYPlot plot) {
    plot.setBackgroundPaint(java.awt.Color.WHITE);
    plot.setDomainGridlinePaint(ChartSvg.GRID);
    plot.setRangeGridlinePaint(ChartSvg.GRID);
    plot.setOutlinePaint(ChartSvg.INK);
  }

  private static void style(XYLineAndShapeRenderer r, int series, java.awt.Paint paint,
      java.awt.Stroke stroke) {
    r.setSeriesPaint(series, paint);
    r.setSeriesStroke(series, stroke);
  }

  private static OffsetDateTime last(PlanDocument.Block b) {
    return b.series().get(b.series().size() - 1).at();
  }

  static long millis(OffsetDateTime t) {
    return t.toInstant().toEpochMilli();
  }
}
