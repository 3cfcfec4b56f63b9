package org.rimeward.farm;

import java.util.Locale;
import java.util.Objects;

/**
 * Row covers or frost cloth on a block.
 *
 * @param protectionC how much warmer the plants stay under the cover, °C (a difference)
 * @param protectionSource where that figure comes from: "given in farm.yaml" or the fabric-weight
 *     table point and its published source
 * @param deployHours how long it takes to put the covers on, hours
 */
public record Covers(double protectionC, String protectionSource, double deployHours) {
  /**
   * Largest protection accepted, °C. The most any reference reports is about +10 °F (5.6 °C) for
   * a double layer of plastic (see {@link FabricProtection}); 6 °C leaves room for that.
   */
  public static final double MAX_PROTECTION_C = 6.0;
  public static final double MAX_DEPLOY_HOURS = 12.0;

  public Covers {
    Objects.requireNonNull(protectionSource, "protectionSource");
    if (!(protectionC > 0 && protectionC <= MAX_PROTECTION_C)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "cover protection %s °C is outside 0 (exclusive) to %.0f °C", protectionC, MAX_PROTECTION_C));
    }
    if (!(deployHours >= 0 && deployHours <= MAX_DEPLOY_HOURS)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "deploy hours %s is outside 0 to %.0f", deployHours, MAX_DEPLOY_HOURS));
    }
  }
}
