package org.rimeward.cli;

import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/** How a grower says a variety differs from its crop's table: hardier or more tender, by how much. */
final class ProfileListWords {
  private ProfileListWords() {}

  /** "0.56 °C hardier", "0.50 °C more tender", or "as the table" for a hardiness offset in °C. */
  static String offset(double offsetC, UnitSystem units) {
    if (offsetC == 0) {
      return "as the table";
    }
    return Quantities.format(Math.abs(offsetC), Dimension.TEMPERATURE_DELTA, units, 2)
        + (offsetC > 0 ? " hardier" : " more tender");
  }
}
