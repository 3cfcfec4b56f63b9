package org.rimeward.audit;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;
import java.util.Optional;

/**
 * An alarm the night watch raised, as the trail keeps it.
 *
 * @param at when it was raised
 * @param night the evening it belongs to
 * @param blockId the block, or {@code all} for a farm-wide alarm
 * @param kind the alarm's stable lower-case word
 * @param level 1, or higher when it escalated
 * @param message what the terminal showed
 * @param runId the recorded re-plan it came from, if one was recorded
 * @param commandStatus what the grower's command did, if one was run
 */
public record WatchAlarm(Instant at, LocalDate night, String blockId, String kind, int level,
    String message, Optional<String> runId, Optional<String> commandStatus) {
  public WatchAlarm {
    Objects.requireNonNull(at, "at");
    Objects.requireNonNull(night, "night");
    Objects.requireNonNull(blockId, "blockId");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(message, "message");
    Objects.requireNonNull(runId, "runId");
    Objects.requireNonNull(commandStatus, "commandStatus");
    if (level < 1) {
      throw new IllegalArgumentException("alarm level must be 1 or more, was " + level);
    }
  }
}
