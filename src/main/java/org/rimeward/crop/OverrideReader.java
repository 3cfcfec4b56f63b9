package org.rimeward.crop;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.rimeward.io.Fields;
import org.rimeward.io.Yaml.SeqNode;

/**
 * Reads one variety's {@code overrides}: its own T10 and/or T90 (or single tolerance) for single
 * stages of the crop, each with a source or a note, and who set it with {@code profile set}.
 */
final class OverrideReader {
  private OverrideReader() {}

  /** The overrides read without problems; the others' problems go to the file's problems. */
  static List<StageOverride> read(Fields variety, Set<String> stageIds, Double margin) {
    List<StageOverride> out = new ArrayList<>();
    SeqNode list = variety.list("overrides");
    if (list == null) {
      return out;
    }
    Map<String, Integer> lines = new HashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Fields o = Fields.of(list.items().get(i), variety.field("overrides") + " item " + (i + 1),
          "stage, t10 and/or t90, and a source or note", variety.problems());
      if (o == null) {
        continue;
      }
      int before = o.problems().size();
      String stage = o.text("stage", "add the id of the stage it overrides, e.g. stage:"
          + " full-bloom");
      if (stage != null) {
        o = o.renamed(variety.field("overrides") + "[" + stage + "]");
      }
      o.allow("stage", "t10", "t90", "tolerance", "source", "note", "set_by", "set_on");
      if (stage != null && !stageIds.contains(stage)) {
        o.problem("stage", o.quoted("stage") + " is not a stage of this crop; known stages: "
            + String.join(", ", stageIds));
        continue;
      }
      Integer first = stage == null ? null : lines.putIfAbsent(stage, o.lineOf("stage"));
      if (first != null) {
        o.problem("stage", "this stage is already overridden on line " + first + "; merge the two"
            + " entries");
      }
      Double t10 = o.optionalValue("t10", CropFields.temperature(o, "t10"));
      Double t90 = o.optionalValue("t90", CropFields.temperature(o, "t90"));
      Double tol = o.optionalValue("tolerance", CropFields.temperature(o, "tolerance"));
      String source = o.optionalText("source");
      String note = o.optionalText("note");
      String by = o.optionalText("set_by");
      String on = o.optionalText("set_on");
      if (!o.has("source") && !o.has("note")) {
        o.problem("needs a 'source' or a 'note' saying who observed it and when");
      }
      if (o.has("tolerance") && (o.has("t10") || o.has("t90"))) {
        o.problem("tolerance", "give either 'tolerance' or 't10'/'t90', not both");
      } else if (!o.has("t10") && !o.has("t90") && !o.has("tolerance")) {
        o.problem("gives no value; add t10 and/or t90 (with unit), or remove it");
      } else if (o.has("tolerance") && margin == null) {
        o.problem("tolerance", "uses a single 'tolerance', so the file needs"
            + " 'tolerance_t90_margin' (for example 3F) to derive T90 = tolerance − margin");
      }
      if (o.problems().size() == before && stage != null) {
        out.add(new StageOverride(stage, t10, t90, tol, source, note, by, on, o.line()));
      }
    }
    return out;
  }
}
