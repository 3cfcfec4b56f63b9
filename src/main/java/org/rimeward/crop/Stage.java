package org.rimeward.crop;

import java.util.Objects;

/**
 * One bud development stage of a crop's base table, as the file gives it, converted to °C.
 *
 * @param bbch the approximate two-digit BBCH code, kept as text so {@code 05} stays {@code 05}
 * @param floweringFlag the stage's {@code flowering} flag as the file writes it: true where its
 *     flowers are open; null when the file gives none (then {@link #flowering()} reads the BBCH
 *     code)
 * @param t10C temperature at which about 10% of buds are killed after 30 min; for a stage that
 *     publishes one tolerance this is the tolerance itself
 * @param t90C temperature at which about 90% are killed; for a one-tolerance stage this is the
 *     tolerance less the file's {@code tolerance_t90_margin}
 * @param toleranceC the single published tolerance, or null for a 10/90 stage
 * @param line the line of the stage in its file, for messages
 */
public record Stage(String id, String name, String bbch, Boolean floweringFlag, double t10C,
    double t90C, Double toleranceC, String source, String note, int line) {
  /**
   * BBCH codes of open flowers, the fallback for a stage with no flag: 60 (first flowers open) to
   * 65 (full flowering, first petals falling). 67 (flowers fading, most petals fallen) and 69 (end
   * of flowering) are not: the flowers are spent. Principal stage 6 as the BBCH monograph (Meier
   * 2001) numbers it for the fruit crops; recalled from the monograph, not re-read for this.
   */
  static final int FIRST_FLOWERING_BBCH = 60;
  static final int LAST_FLOWERING_BBCH = 65;

  public Stage {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(bbch, "bbch");
    Objects.requireNonNull(source, "source");
    if (!(t90C < t10C)) {
      throw new IllegalArgumentException("stage " + id + ": t90 " + t90C + " °C must be colder than t10 "
          + t10C + " °C");
    }
  }

  public int bbchCode() {
    return Integer.parseInt(bbch);
  }

  public boolean singleTolerance() {
    return toleranceC != null;
  }

  /** Whether the stage's flowers are open: the file's flag, else its BBCH code. */
  public boolean flowering() {
    return floweringFlag != null ? floweringFlag : floweringByBbch(bbchCode());
  }

  /** The fallback for a stage with no flag: BBCH 60 to 65. */
  public static boolean floweringByBbch(int bbch) {
    return bbch >= FIRST_FLOWERING_BBCH && bbch <= LAST_FLOWERING_BBCH;
  }
}
