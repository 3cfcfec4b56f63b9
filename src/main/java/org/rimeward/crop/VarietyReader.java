package org.rimeward.crop;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.rimeward.io.Fields;
import org.rimeward.io.Yaml.Entry;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;

/**
 * Reads a crop file's {@code varieties}: each variety's id, name, hardiness offset and the stages
 * it leaves out, with its source or note; its single-stage overrides through
 * {@link OverrideReader}.
 */
final class VarietyReader {
  private final Set<String> stageIds = new TreeSet<>();
  private final Double margin;
  private final Map<String, Integer> lines = new HashMap<>();

  private VarietyReader(List<Stage> stages, Double margin) {
    stages.forEach(s -> stageIds.add(s.id()));
    this.margin = margin;
  }

  /** The varieties read without problems; the others' problems go to the file's problems. */
  static List<Variety> read(Fields top, List<Stage> stages, Double margin) {
    List<Variety> out = new ArrayList<>();
    Entry e = top.entry("varieties");
    if (e == null || e.value() instanceof Scalar sc && sc.isNull()) {
      return out;
    }
    SeqNode list = top.list("varieties");
    if (list == null) {
      return out;
    }
    VarietyReader r = new VarietyReader(stages, margin);
    for (int i = 0; i < list.items().size(); i++) {
      Fields v = Fields.of(list.items().get(i), "varieties item " + (i + 1),
          "id, name and a source or note", top.problems());
      Variety variety = v == null ? null : r.variety(v);
      if (variety != null) {
        out.add(variety);
      }
    }
    return out;
  }

  private Variety variety(Fields v) {
    int before = v.problems().size();
    String id = CropFields.id(v, "add the variety's name in kebab case, e.g. id:"
        + " golden-delicious");
    if (id != null) {
      v = v.namedById(id, "varieties", lines, first -> "'" + id + "' is used twice (first on line "
          + first + "); keep one");
    }
    v.allow("id", "name", "hardiness_offset", "offset_except", "source", "note", "set_by",
        "set_on", "overrides");
    String name = v.optionalText("name");
    String source = v.optionalText("source");
    String note = v.optionalText("note");
    v.optionalText("set_by");
    v.optionalText("set_on");
    if (!v.has("source") && !v.has("note")) {
      v.problem("needs a 'source' (a published footnote) or a 'note' saying who observed what,"
          + " and when");
    }
    Double offset = v.optionalValue("hardiness_offset", CropFields.delta(v, "hardiness_offset"));
    if (offset != null && Math.abs(offset) > Limits.MAX_HARDINESS_OFFSET_C) {
      v.problem("hardiness_offset", v.quoted("hardiness_offset") + " is more than "
          + Limits.MAX_HARDINESS_OFFSET_C + " °C; published variety offsets are 1-2 °F. Check the"
          + " unit, or give single stages as overrides");
    }
    Set<String> except = offsetExcept(v);
    List<StageOverride> overrides = OverrideReader.read(v, stageIds, margin);
    if (v.problems().size() != before || id == null) {
      return null;
    }
    return new Variety(id, name == null ? id : name, offset == null ? 0 : offset, except, source,
        note, overrides, v.line());
  }

  /** The stage ids the offset does not apply to; each must be a stage of the crop. */
  private Set<String> offsetExcept(Fields v) {
    Set<String> except = new LinkedHashSet<>();
    if (!v.has("offset_except")) {
      return except;
    }
    if (!v.has("hardiness_offset")) {
      v.problem("offset_except", "is given without a 'hardiness_offset'; remove it or add the"
          + " offset");
    }
    SeqNode list = v.list("offset_except");
    if (list == null) {
      return except;
    }
    for (Node n : list.items()) {
      if (!(n instanceof Scalar s) || s.value() == null) {
        v.problems().add(n.line(), v.field("offset_except") + ": each entry is a stage id, e.g."
            + " [post-bloom]; found " + Fields.describe(n));
      } else if (!stageIds.contains(s.value())) {
        v.problems().add(s.line(), v.field("offset_except") + ": '" + s.value() + "' is not a"
            + " stage of this crop; known stages: " + String.join(", ", stageIds));
      } else {
        except.add(s.value());
      }
    }
    return except;
  }
}
