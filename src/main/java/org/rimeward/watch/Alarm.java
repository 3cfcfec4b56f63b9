package org.rimeward.watch;

import java.time.Instant;
import java.util.Objects;

/**
 * One alarm: a block (or {@value #FARM_WIDE} for the farm), its kind, its level (higher when it
 * escalates), when, and the message.
 */
public record Alarm(String blockId, AlarmKind kind, int level, Instant at, String message) {
  /** The block id of an alarm about the whole farm (the station, the forecast). */
  public static final String FARM_WIDE = "all";

  public Alarm {
    Objects.requireNonNull(blockId, "blockId");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(at, "at");
    Objects.requireNonNull(message, "message");
    if (level < 1) {
      throw new IllegalArgumentException("level must be 1 or more, was " + level);
    }
  }

  /** What "once per block per night" counts: the block and the kind. */
  public String key() {
    return blockId + "\u0000" + kind.word();
  }
}
