package org.rimeward.plan;

import com.fasterxml.jackson.annotation.JsonCreator;
import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.annotation.JsonProperty;
import com.fasterxml.jackson.databind.annotation.JsonSerialize;
import java.time.OffsetDateTime;
import java.util.List;
import org.rimeward.io.Json.Decimals;

/**
 * One station's readings in a re-plan: the blocks whose forecast they corrected, the latest
 * reading and the offset against the forecast. A run recorded before farm.yaml could declare
 * stations wrote the station's id alone; it reads back as that id with nothing else known.
 *
 * @param declared whether farm.yaml declares it (an undeclared station's rows are not used)
 * @param isDefault whether it stands for the blocks no station lists
 * @param note what the grower should know about it, or null
 */
public record StationReadings(
    String id,
    boolean declared,
    @JsonProperty("default") boolean isDefault,
    @JsonSerialize(using = Decimals.Two.class) Double heightM,
    @JsonSerialize(using = Decimals.Two.class) Double budHeightM,
    List<String> blocks,
    int rows,
    OffsetDateTime lastAt,
    @JsonSerialize(using = Decimals.Two.class) Double biasC,
    @JsonSerialize(using = Decimals.Two.class) Double dewPointBiasC,
    boolean stale,
    @JsonInclude(JsonInclude.Include.NON_NULL) String note,
    @JsonInclude(JsonInclude.Include.NON_EMPTY) List<String> hangsIn,
    @JsonInclude(JsonInclude.Include.NON_EMPTY) List<PlanDocument.Point> points) {
  public StationReadings {
    blocks = blocks == null ? List.of() : List.copyOf(blocks);
    hangsIn = hangsIn == null ? List.of() : List.copyOf(hangsIn);
    points = points == null ? List.of() : List.copyOf(points);
  }

  /** A station as older runs recorded it: its id alone. */
  @JsonCreator(mode = JsonCreator.Mode.DELEGATING)
  static StationReadings ofId(String id) {
    return new StationReadings(id, false, false, null, null, List.of(), 0, null, null, null,
        false, null, List.of(), List.of());
  }
}
