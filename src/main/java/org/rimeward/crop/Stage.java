package org.rimeward.crop;

import java.util.Objects;

/**
 * One bud development stage of a crop's base table, as the file gives it, converted to °C.
 *
 * @param bbch the approximate two-digit BBCH code, kept as text so {@code 05} stays {@code 05}
 * @param t10C temperature at which about 10% of buds are killed after 30 min; for a stage that
 *     publishes one tolerance this is the tolerance itself
 * @param t90C temperature at which about 90% are killed; for a one-tolerance stage this is the
 *     tolerance less the file's {@code tolerance_t90_margin}
 * @param toleranceC the single published tolerance, or null for a 10/90 stage
 * @param line the line of the stage in its file, for messages
 */
public record Stage(String id, String name, String bbch, double t10C, double t90C,
    Double toleranceC, String source, String note, int line) {
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
}
