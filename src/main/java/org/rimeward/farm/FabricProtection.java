package org.rimeward.farm;

import java.util.List;
import java.util.Locale;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * How much a single layer of floating row cover (frost cloth) of a given weight protects, from
 * published rules of thumb. No extension source gives a controlled table of protection against
 * fabric weight, so each point takes the lower figure its sources give, and weights between
 * points are interpolated linearly in g/m². Weights outside the table are refused rather than
 * extrapolated: the grower then states {@code protection:} directly.
 */
public final class FabricProtection {
  /** One table point: a fabric weight in oz/yd² and the protection in °F, with its source. */
  public record Point(double ozYd2, double protectionF, String source) {
    public double gM2() {
      return Quantities.parse(ozYd2 + " oz/yd2", Dimension.AREAL_MASS, "fabric");
    }

    public double protectionC() {
      return protectionF / 1.8;
    }
  }

  /** The table, lightest first. */
  public static final List<Point> POINTS = List.of(
      new Point(0.5, 2.0,
          "UMaine Highmoor (2023): thinner products 2-3 °F, lower figure taken"
              + " (0.6 oz/yd² at 2-3 °F in a grower FAQ agrees)"),
      new Point(1.2, 4.0,
          "U. Delaware Weekly Crop Update, G. Johnson, 'Strawberries, Row Covers & Freeze"
              + " Protection': a single 1.2 oz/yd² cover gives about 4 °F"),
      new Point(1.5, 5.0,
          "Purdue Vegetable Crops Hotline: about 5.5 °F observed under 1.5 oz/yd² on one night;"
              + " UGA strawberry blog 'Row Cover Usage' (2020): 3-5 °F for covers up to 1.5 oz;"
              + " the lower point figure, 5 °F, taken"),
      // Heavier cloth: UMaine gives 4-6 °F for "thicker covers". Its lower figure is below the
      // 1.5 oz point, so the table holds the 1.5 oz figure rather than rising further.
      new Point(2.0, 5.0,
          "UMaine Highmoor (2023): thicker covers 4-6 °F; held at the 1.5 oz/yd² figure,"
              + " no source shows heavier single layers doing better"));

  private FabricProtection() {}

  /** A protection figure and the sentence that says where it came from. */
  public record Protection(double protectionC, String source) {}

  /** The lightest and heaviest fabric in the table, g/m². */
  public static double minGM2() {
    return POINTS.get(0).gM2();
  }

  public static double maxGM2() {
    return POINTS.get(POINTS.size() - 1).gM2();
  }

  /**
   * Protection of a single layer of fabric weighing {@code gM2} g/m².
   *
   * @throws IllegalArgumentException outside the table's weights
   */
  public static Protection forWeight(double gM2) {
    if (!(gM2 >= minGM2() - 1e-9 && gM2 <= maxGM2() + 1e-9)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "%.1f g/m² (%.2f oz/yd²) is outside the fabric weights with a published protection figure,"
              + " %.1f to %.1f g/m² (%.1f to %.1f oz/yd²)",
          gM2, gM2 / POINTS.get(0).gM2() * POINTS.get(0).ozYd2(), minGM2(), maxGM2(),
          POINTS.get(0).ozYd2(), POINTS.get(POINTS.size() - 1).ozYd2()));
    }
    String weight = String.format(Locale.ROOT, "fabric %.1f g/m² (%.2f oz/yd²)",
        gM2, gM2 / POINTS.get(0).gM2() * POINTS.get(0).ozYd2());
    for (int i = 0; i < POINTS.size(); i++) {
      Point p = POINTS.get(i);
      if (Math.abs(gM2 - p.gM2()) < 0.05) {
        return new Protection(p.protectionC(), String.format(Locale.ROOT,
            "%s: %.1f °F (%.2f °C), table point %.1f oz/yd²; %s",
            weight, p.protectionF(), p.protectionC(), p.ozYd2(), p.source()));
      }
      if (i > 0 && gM2 < p.gM2()) {
        Point lo = POINTS.get(i - 1);
        double f = (gM2 - lo.gM2()) / (p.gM2() - lo.gM2());
        double protF = lo.protectionF() + f * (p.protectionF() - lo.protectionF());
        return new Protection(protF / 1.8, String.format(Locale.ROOT,
            "%s: %.1f °F (%.2f °C), interpolated between %.1f oz/yd² = %.1f °F (%s) and"
                + " %.1f oz/yd² = %.1f °F (%s)",
            weight, protF, protF / 1.8, lo.ozYd2(), lo.protectionF(), lo.source(),
            p.ozYd2(), p.protectionF(), p.source()));
      }
    }
    throw new IllegalStateException("fabric table does not bracket " + gM2);
  }
}
