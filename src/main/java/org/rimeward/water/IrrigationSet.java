package org.rimeward.water;

import java.util.Objects;

/**
 * A part of a block that is switched on and off as one (a valve, a lateral group): the unit in
 * which a block can be protected in part.
 *
 * @param flowM3H what the set draws at the block's installed rate
 */
public record IrrigationSet(String id, double areaHa, double flowM3H) {
  public IrrigationSet {
    Objects.requireNonNull(id, "id");
    if (!(areaHa > 0 && Double.isFinite(areaHa))) {
      throw new IllegalArgumentException("set " + id + ": area must be above 0 ha, was " + areaHa);
    }
    if (!(flowM3H > 0 && Double.isFinite(flowM3H))) {
      throw new IllegalArgumentException("set " + id + ": flow must be above 0 m³/h, was " + flowM3H);
    }
  }
}
