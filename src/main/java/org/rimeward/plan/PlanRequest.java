package org.rimeward.plan;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Objects;

/**
 * What a nightly run is asked to plan.
 *
 * @param forecastFile overrides the farm file's forecast; null to use the farm's
 * @param night the evening's date; null to take it from the forecast's first step
 */
public record PlanRequest(Path farmDir, Path forecastFile, Path cropProfilesDir, Path rulesDir,
    LocalDate night) {
  public PlanRequest {
    Objects.requireNonNull(farmDir, "farmDir");
    Objects.requireNonNull(cropProfilesDir, "cropProfilesDir");
    Objects.requireNonNull(rulesDir, "rulesDir");
  }
}
