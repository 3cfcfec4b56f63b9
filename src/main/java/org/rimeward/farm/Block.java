package org.rimeward.farm;

import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * A block of one crop at one bud stage, as written in farm.yaml. Crop and stage are kept as
 * written; whether a profile exists for them is the planner's check, which names the line with
 * {@link #cropRef()} or {@link #stageRef()}.
 *
 * @param id the block's name
 * @param crop the crop, e.g. {@code apple}
 * @param variety the variety, or null when not given
 * @param stage the bud stage, e.g. {@code full-bloom}
 * @param areaHa planted area, ha
 * @param coldAirOffsetC how much colder (negative) or warmer (positive) the block runs than the
 *     forecast point, °C (a difference)
 * @param cropValuePerHa crop value per hectare in the farm's currency, for prioritising water
 * @param sprinklers over-plant sprinklers, if any
 * @param covers row covers, if any
 * @param origin where the block starts in the file (its list item)
 * @param fieldRefs where each field was written, keyed by its path inside the block
 *     ({@code crop}, {@code stage}, {@code sprinklers.rate}, ...)
 */
public record Block(
    String id,
    String crop,
    String variety,
    String stage,
    double areaHa,
    double coldAirOffsetC,
    OptionalDouble cropValuePerHa,
    Optional<Sprinklers> sprinklers,
    Optional<Covers> covers,
    SourceRef origin,
    Map<String, SourceRef> fieldRefs) {

  /** Largest cold-air offset accepted either way, °C. */
  public static final double MAX_COLD_AIR_OFFSET_C = 10.0;
  /**
   * Largest block accepted, ha. A block is what one decision covers (one stage, one sprinkler
   * set, one cover crew); real ones are a few to some tens of hectares (common practice). A limit
   * far above that still catches a slipped decimal point: 4500 ha is more likely 4.5 ha.
   */
  public static final double MAX_AREA_HA = 1000.0;

  public Block {
    Ids.check("block id", id);
    requireText("crop", crop, id);
    requireText("stage", stage, id);
    if (variety != null && variety.isBlank()) {
      throw new IllegalArgumentException("block " + id + ": variety is blank; leave it out or name it");
    }
    if (!(areaHa > 0 && Double.isFinite(areaHa))) {
      throw new IllegalArgumentException("block " + id + ": area must be above 0 ha, was " + areaHa);
    }
    if (!(Math.abs(coldAirOffsetC) <= MAX_COLD_AIR_OFFSET_C)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "block %s: cold-air offset %s °C is outside ±%.0f °C", id, coldAirOffsetC, MAX_COLD_AIR_OFFSET_C));
    }
    Objects.requireNonNull(cropValuePerHa, "cropValuePerHa");
    if (cropValuePerHa.isPresent()
        && !(cropValuePerHa.getAsDouble() >= 0 && Double.isFinite(cropValuePerHa.getAsDouble()))) {
      throw new IllegalArgumentException("block " + id + ": crop value must be 0 or more per ha, was "
          + cropValuePerHa.getAsDouble());
    }
    Objects.requireNonNull(sprinklers, "sprinklers");
    Objects.requireNonNull(covers, "covers");
    Objects.requireNonNull(origin, "origin");
    fieldRefs = Map.copyOf(fieldRefs);
  }

  /** A block built in code, with no file positions. */
  public Block(String id, String crop, String variety, String stage, double areaHa,
      double coldAirOffsetC, OptionalDouble cropValuePerHa, Optional<Sprinklers> sprinklers,
      Optional<Covers> covers) {
    this(id, crop, variety, stage, areaHa, coldAirOffsetC, cropValuePerHa, sprinklers, covers,
        SourceRef.unknown(), Map.of());
  }

  private static void requireText(String field, String value, String id) {
    if (value == null || value.isBlank()) {
      throw new IllegalArgumentException("block " + id + ": " + field + " is required");
    }
  }

  /** Where {@code field} (a path inside the block, e.g. {@code stage}) was written; else the block's start. */
  public SourceRef lineOf(String field) {
    return fieldRefs.getOrDefault(field, origin);
  }

  public SourceRef cropRef() {
    return lineOf("crop");
  }

  /** Where the variety was written, or the crop's line when there is no variety. */
  public SourceRef varietyRef() {
    return fieldRefs.getOrDefault("variety", cropRef());
  }

  public SourceRef stageRef() {
    return lineOf("stage");
  }
}
