package org.rimeward.crop;

import java.time.Instant;
import java.util.Objects;

/**
 * One change to a crop profile made through the command line: who, when, which file and value,
 * before and after, and why. The audit trail keeps every one.
 *
 * @param field {@code t10}, {@code t90}, {@code hardiness_offset} or {@code variety} (a new one)
 * @param beforeC the value before, in °C; null when there was none
 * @param afterC the value after, in °C; null when it was removed
 */
public record ProfileEdit(Instant at, String by, String file, String crop, String variety,
    String stage, String field, Double beforeC, Double afterC, String note) {
  public ProfileEdit {
    Objects.requireNonNull(at, "at");
    Objects.requireNonNull(by, "by");
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(crop, "crop");
    Objects.requireNonNull(field, "field");
    if (note == null || note.isBlank()) {
      throw new IllegalArgumentException("a profile edit needs a note saying who observed what, and when");
    }
  }
}
