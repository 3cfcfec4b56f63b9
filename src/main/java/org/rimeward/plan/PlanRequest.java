package org.rimeward.plan;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Objects;

/**
 * What a nightly run is asked to plan.
 *
 * @param forecastFile overrides the farm file's forecast; null to use the farm's
 * @param cropProfilesDir overrides the farm's crop profiles; null for the farm's own, else the
 *     bundled ones
 * @param rulesDir overrides the farm's rules; null for the farm's own, else the bundled ones
 * @param night the evening's date; null to take it from the forecast's first step
 */
public record PlanRequest(Path farmDir, Path forecastFile, Path cropProfilesDir, Path rulesDir,
    LocalDate night) {
  public PlanRequest {
    Objects.requireNonNull(farmDir, "farmDir");
  }
}
