package org.rimeward.farm;

import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.io.Fields;
import org.rimeward.io.Numbers;
import org.rimeward.io.Problems;
import org.rimeward.io.Yaml.Node;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/** Reads one item of farm.yaml's {@code blocks}: crop, stage, area, sprinklers and covers. */
final class BlockReader {
  private static final Pattern CROP_VALUE = Pattern.compile(
      "\\s*(" + Numbers.PATTERN + ")\\s*(?:per\\s+|/\\s*)(ha|hectares?|ac|acres?)\\s*",
      Pattern.CASE_INSENSITIVE);

  private final Fields b;
  private final String file;
  private final Map<String, SourceRef> refs = new HashMap<>();
  private final int before;

  private BlockReader(Fields b, int before) {
    this.b = b;
    this.before = before;
    this.file = b.problems().label();
  }

  /** The block, or null when it has problems (added to {@code problems}). */
  static Block read(Node item, int index, Map<String, WaterSource> sources, Set<String> declared,
      Problems problems) {
    Fields s = Fields.of(item, "blocks item " + index, "id, crop, stage and area", problems);
    if (s == null) {
      return null;
    }
    int before = problems.size();
    String id = FarmLoader.id(s, "a short name for the block, e.g. id: north-gala");
    if (id != null) {
      s = s.renamed("blocks[" + id + "]");
    }
    BlockReader r = new BlockReader(s, before);
    Block block = r.block(id, item, sources, declared);
    return problems.size() == before ? block : null;
  }

  private Block block(String id, Node item, Map<String, WaterSource> sources,
      Set<String> declared) {
    b.allow("id", "crop", "variety", "stage", "area", "cold_air_offset", "crop_value",
        "sprinklers", "covers");
    ref("id", "id");
    String crop = b.text("crop", "e.g. crop: apple");
    ref("crop", "crop");
    String variety = b.optionalText("variety");
    ref("variety", "variety");
    String stage = b.text("stage", "the bud stage tonight, e.g. stage: full-bloom");
    ref("stage", "stage");
    Double areaHa = b.value("area", FarmLoader.quantity(b, "area", Dimension.AREA),
        "the planted area, e.g. area: 4.5 ha or 11 ac");
    ref("area", "area");
    FarmLoader.positiveUpTo(b, "area", areaHa, "give the planted area, e.g. 4.5 ha or 11 ac",
        Block.MAX_AREA_HA, "ha", "larger than any one block is managed, so likely a typo: if a"
            + " decimal point slipped (4500 for 4.5), fix it, or split the area into blocks");
    double offsetC = 0;
    if (b.has("cold_air_offset")) {
      ref("cold_air_offset", "cold_air_offset");
      Double o = b.optionalValue("cold_air_offset",
          FarmLoader.quantity(b, "cold_air_offset", Dimension.TEMPERATURE_DELTA));
      if (o != null && !(Math.abs(o) <= Block.MAX_COLD_AIR_OFFSET_C)) {
        b.problem("cold_air_offset", String.format(Locale.ROOT, "%s (%.2f °C) is outside -%.0f to"
            + " %.0f °C; give how much colder (negative) the block runs than the forecast point,"
            + " e.g. -0.5C or -1F", b.quoted("cold_air_offset"), o, Block.MAX_COLD_AIR_OFFSET_C,
            Block.MAX_COLD_AIR_OFFSET_C));
      } else if (o != null) {
        offsetC = o;
      }
    }
    OptionalDouble value = OptionalDouble.empty();
    if (b.has("crop_value")) {
      ref("crop_value", "crop_value");
      Double v = cropValue();
      value = v == null ? value : OptionalDouble.of(v);
    }
    Optional<Sprinklers> sprinklers = Optional.empty();
    if (b.has("sprinklers")) {
      ref("sprinklers", "sprinklers");
      sprinklers = Optional.ofNullable(sprinklers(b.map("sprinklers", "rate and source"), sources,
          declared, areaHa));
    }
    Optional<Covers> covers = Optional.empty();
    if (b.has("covers")) {
      ref("covers", "covers");
      covers = Optional.ofNullable(covers(b.map("covers", "protection or fabric, and"
          + " deploy_hours")));
    }
    if (b.problems().size() != before) {
      return null;
    }
    try {
      return new Block(id, crop, variety, stage, areaHa, offsetC, value, sprinklers, covers,
          new SourceRef(file, item.line()), refs);
    } catch (IllegalArgumentException e) {
      b.problem(e.getMessage());
      return null;
    }
  }

  private void ref(String path, String key) {
    if (b.has(key)) {
      refs.put(path, new SourceRef(file, b.lineOf(key)));
    }
  }

  private Double cropValue() {
    String text = b.optionalText("crop_value");
    if (text == null) {
      return null;
    }
    Matcher m = CROP_VALUE.matcher(Numbers.normalize(text));
    if (!m.matches()) {
      b.problem("crop_value", b.quoted("crop_value") + " is not a value per area; write <number>"
          + " per ha or <number> per ac, e.g. 30000 per ha or 12000 per ac (in the farm's"
          + " currency, no symbol)");
      return null;
    }
    double number = Double.parseDouble(m.group(1));
    if (!(number >= 0 && Double.isFinite(number))) {
      b.problem("crop_value", b.quoted("crop_value") + " must be 0 or more; give the crop's value,"
          + " e.g. 30000 per ha");
      return null;
    }
    String unit = m.group(2).toLowerCase(Locale.ROOT);
    // A value per acre spread over the hectares in one acre.
    return unit.startsWith("ac") ? number / Quantities.toCanonical(1, Dimension.AREA, "ac") : number;
  }

