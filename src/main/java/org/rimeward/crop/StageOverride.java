package org.rimeward.crop;

import java.util.Objects;

/**
 * A variety's own value for one stage, replacing the crop table's (and the offset's) value of the
 * fields it gives. Each carries a published source or a note saying who observed it and when.
 *
 * @param t10C the 10% kill temperature in °C, or null to keep the inherited one
 * @param t90C the 90% kill temperature in °C, or null to keep the inherited one
 * @param toleranceC a single published tolerance in °C (sets both, as for base stages), or null
 * @param setBy who wrote it with {@code rimeward profile set}, or null for a hand-written one
 * @param setOn the date it was written with {@code rimeward profile set}, or null
 */
public record StageOverride(String stage, Double t10C, Double t90C, Double toleranceC,
    String source, String note, String setBy, String setOn, int line) {
  public StageOverride {
    Objects.requireNonNull(stage, "stage");
    if (source == null && note == null) {
      throw new IllegalArgumentException("override of " + stage + " needs a source or a note");
    }
  }

  /** The source, the note, or both, as one line of text. */
  public String citation() {
    StringBuilder b = new StringBuilder();
    if (source != null) {
      b.append(source);
    }
    if (note != null) {
      b.append(b.length() > 0 ? "; " : "").append("note: ").append(note);
    }
    if (setBy != null) {
      b.append(" (set by ").append(setBy).append(setOn == null ? "" : " on " + setOn).append(')');
    }
    return b.toString();
  }
}
