package org.rimeward.crop;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Pattern;
import org.rimeward.io.Yaml.Entry;
import org.rimeward.io.Yaml.MapNode;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.io.Yaml;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.QuantityException;

/**
 * Reads one crop file into a {@link Crop}, collecting every problem with its file and line
 * instead of stopping at the first, so {@code profile check} can list them all.
 */
final class CropFileReader {
  static final Set<String> TOP_KEYS = keys("crop", "name", "reference_variety", "exposure", "basis",
      "tolerance_t90_margin", "notes", "stages", "varieties");
  static final Set<String> STAGE_KEYS = keys("id", "name", "bbch", "t10", "t90", "tolerance",
      "as_printed", "source", "note");
  static final Set<String> VARIETY_KEYS = keys("id", "name", "hardiness_offset", "offset_except",
      "source", "note", "set_by", "set_on", "overrides");
  static final Set<String> OVERRIDE_KEYS = keys("stage", "t10", "t90", "tolerance", "source",
      "note", "set_by", "set_on");

  static final Pattern ID = Pattern.compile("[a-z][a-z0-9]*(-[a-z0-9]+)*");
  private static final Pattern BBCH = Pattern.compile("\\d{2}");
  private static final Pattern EXPOSURE = Pattern.compile("\\d+ min");

  private final String file;
  private final List<String> problems;

  private CropFileReader(String file, List<String> problems) {
    this.file = file;
    this.problems = problems;
  }

  /** Reads and checks one file; returns null when it has problems (added to {@code problems}). */
  static Crop read(String text, String file, String expectedId, List<String> problems) {
    int before = problems.size();
    MapNode root = CropFileReader.parse(text, file);
    Crop crop = new CropFileReader(file, problems).crop(root, expectedId);
    return problems.size() == before ? crop : null;
  }

  /** The crop file's YAML; its top is a mapping of keys. */
  static MapNode parse(String text, String file) {
    return Yaml.parseMap(text, file, "a crop profile starts with 'crop: NAME'",
        "a crop profile is a mapping of keys (crop:, name:, stages: ...)");
  }

  private static Set<String> keys(String... k) {
    return new LinkedHashSet<>(List.of(k));
  }

  private void problem(int line, String message) {
    problems.add(file + ":" + line + ": " + message);
  }

  private Crop crop(MapNode root, String expectedId) {
    unknownKeys(root, TOP_KEYS, "the crop file");
    String id = text(root, "crop", "the crop file", true);
    if (id != null && !id.equals(expectedId)) {
      problem(line(root, "crop"), "crop: '" + id + "' does not match the file name '" + expectedId
          + ".yaml'; the file name is the crop's id, so rename the file or fix the value");
    }
    String name = text(root, "name", "the crop file", true);
    String reference = text(root, "reference_variety", "the crop file", false);
    String exposure = text(root, "exposure", "the crop file", true);
    if (exposure != null && !EXPOSURE.matcher(exposure).matches()) {
      problem(line(root, "exposure"), "exposure: '" + exposure + "' is not a duration like '30 min';"
          + " write the exposure the published table assumes");
    }
    String basis = text(root, "basis", "the crop file", true);
    text(root, "notes", "the crop file", false);
    Double margin = quantity(root, "tolerance_t90_margin", "the crop file",
        Dimension.TEMPERATURE_DELTA);
    if (margin != null && (margin <= 0 || margin > Limits.MAX_TOLERANCE_MARGIN_C)) {
      problem(line(root, "tolerance_t90_margin"), "tolerance_t90_margin: " + raw(root,
          "tolerance_t90_margin") + " is outside 0 to " + Limits.MAX_TOLERANCE_MARGIN_C
          + " °C; it is the gap between a single published tolerance (used as T10) and T90");
    }
    List<Stage> stages = stages(root, margin);
    List<Variety> varieties = varieties(root, stages, margin);
    if (id == null || name == null) {
      return null;
    }
    Crop crop = new Crop(id, name, reference, exposure, basis, margin, stages, varieties, file);
    for (Variety v : varieties) {
      Inheritance.resolve(crop, v, this::problem);
    }
    return crop;
  }

