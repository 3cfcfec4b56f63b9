package org.rimeward.farm;

import java.util.List;
import java.util.Locale;

/**
 * Over-plant sprinklers on a block.
 *
 * @param rateMmH the application rate, mm/h
 * @param sourceId the water source that feeds them
 * @param waterTempC the supply water temperature, °C
 * @param sets the block's irrigation sets, in the file's order; empty when none are declared
 */
public record Sprinklers(double rateMmH, String sourceId, double waterTempC, List<SprinklerSet> sets) {
  /**
   * Application rates accepted, mm/h. Over-plant frost systems run about 0.10–0.25 in/h
   * (2.5–6.4 mm/h: MSU, M. Longstroth 2012; UF/IFAS; Zamora &amp; Dukes 2015); the bounds leave
   * room for high-wind designs and catch a unit slip such as 0.15 mm/h written for 0.15 in/h.
   */
  public static final double MIN_RATE_MM_H = 1.0;
  public static final double MAX_RATE_MM_H = 25.0;

  /**
   * Supply water temperature assumed when none is given, °C. Common practice / assumption: pond
   * or well water at night in spring is a few degrees above freezing; the under-tree figures in
   * Good Fruit Grower ("Frost control options", R. G. Evans) use 35–45 °F (1.7–7.2 °C) water, and
   * 5 °C sits inside that range. The sensible heat of the water is small beside the latent heat
   * of freezing (4.2 kJ/kg per °C against 334 kJ/kg), so the choice moves results little.
   */
  public static final double DEFAULT_WATER_TEMP_C = 5.0;

  public static final double MIN_WATER_TEMP_C = 0.0;
  public static final double MAX_WATER_TEMP_C = 40.0;

  /** Sprinklers with no irrigation sets declared. */
  public Sprinklers(double rateMmH, String sourceId, double waterTempC) {
    this(rateMmH, sourceId, waterTempC, List.of());
  }

  public Sprinklers {
    sets = List.copyOf(sets);
    Ids.check("sprinkler source", sourceId);
    if (!(rateMmH >= MIN_RATE_MM_H && rateMmH <= MAX_RATE_MM_H)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "sprinkler rate %s mm/h is outside %.0f to %.0f mm/h", rateMmH, MIN_RATE_MM_H, MAX_RATE_MM_H));
    }
    if (!(waterTempC >= MIN_WATER_TEMP_C && waterTempC <= MAX_WATER_TEMP_C)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "water temperature %s °C is outside %.0f to %.0f °C", waterTempC, MIN_WATER_TEMP_C, MAX_WATER_TEMP_C));
    }
  }
}
