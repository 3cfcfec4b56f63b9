package org.rimeward.crop;

import java.util.Objects;

/**
 * A stage's critical temperatures for one crop or variety, after inheritance.
 *
 * @param flowering the stage's flowers are open (the crop's flag for the stage, or its BBCH code
 *     where the file has no flag); a variety keeps its crop's
 * @param t10C about 10% of buds killed after 30 min of tissue at this temperature, °C
 * @param t90C about 90% killed, °C; always colder than {@code t10C}
 * @param source where every value came from: the table's citation, the offset and its source or
 *     note, the override and its note
 */
public record EffectiveStage(String id, String name, String bbch, boolean flowering, double t10C,
    double t90C, String source, Provenance provenance) {
  public EffectiveStage {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(provenance, "provenance");
    if (!(t90C < t10C)) {
      throw new IllegalArgumentException("stage " + id + ": t90 must be colder than t10");
    }
  }
}