  private List<Stage> stages(MapNode root, Double margin) {
    List<Stage> out = new ArrayList<>();
    Node n = root.get("stages");
    if (n == null) {
      problem(root.line(), "'stages' is missing; list the crop's bud stages in order of development");
      return out;
    }
    if (!(n instanceof SeqNode seq) || seq.items().isEmpty()) {
      problem(n.line(), "stages: must be a non-empty list of stages ('- id: ...')");
      return out;
    }
    Set<String> ids = new HashSet<>();
    Stage previous = null;
    int index = 0;
    for (Node item : seq.items()) {
      index++;
      if (!(item instanceof MapNode m)) {
        problem(item.line(), "stages[" + index + "]: each stage is a mapping with id, name, bbch,"
            + " t10, t90 and source");
        continue;
      }
      String label = "stages[" + index + "]";
      String id = id(m, "id", label);
      if (id != null) {
        label = "stage '" + id + "'";
        if (!ids.add(id)) {
          problem(line(m, "id"), label + ": id '" + id + "' is used twice; each stage id must be"
              + " unique, so rename or remove one");
        }
      }
      unknownKeys(m, STAGE_KEYS, label);
      String name = text(m, "name", label, true);
      String bbch = text(m, "bbch", label, true);
      if (bbch != null && !BBCH.matcher(bbch).matches()) {
        problem(line(m, "bbch"), label + " bbch: '" + bbch + "' is not a two-digit BBCH code; write"
            + " it quoted, for example bbch: \"57\"");
        bbch = null;
      }
      String source = text(m, "source", label, true);
      String note = text(m, "note", label, false);
      text(m, "as_printed", label, false);
      Double t10 = temperature(m, "t10", label);
      Double t90 = temperature(m, "t90", label);
      Double tol = temperature(m, "tolerance", label);
      int line = m.line();
      if (tol != null) {
        if (m.get("t10") != null || m.get("t90") != null) {
          problem(line(m, "tolerance"), label + ": give either a single 'tolerance' or 't10' and"
              + " 't90', not both; the 10/90 values of a one-tolerance stage are derived");
          continue;
        }
        if (note == null || !note.toLowerCase(Locale.ROOT).contains("single")) {
          problem(line(m, "tolerance"), label + ": a 'tolerance' stage needs a note saying it is a"
              + " single stage tolerance, not a 10/90 curve");
        }
        if (margin == null) {
          problem(line(m, "tolerance"), label + ": uses a single 'tolerance', so the file needs"
              + " 'tolerance_t90_margin' (for example 3F) to derive T90 = tolerance − margin");
          continue;
        }
        t10 = tol;
        t90 = tol - margin;
      } else if (m.get("t10") == null || m.get("t90") == null) {
        if (m.get("t10") == null) {
          problem(line, label + ": 't10' is missing; add the 10% kill temperature with its unit,"
              + " as the source prints it (for example 28F)");
        }
        if (m.get("t90") == null) {
          problem(line, label + ": 't90' is missing; add the 90% kill temperature with its unit,"
              + " as the source prints it (for example 25F)");
        }
        continue;
      }
      if (t10 == null || t90 == null || id == null || name == null || bbch == null || source == null) {
        continue;
      }
      if (!(t90 < t10)) {
        problem(line(m, tol != null ? "tolerance" : "t90"), label + ": t90 " + raw(m, "t90")
            + " is not colder than t10 " + raw(m, "t10") + "; T90 (90% of buds killed) must be"
            + " colder than T10 (10% killed). Check both against the source table");
        continue;
      }
      Stage s = new Stage(id, name, bbch, t10, t90, tol, source, note, line);
      if (previous != null && s.bbchCode() <= previous.bbchCode()) {
        problem(line(m, "bbch"), label + " bbch: '" + bbch + "' is not after the previous stage '"
            + previous.id() + "' (bbch " + previous.bbch() + "); list stages in order of development"
            + " with increasing BBCH codes");
      }
      previous = s;
      out.add(s);
    }
    return out;
  }

