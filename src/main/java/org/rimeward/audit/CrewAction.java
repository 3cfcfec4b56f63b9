package org.rimeward.audit;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;

/**
 * What the crew did on a block, as recorded by {@code rimeward action}: the evidence beside the
 * advice that an insurer or a water board asks for.
 *
 * @param at when it was done (as the crew reports it)
 * @param recordedAt when it was recorded
 * @param night the evening the action belongs to
 * @param blockId the block
 * @param kind what was done
 * @param by who did it or reported it
 * @param note free text, empty when none
 * @param advisedRunId the latest recorded run for the block and night when it was recorded, if any
 * @param warning how it contradicts that plan, if it does
 */
public record CrewAction(Instant at, Instant recordedAt, LocalDate night, String blockId, Kind kind,
    String by, String note, Optional<String> advisedRunId, Optional<String> warning) {
  public CrewAction {
    Objects.requireNonNull(at, "at");
    Objects.requireNonNull(recordedAt, "recordedAt");
    Objects.requireNonNull(night, "night");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(advisedRunId, "advisedRunId");
    Objects.requireNonNull(warning, "warning");
    if (blockId == null || blockId.isBlank()) {
      throw new IllegalArgumentException("block id is required");
    }
    if (by == null || by.isBlank()) {
      throw new IllegalArgumentException("who did it is required");
    }
    note = note == null ? "" : note;
  }

  /** The closed set of actions, with their stable command-line words. */
  public enum Kind {
    SPRINKLING_ON,
    SPRINKLING_OFF,
    COVERS_ON,
    COVERS_OFF;

    public String word() {
      return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    public static Optional<Kind> ofWord(String word) {
      for (Kind k : values()) {
        if (k.word().equals(word)) {
          return Optional.of(k);
        }
      }
      return Optional.empty();
    }

    public boolean sprinkling() {
      return this == SPRINKLING_ON || this == SPRINKLING_OFF;
    }

    public boolean starts() {
      return this == SPRINKLING_ON || this == COVERS_ON;
    }
  }
}
