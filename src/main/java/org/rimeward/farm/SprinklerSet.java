package org.rimeward.farm;

import java.util.Locale;

/**
 * An irrigation set: the part of a block that one valve or lateral group wets, switched as one.
 *
 * @param areaHa the area it wets, ha
 * @param flowM3H what it draws at the block's rate, m³/h
 */
public record SprinklerSet(String id, double areaHa, double flowM3H) {
  public SprinklerSet {
    Ids.check("set id", id);
    if (!(areaHa > 0 && Double.isFinite(areaHa)) || !(flowM3H > 0 && Double.isFinite(flowM3H))) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "set %s: area and flow must be above 0, were %s ha and %s m³/h", id, areaHa, flowM3H));
    }
  }
}
