package org.rimeward.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.Stroke;
import java.awt.geom.Rectangle2D;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.Marker;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;

/**
 * The look every chart shares, and drawing a chart as inline SVG. Colours are the Okabe-Ito
 * set, which readers with the common colour-vision deficiencies tell apart; every line also has
 * its own dash pattern, so a black-and-white print keeps them apart too.
 */
final class ChartSvg {
  static final Color INK = Color.BLACK;
  static final Color BLUE = new Color(0x00, 0x72, 0xB2);
  static final Color VERMILLION = new Color(0xD5, 0x5E, 0x00);
  static final Color SKY = new Color(0x56, 0xB4, 0xE9);
  static final Color GREEN = new Color(0x00, 0x9E, 0x73);
  static final Color PURPLE = new Color(0xCC, 0x79, 0xA7);
  static final Color GRID = new Color(0xBB, 0xBB, 0xBB);

  static final Stroke SOLID = new BasicStroke(2.2f);
  static final Stroke DASHED = new BasicStroke(2.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER,
      10f, new float[] {8f, 4f}, 0f);
  static final Stroke DOTTED = new BasicStroke(2.4f, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND,
      10f, new float[] {1f, 5f}, 0f);
  static final Stroke THIN_DASH = new BasicStroke(1.2f, BasicStroke.CAP_BUTT,
      BasicStroke.JOIN_MITER, 10f, new float[] {4f, 3f}, 0f);
  static final Stroke THIN = new BasicStroke(1.2f);

  static final Font TITLE = new Font(Font.SANS_SERIF, Font.BOLD, 15);
  static final Font LABEL = new Font(Font.SANS_SERIF, Font.PLAIN, 12);

  private ChartSvg() {}

  /** The chart as an SVG element that scales to its box (no fixed width or height). */
  static String svg(JFreeChart chart, int width, int height, String id) {
    SVGGraphics2D g = new SVGGraphics2D(width, height);
    chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
    return g.getSVGElement(id, false, new ViewBox(0, 0, width, height), null, null);
  }

  /** A labelled horizontal or vertical line. */
  static ValueMarker line(double value, String label, Paint paint, Stroke stroke,
      RectangleAnchor anchor, TextAnchor text) {
    ValueMarker m = new ValueMarker(value, paint, stroke);
    label(m, label, anchor, text);
    return m;
  }

  /** A labelled band. */
  static IntervalMarker band(double from, double to, String label, Paint paint) {
    IntervalMarker m = new IntervalMarker(from, to, paint, THIN, INK, THIN, 0.35f);
    label(m, label, RectangleAnchor.TOP_LEFT, TextAnchor.TOP_LEFT);
    return m;
  }

  private static void label(Marker m, String label, RectangleAnchor anchor, TextAnchor text) {
    m.setLabel(label);
    m.setLabelFont(LABEL);
    m.setLabelPaint(INK);
    m.setLabelAnchor(anchor);
    m.setLabelTextAnchor(text);
  }

  /** Markers go behind the data lines. */
  static final Layer BEHIND = Layer.BACKGROUND;
}
