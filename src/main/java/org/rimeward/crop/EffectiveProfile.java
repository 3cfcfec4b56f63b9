package org.rimeward.crop;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The stage table the engine uses for one crop, or one variety of it, in order of development.
 *
 * @param variety the variety id, or null for the crop's base table
 */
public record EffectiveProfile(String crop, String variety, List<EffectiveStage> stages) {
  public EffectiveProfile {
    Objects.requireNonNull(crop, "crop");
    stages = List.copyOf(stages);
  }

  public Optional<EffectiveStage> stage(String id) {
    return stages.stream().filter(s -> s.id().equals(id)).findFirst();
  }

  /** {@code crop} or {@code crop/variety}. */
  public String label() {
    return variety == null ? crop : crop + "/" + variety;
  }
}