  private Sprinklers sprinklers(Fields s, Map<String, WaterSource> sources,
      Set<String> declared, Double blockAreaHa) {
    if (s == null) {
      return null;
    }
    int before = s.problems().size();
    s.allow("rate", "source", "water_temp", "sets");
    Double rate = s.value("rate", FarmLoader.quantity(s, "rate", Dimension.RATE),
        "the application rate, e.g. rate: 3.8 mm/h or 0.15 in/h");
    ref(s, "sprinklers.rate", "rate");
    if (rate != null && !(rate > 0)) {
      s.problem("rate", s.quoted("rate") + " must be above 0; give the application rate, e.g."
          + " 3.8 mm/h or 0.15 in/h");
    } else if (rate != null && !(rate >= Sprinklers.MIN_RATE_MM_H && rate <= Sprinklers.MAX_RATE_MM_H)) {
      s.problem("rate", String.format(Locale.ROOT, "%s (%.2f mm/h) is outside %.0f to %.0f mm/h;"
          + " over-plant frost sprinklers usually apply 2.5-6.5 mm/h (0.10-0.25 in/h), check the"
          + " unit", s.quoted("rate"), rate, Sprinklers.MIN_RATE_MM_H, Sprinklers.MAX_RATE_MM_H));
    }
    String known = sources.isEmpty() ? "the farm has no water_sources; add one"
        : "the farm's water sources are " + String.join(", ", sources.keySet());
    String source = s.text("source", "the id of the water source that feeds them; " + known);
    ref(s, "sprinklers.source", "source");
    // A source declared with a problem of its own is reported there, not again for each block.
    if (source != null && !declared.contains(source)) {
      s.problem("source", s.quoted("source") + " is not among water_sources; " + known
          + (sources.isEmpty() ? "" : "; use one of them or add this source"));
    }
    double waterC = Sprinklers.DEFAULT_WATER_TEMP_C;
    if (s.has("water_temp")) {
      ref(s, "sprinklers.water_temp", "water_temp");
      Double w = s.optionalValue("water_temp", FarmLoader.quantity(s, "water_temp",
          Dimension.TEMPERATURE));
      if (w != null && !(w >= Sprinklers.MIN_WATER_TEMP_C && w <= Sprinklers.MAX_WATER_TEMP_C)) {
        s.problem("water_temp", String.format(Locale.ROOT, "%s (%.1f °C) is outside %.0f to %.0f"
            + " °C; give the supply water temperature, e.g. 8C or 46F, or leave it out to assume"
            + " %.0f °C", s.quoted("water_temp"), w, Sprinklers.MIN_WATER_TEMP_C,
            Sprinklers.MAX_WATER_TEMP_C, Sprinklers.DEFAULT_WATER_TEMP_C));
      } else if (w != null) {
        waterC = w;
      }
    }
    List<SprinklerSet> sets = List.of();
    if (s.has("sets") && rate != null && blockAreaHa != null) {
      sets = SprinklerSetReader.read(s, rate, blockAreaHa);
    }
    return s.problems().size() == before ? new Sprinklers(rate, source, waterC, sets) : null;
  }

  private Covers covers(Fields s) {
    if (s == null) {
      return null;
    }
    int before = s.problems().size();
    s.allow("protection", "fabric", "deploy_hours");
    double protectionC = 0;
    String source = null;
    if (s.has("protection") && s.has("fabric")) {
      s.problem("fabric", "give either protection or fabric, not both (protection is on line "
          + s.lineOf("protection") + "); keep protection if you measured it, else the fabric"
          + " weight");
    } else if (s.has("protection")) {
      ref(s, "covers.protection", "protection");
      Double p = s.optionalValue("protection", FarmLoader.quantity(s, "protection",
          Dimension.TEMPERATURE_DELTA));
      if (p != null && !(p > 0 && p <= Covers.MAX_PROTECTION_C)) {
        s.problem("protection", String.format(Locale.ROOT, "%s (%.2f °C) must be above 0 and at"
            + " most %.0f °C; give how much warmer the plants stay under the cover, e.g. 2.0C or"
            + " 4F", s.quoted("protection"), p, Covers.MAX_PROTECTION_C));
      } else if (p != null) {
        protectionC = p;
      }
      source = "given in " + Path.of(file).getFileName() + " line " + s.lineOf("protection");
    } else if (s.has("fabric")) {
      ref(s, "covers.fabric", "fabric");
      Double gM2 = s.optionalValue("fabric", FarmLoader.quantity(s, "fabric",
          Dimension.AREAL_MASS));
      if (gM2 != null) {
        try {
          FabricProtection.Protection prot = FabricProtection.forWeight(gM2);
          protectionC = prot.protectionC();
          source = prot.source();
        } catch (IllegalArgumentException ex) {
          s.problem("fabric", s.quoted("fabric") + ": " + ex.getMessage()
              + "; give the cover's protection directly instead, e.g. protection: 2.0C");
        }
      }
    } else {
      s.problem("needs protection (e.g. protection: 2.0C) or fabric (e.g. fabric: 50 g/m2 or"
          + " 1.5 oz/yd2)");
    }
    Double hours = s.value("deploy_hours", t -> Numbers.parse(t, false), "how many hours it takes"
        + " to put the covers on, e.g. deploy_hours: 2");
    ref(s, "covers.deploy_hours", "deploy_hours");
    if (hours != null && !(hours >= 0 && hours <= Covers.MAX_DEPLOY_HOURS)) {
      s.problem("deploy_hours", s.quoted("deploy_hours") + " is outside 0 to 12 hours; give how"
          + " long it takes to put the covers on, e.g. 2 or 1.5");
    }
    return s.problems().size() == before ? new Covers(protectionC, source, hours) : null;
  }

  private void ref(Fields s, String path, String key) {
    if (s.has(key)) {
      refs.put(path, new SourceRef(file, s.lineOf(key)));
    }
  }
}
