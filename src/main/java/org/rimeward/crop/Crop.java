package org.rimeward.crop;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One crop file: its base stage table (for the reference variety the table was measured on) and
 * the varieties derived from it.
 *
 * @param referenceVariety the variety the published table was measured on (Red Delicious for
 *     apple), or null when the source names none
 * @param exposure the exposure the table assumes, as written ({@code 30 min})
 * @param basis what the temperatures mean, as the file states it
 * @param toleranceMarginC for one-tolerance stages, T90 = tolerance − this (°C); null when the
 *     file has none
 * @param file where the file lives, as a path string
 */
public record Crop(String id, String name, String referenceVariety, String exposure, String basis,
    Double toleranceMarginC, List<Stage> stages, List<Variety> varieties, String file) {
  public Crop {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(name, "name");
    Objects.requireNonNull(file, "file");
    stages = List.copyOf(stages);
    varieties = List.copyOf(varieties);
  }

  public Optional<Stage> stage(String stageId) {
    return stages.stream().filter(s -> s.id().equals(stageId)).findFirst();
  }

  public Optional<Variety> variety(String varietyId) {
    return varieties.stream().filter(v -> v.id().equals(varietyId)).findFirst();
  }
}
