package org.rimeward.crop;

import java.util.List;
import java.util.regex.Pattern;
import org.rimeward.io.Fields;
import org.rimeward.io.Problems;
import org.rimeward.io.Yaml;
import org.rimeward.io.Yaml.MapNode;

/**
 * Reads one crop file into a {@link Crop}: the crop's header here (id, name, exposure, basis,
 * tolerance margin), its stages through {@link StageReader} and its varieties through
 * {@link VarietyReader}. Every problem in the file is collected with its line, through the io
 * toolkit's {@link Fields} and {@link Problems}, instead of stopping at the first, so
 * {@code profile check} lists them all.
 */
final class CropFileReader {
  private static final Pattern EXPOSURE = Pattern.compile("\\d+ min");

  private CropFileReader() {}

  /** Reads and checks one file; returns null when it has problems (added to {@code problems}). */
  static Crop read(String text, String expectedId, Problems problems) {
    int before = problems.size();
    MapNode root = parse(text, problems.label());
    Crop crop = crop(Fields.of(root, "", "crop, name, stages", problems), expectedId);
    return problems.size() == before ? crop : null;
  }

  /** The crop file's YAML; its top is a mapping of keys. */
  static MapNode parse(String text, String file) {
    return Yaml.parseMap(text, file, "a crop profile starts with 'crop: NAME'",
        "a crop profile is a mapping of keys (crop:, name:, stages: ...)");
  }

  private static Crop crop(Fields top, String expectedId) {
    top.allow("crop", "name", "reference_variety", "exposure", "basis", "tolerance_t90_margin",
        "notes", "stages", "varieties");
    String id = top.text("crop", "add the crop's id, the file name without .yaml, e.g. crop: "
        + expectedId);
    if (id != null && !id.equals(expectedId)) {
      top.problem("crop", top.quoted("crop") + " does not match the file name '" + expectedId
          + ".yaml'; the file name is the crop's id, so rename the file or fix the value");
    }
    String name = top.text("name", "add the crop's name as growers say it, e.g. name: Sweet"
        + " cherry");
    String reference = top.optionalText("reference_variety");
    String exposure = top.text("exposure", "add the exposure the published table assumes, e.g."
        + " exposure: 30 min");
    if (exposure != null && !EXPOSURE.matcher(exposure).matches()) {
      top.problem("exposure", top.quoted("exposure") + " is not a duration like '30 min'; write"
          + " the exposure the published table assumes");
    }
    String basis = top.text("basis", "add what the temperatures mean (bud tissue, exposure,"
        + " measured on which variety)");
    top.optionalText("notes");
    Double margin = top.optionalValue("tolerance_t90_margin",
        CropFields.delta(top, "tolerance_t90_margin"));
    if (margin != null && (margin <= 0 || margin > Limits.MAX_TOLERANCE_MARGIN_C)) {
      top.problem("tolerance_t90_margin", top.quoted("tolerance_t90_margin") + " is outside 0 to "
          + Limits.MAX_TOLERANCE_MARGIN_C + " °C; it is the gap between a single published"
          + " tolerance (used as T10) and T90");
    }
    List<Stage> stages = StageReader.read(top, margin);
    List<Variety> varieties = VarietyReader.read(top, stages, margin);
    if (id == null || name == null) {
      return null;
    }
    Crop crop = new Crop(id, name, reference, exposure, basis, margin, stages, varieties,
        top.problems().label());
    for (Variety v : varieties) {
      Inheritance.resolve(crop, v, top.problems()::add);
    }
    return crop;
  }
}
