package org.rimeward.crop;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import org.rimeward.io.Fields;
import org.rimeward.io.Text;
import org.rimeward.io.Yaml.SeqNode;

/**
 * Reads a crop file's {@code stages}: each stage's id, name, BBCH code, flowering flag, T10 and
 * T90 (or a single tolerance) and source, in order of development.
 */
final class StageReader {
  private static final Pattern BBCH = Pattern.compile("\\d{2}");
  static final String FLOWERING_HINT = "write flowering: true where the stage's flowers are open"
      + " (first bloom to full bloom), false before (buds) and after (petal fall, fruit set)";

  private final Fields top;
  private final Double margin;
  private final Map<String, Integer> lines = new HashMap<>();
  private Stage previous;

  private StageReader(Fields top, Double margin) {
    this.top = top;
    this.margin = margin;
  }

  /** The stages read without problems; the others' problems go to the file's problems. */
  static List<Stage> read(Fields top, Double margin) {
    List<Stage> out = new ArrayList<>();
    if (!top.has("stages")) {
      top.problem("'stages' is required; list the crop's bud stages in order of development");
      return out;
    }
    SeqNode list = top.list("stages");
    if (list == null) {
      return out;
    }
    if (list.items().isEmpty()) {
      top.problem("stages", "is an empty list; list the crop's bud stages in order of development"
          + " ('- id: ...')");
      return out;
    }
    StageReader r = new StageReader(top, margin);
    for (int i = 0; i < list.items().size(); i++) {
      Fields s = Fields.of(list.items().get(i), "stages item " + (i + 1),
          "id, name, bbch, flowering, t10, t90 and source", top.problems());
      Stage stage = s == null ? null : r.stage(s);
      if (stage != null) {
        out.add(stage);
      }
    }
    return out;
  }

  private Stage stage(Fields s) {
    int before = s.problems().size();
    String id = CropFields.id(s, "add the stage's trade name in kebab case, e.g. id:"
        + " tight-cluster");
    if (id != null) {
      s = s.namedById(id, "stages", lines, first -> "'" + id + "' is used twice (first on line "
          + first + "); each stage id must be unique, so rename or remove one");
    }
    s.allow("id", "name", "bbch", "flowering", "t10", "t90", "tolerance", "as_printed", "source",
        "note");
    String name = s.text("name", "add the stage's name as the source prints it, e.g. name: Tight"
        + " cluster");
    String bbch = s.value("bbch", StageReader::bbch, "add the stage's two-digit BBCH code, quoted,"
        + " e.g. bbch: \"57\"");
    Boolean flowering = s.optionalValue("flowering", CropFields.flag(FLOWERING_HINT));
    String source = s.text("source", "add the table the values come from, as its publisher"
        + " titles it");
    String note = s.optionalText("note");
    s.optionalText("as_printed");
    Temperatures t = temperatures(s, note);
    if (s.problems().size() != before || t == null || id == null || name == null || bbch == null
        || source == null) {
      return null;
    }
    if (!(t.t90C() < t.t10C())) {
      // A one-tolerance stage comes here only with a margin of 0 or less, reported on its line.
      if (t.toleranceC() == null) {
        s.problem("t90", s.quoted("t90") + " is not colder than t10 " + s.quoted("t10") + "; T90"
            + " (90% of buds killed) must be colder than T10 (10% killed). Check both against the"
            + " source table");
      }
      return null;
    }
    Stage stage = new Stage(id, name, bbch, flowering, t.t10C(), t.t90C(), t.toleranceC(), source,
        note, s.line());
    if (previous != null && stage.bbchCode() <= previous.bbchCode()) {
      s.problem("bbch", s.quoted("bbch") + " is not after the previous stage '" + previous.id()
          + "' (bbch " + previous.bbch() + "); list stages in order of development with"
          + " increasing BBCH codes");
    }
    previous = stage;
    return stage;
  }

  private static String bbch(String text) {
    if (!BBCH.matcher(text).matches()) {
      throw new IllegalArgumentException(Text.quote(text) + " is not a two-digit"
          + " BBCH code; write it quoted, for example bbch: \"57\"");
    }
    return text;
  }

  /** A stage's T10 and T90 in °C, and its single tolerance (null for a 10/90 stage). */
  private record Temperatures(double t10C, double t90C, Double toleranceC) {}

  /**
   * The stage's temperatures, or null when they cannot be read. A one-tolerance stage takes
   * T10 = tolerance and T90 = tolerance − the file's margin.
   */
  private Temperatures temperatures(Fields s, String note) {
    if (s.has("tolerance")) {
      if (s.has("t10") || s.has("t90")) {
        s.problem("tolerance", "give either a single 'tolerance' or 't10' and 't90', not both;"
            + " the 10/90 values of a one-tolerance stage are derived");
        return null;
      }
      Double tol = s.optionalValue("tolerance", CropFields.temperature(s, "tolerance"));
      if (note == null || !note.toLowerCase(Locale.ROOT).contains("single")) {
        s.problem("tolerance", "a 'tolerance' stage needs a note saying it is a single stage"
            + " tolerance, not a 10/90 curve");
      }
      if (margin == null && !top.has("tolerance_t90_margin")) {
        s.problem("tolerance", "uses a single 'tolerance', so the file needs"
            + " 'tolerance_t90_margin' (for example 3F) to derive T90 = tolerance − margin");
        return null;
      }
      return tol == null || margin == null ? null : new Temperatures(tol, tol - margin, tol);
    }
    Double t10 = s.value("t10", CropFields.temperature(s, "t10"), "add the 10% kill temperature"
        + " with its unit, as the source prints it (for example 28F)");
    Double t90 = s.value("t90", CropFields.temperature(s, "t90"), "add the 90% kill temperature"
        + " with its unit, as the source prints it (for example 25F)");
    return t10 == null || t90 == null ? null : new Temperatures(t10, t90, null);
  }
}