  private List<Variety> varieties(MapNode root, List<Stage> stages, Double margin) {
    List<Variety> out = new ArrayList<>();
    Node n = root.get("varieties");
    if (n == null || n instanceof Scalar sc && sc.isNull()) {
      return out;
    }
    if (!(n instanceof SeqNode seq)) {
      problem(n.line(), "varieties: must be a list of varieties ('- id: ...')");
      return out;
    }
    Set<String> stageIds = new TreeSet<>();
    stages.forEach(s -> stageIds.add(s.id()));
    Set<String> ids = new HashSet<>();
    int index = 0;
    for (Node item : seq.items()) {
      index++;
      if (!(item instanceof MapNode m)) {
        problem(item.line(), "varieties[" + index + "]: each variety is a mapping with id, name and"
            + " a source or note");
        continue;
      }
      String label = "varieties[" + index + "]";
      String id = id(m, "id", label);
      if (id != null) {
        label = "variety '" + id + "'";
        if (!ids.add(id)) {
          problem(line(m, "id"), label + ": id '" + id + "' is used twice; keep one");
        }
      }
      unknownKeys(m, VARIETY_KEYS, label);
      String name = text(m, "name", label, false);
      String source = text(m, "source", label, false);
      String note = text(m, "note", label, false);
      text(m, "set_by", label, false);
      text(m, "set_on", label, false);
      if (source == null && note == null) {
        problem(m.line(), label + ": needs a 'source' (a published footnote) or a 'note' saying who"
            + " observed what, and when");
      }
      Double off = quantity(m, "hardiness_offset", label, Dimension.TEMPERATURE_DELTA);
      if (off != null && Math.abs(off) > Limits.MAX_HARDINESS_OFFSET_C) {
        problem(line(m, "hardiness_offset"), label + " hardiness_offset: " + raw(m, "hardiness_offset")
            + " is more than " + Limits.MAX_HARDINESS_OFFSET_C + " °C; published variety offsets are"
            + " 1-2 °F. Check the unit, or give single stages as overrides");
        off = null;
      }
      Set<String> except = new LinkedHashSet<>();
      Node ex = m.get("offset_except");
      if (ex != null) {
        if (m.get("hardiness_offset") == null) {
          problem(ex.line(), label + ": 'offset_except' without a 'hardiness_offset'; remove it or"
              + " add the offset");
        }
        if (!(ex instanceof SeqNode es)) {
          problem(ex.line(), label + " offset_except: must be a list of stage ids, e.g. [post-bloom]");
        } else {
          for (Node e : es.items()) {
            if (e instanceof Scalar sc && !sc.isNull()) {
              if (!stageIds.contains(sc.text())) {
                problem(sc.line(), label + " offset_except: '" + sc.text() + "' is not a stage of"
                    + " this crop; known stages: " + String.join(", ", stageIds));
              }
              except.add(sc.text());
            } else {
              problem(e.line(), label + " offset_except: each entry is a stage id");
            }
          }
        }
      }
      List<StageOverride> overrides = overrides(m, label, stageIds, margin);
      if (id != null && (source != null || note != null)) {
        out.add(new Variety(id, name == null ? id : name, off == null ? 0 : off, except, source,
            note, overrides, m.line()));
      }
    }
    return out;
  }

