package org.rimeward.crop;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * A variety of a crop: it inherits the crop's stage table, may shift it by a hardiness offset and
 * may override single stages.
 *
 * @param hardinessOffsetC how much hardier than the table the variety is, as a temperature
 *     difference in °C: +0.56 (1 °F) lowers T10 and T90 by 0.56 °C; 0 when none
 * @param offsetExcept stage ids the offset does not apply to (Rome Beauty: after petal fall)
 */
public record Variety(String id, String name, double hardinessOffsetC, Set<String> offsetExcept,
    String source, String note, List<StageOverride> overrides, int line) {
  public Variety {
    Objects.requireNonNull(id, "id");
    Objects.requireNonNull(name, "name");
    offsetExcept = Set.copyOf(offsetExcept);
    overrides = List.copyOf(overrides);
    if (source == null && note == null) {
      throw new IllegalArgumentException("variety " + id + " needs a source or a note");
    }
  }

  public Optional<StageOverride> override(String stageId) {
    return overrides.stream().filter(o -> o.stage().equals(stageId)).findFirst();
  }

  public boolean offsetAppliesTo(String stageId) {
    return hardinessOffsetC != 0 && !offsetExcept.contains(stageId);
  }

  /** The source, the note, or both, as one line of text. */
  public String citation() {
    if (source != null && note != null) {
      return source + "; note: " + note;
    }
    return source != null ? source : "note: " + note;
  }
}