  private List<StageOverride> overrides(MapNode variety, String vlabel, Set<String> stageIds,
      Double margin) {
    List<StageOverride> out = new ArrayList<>();
    Node n = variety.get("overrides");
    if (n == null) {
      return out;
    }
    if (!(n instanceof SeqNode seq)) {
      problem(n.line(), vlabel + " overrides: must be a list ('- stage: ...')");
      return out;
    }
    Set<String> seen = new HashSet<>();
    for (Node item : seq.items()) {
      if (!(item instanceof MapNode m)) {
        problem(item.line(), vlabel + " overrides: each entry is a mapping with stage, t10/t90 and a"
            + " source or note");
        continue;
      }
      String stage = text(m, "stage", vlabel + " override", true);
      String label = vlabel + " override of '" + stage + "'";
      unknownKeys(m, OVERRIDE_KEYS, label);
      if (stage == null) {
        continue;
      }
      if (!stageIds.contains(stage)) {
        problem(line(m, "stage"), label + ": '" + stage + "' is not a stage of this crop; known"
            + " stages: " + String.join(", ", stageIds));
        continue;
      }
      if (!seen.add(stage)) {
        problem(line(m, "stage"), label + ": this stage is overridden twice; merge the two entries");
      }
      Double t10 = temperature(m, "t10", label);
      Double t90 = temperature(m, "t90", label);
      Double tol = temperature(m, "tolerance", label);
      String source = text(m, "source", label, false);
      String note = text(m, "note", label, false);
      String by = text(m, "set_by", label, false);
      String on = text(m, "set_on", label, false);
      if (source == null && note == null) {
        problem(m.line(), label + ": needs a 'source' or a 'note' saying who observed it and when");
        continue;
      }
      if (tol != null && (m.get("t10") != null || m.get("t90") != null)) {
        problem(line(m, "tolerance"), label + ": give either 'tolerance' or 't10'/'t90', not both");
        continue;
      }
      if (m.get("t10") == null && m.get("t90") == null && m.get("tolerance") == null) {
        problem(m.line(), label + ": gives no value; add t10 and/or t90 (with unit), or remove it");
        continue;
      }
      if (tol != null && margin == null) {
        problem(line(m, "tolerance"), label + ": uses a single 'tolerance', so the file needs"
            + " 'tolerance_t90_margin' (for example 3F) to derive T90 = tolerance − margin");
        continue;
      }
      out.add(new StageOverride(stage, t10, t90, tol, source, note, by, on, m.line()));
    }
    return out;
  }

  private String id(MapNode m, String key, String label) {
    String id = text(m, key, label, true);
    if (id != null && !ID.matcher(id).matches()) {
      problem(line(m, key), label + " " + key + ": '" + id + "' is not a kebab-case id; use lower"
          + " case letters, digits and single hyphens, e.g. tight-cluster");
      return null;
    }
    return id;
  }

  private void unknownKeys(MapNode m, Set<String> allowed, String label) {
    for (Entry e : m.entries().values()) {
      if (!allowed.contains(e.key())) {
        problem(e.keyLine(), label + ": unknown key '" + e.key() + "'; known keys are "
            + String.join(", ", allowed) + ". Fix the spelling or remove it");
      }
    }
  }

  private String text(MapNode m, String key, String label, boolean required) {
    Node n = m.get(key);
    if (n == null) {
      if (required) {
        problem(m.line(), label + ": '" + key + "' is missing; add it");
      }
      return null;
    }
    if (!(n instanceof Scalar s)) {
      problem(n.line(), label + " " + key + ": must be a single value, not a list or mapping");
      return null;
    }
    if (s.isNull() || s.text().isBlank()) {
      problem(s.line(), label + " " + key + ": is empty; give a value or remove the key");
      return null;
    }
    return s.text().strip();
  }

  private Double temperature(MapNode m, String key, String label) {
    Double c = quantity(m, key, label, Dimension.TEMPERATURE);
    if (c != null && (c < Limits.MIN_C || c > Limits.MAX_C)) {
      problem(line(m, key), label + " " + key + ": " + raw(m, key) + " ("
          + String.format(Locale.ROOT, "%.1f °C", c) + ") is outside the plausible " + Limits.MIN_C
          + " to +" + Limits.MAX_C + " °C for a spring bud or flower; check the number and its unit");
      return null;
    }
    return c;
  }

  private Double quantity(MapNode m, String key, String label, Dimension dim) {
    String t = text(m, key, label, false);
    if (t == null) {
      return null;
    }
    try {
      return Quantities.parse(t, dim, label + " " + key);
    } catch (QuantityException e) {
      problem(line(m, key), e.getMessage() + ", with the unit the source prints");
      return null;
    }
  }

  private static String raw(MapNode m, String key) {
    Node n = m.get(key);
    return n instanceof Scalar s && !s.isNull() ? "'" + s.text() + "'" : "(none)";
  }

  private static int line(MapNode m, String key) {
    Entry e = m.entries().get(key);
    return e == null ? m.line() : e.value().line();
  }
}
