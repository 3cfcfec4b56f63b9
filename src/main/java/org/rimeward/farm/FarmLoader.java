package org.rimeward.farm;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.InvalidPathException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.farm.YamlTree.Entry;
import org.rimeward.farm.YamlTree.ListNode;
import org.rimeward.farm.YamlTree.MapNode;
import org.rimeward.farm.YamlTree.Node;
import org.rimeward.farm.YamlTree.Scalar;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Loaded;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.QuantityException;

/**
 * Reads and checks a farm file. Every problem is a {@link BadInputException} that starts with
 * {@code file:line}, names the field and the value, and says what to write instead. Checks that
 * need the crop profiles (unknown crop or stage) are left to the planner, which gets each block's
 * field lines through {@link Block#lineOf(String)}.
 */
public final class FarmLoader {
  /** The farm file's name inside a farm folder. */
  public static final String FILE_NAME = "farm.yaml";
  /** The forecast file used when farm.yaml names none, relative to the farm folder. */
  public static final String DEFAULT_FORECAST = "forecast.csv";

  private static final Pattern NUMBER =
      Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
  private static final Pattern CROP_VALUE = Pattern.compile(
      "\\s*(" + NUMBER.pattern() + ")\\s*(?:per\\s+|/\\s*)(ha|hectares?|ac|acres?)\\s*",
      Pattern.CASE_INSENSITIVE);

  private final String file;

  private FarmLoader(String file) {
    this.file = file;
  }

  /**
   * Loads {@code farm.yaml} from the farm folder {@code farmDirOrFile}, or the file itself when
   * given a file.
   */
  public static Farm load(Path farmDirOrFile) {
    return loadWithContent(farmDirOrFile).value();
  }

  /** As {@link #load(Path)}, with the bytes of the farm file as read. */
  public static Loaded<Farm> loadWithContent(Path farmDirOrFile) {
    Path path = Files.isDirectory(farmDirOrFile) ? farmDirOrFile.resolve(FILE_NAME) : farmDirOrFile;
    String label = path.toString();
    byte[] bytes;
    try {
      bytes = Files.readAllBytes(path);
    } catch (NoSuchFileException e) {
      throw BadInputException.at(label, Files.isDirectory(farmDirOrFile)
          ? "the farm folder has no " + FILE_NAME + "; create one there or give the farm file's path"
          : "no such file; give a farm folder or the path to its " + FILE_NAME);
    } catch (IOException e) {
      throw withCause(label, "could not read the farm file: " + e, e);
    }
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(bytes)).toString();
    } catch (CharacterCodingException e) {
      throw withCause(label, "is not UTF-8 text; save it as UTF-8", e);
    }
    if (text.startsWith("\uFEFF")) {
      text = text.substring(1);
    }
    Path folder = path.toAbsolutePath().getParent();
    return new Loaded<>(new FarmLoader(label).read(YamlTree.parse(text, label), folder), bytes);
  }

  private Farm read(Node root, Path folder) {
    Section top = section(root, "the farm file", "farm, forecast, policy, water_sources and blocks sections");
    top.allow("farm", "forecast", "policy", "water_sources", "blocks");

    Section farm = top.map(top.required("farm", "the farm's name, latitude, longitude, elevation and timezone"));
    farm.allow("name", "latitude", "longitude", "elevation", "timezone");
    String name = farm.text(farm.required("name", "e.g. name: Hillside Orchard"));
    double latitude = degrees(farm, "latitude", 90, "north positive, e.g. 46.21 (or -33.9 south of the equator)");
    double longitude = degrees(farm, "longitude", 180, "east positive, e.g. -119.76 for the western hemisphere");
    Entry elevEntry = farm.required("elevation", "e.g. elevation: 240 m or 800 ft");
    double elevationM = farm.quantity(elevEntry, Dimension.LENGTH);
    if (!(elevationM >= Farm.MIN_ELEVATION_M && elevationM <= Farm.MAX_ELEVATION_M)) {
      throw farm.bad(elevEntry, String.format(Locale.ROOT, "%s (%.0f m) is outside %.0f to %.0f m;"
          + " give the elevation above sea level with its unit, e.g. 240 m or 800 ft",
          quote(elevEntry), elevationM, Farm.MIN_ELEVATION_M, Farm.MAX_ELEVATION_M));
    }
    ZoneId zone = zone(farm);

    Path forecastFile = folder.resolve(DEFAULT_FORECAST);
    Optional<Entry> fc = top.optional("forecast");
    if (fc.isPresent()) {
      String f = top.text(fc.get());
      try {
        forecastFile = folder.resolve(f);
      } catch (InvalidPathException e) {
        throw top.bad(fc.get(), quote(fc.get()) + " is not a usable file name (" + e.getReason()
            + "); give the forecast CSV's name relative to the farm folder, e.g. forecast.csv");
      }
    }

    Policy policy = top.optional("policy").map(e -> policy(top.map(e))).orElse(Policy.DEFAULT);
    List<WaterSource> sources = top.optional("water_sources").map(e -> waterSources(top, e)).orElse(List.of());
    Map<String, WaterSource> sourcesById = new LinkedHashMap<>();
    sources.forEach(s -> sourcesById.put(s.id(), s));

    Entry blocksEntry = top.required("blocks", "a list of blocks, each with id, crop, stage and area");
    ListNode list = top.list(blocksEntry);
    if (list.items().isEmpty()) {
      throw top.bad(blocksEntry, "the list is empty; add at least one block with id, crop, stage and area");
    }
    List<Block> blocks = new ArrayList<>();
    Map<String, Integer> blockLines = new HashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Node item = list.items().get(i);
      Block b = block(item, i + 1, sourcesById);
      Integer previous = blockLines.putIfAbsent(b.id(), item.line());
      if (previous != null) {
        throw bad(b.lineOf("id").line(), "blocks[" + b.id() + "].id", "'" + b.id()
            + "' is already the id of the block on line " + previous + "; give each block its own id");
      }
      blocks.add(b);
    }
    try {
      return new Farm(name, latitude, longitude, elevationM, zone, folder, forecastFile, policy,
          sources, blocks, new SourceRef(file, 1));
    } catch (IllegalArgumentException e) {
      throw withCause(file, e.getMessage(), e);
    }
  }

  private double degrees(Section s, String key, double limit, String hint) {
    Entry e = s.required(key, hint);
    double v = s.number(e, hint);
    if (!(Math.abs(v) <= limit)) {
      throw s.bad(e, String.format(Locale.ROOT, "%s is outside -%.0f to %.0f; give decimal degrees, %s",
          quote(e), limit, limit, hint));
    }
    return v;
  }

  private ZoneId zone(Section farm) {
    Entry e = farm.required("timezone", "an IANA time zone name, e.g. America/Los_Angeles or Europe/Paris");
    String id = farm.text(e);
    if (ZoneId.getAvailableZoneIds().contains(id)) {
      return ZoneId.of(id);
    }
    String hint = ZoneId.getAvailableZoneIds().stream()
        .filter(z -> z.equalsIgnoreCase(id) || z.equalsIgnoreCase(id.replace(' ', '_')))
        .findFirst().map(z -> "did you mean " + z + "? ").orElse("");
    throw farm.bad(e, quote(e) + " is not an IANA time zone name; " + hint
        + "write the zone as Region/City, e.g. America/Los_Angeles, Europe/Paris or Australia/Sydney"
        + " (fixed offsets such as +02:00 would miss daylight-saving changes)");
  }

  private Policy policy(Section p) {
    p.allow("target", "start_margin", "stop_rule");
    Target target = Policy.DEFAULT.target();
    Optional<Entry> t = p.optional("target");
    if (t.isPresent()) {
      String text = p.text(t.get());
      if (text.trim().equalsIgnoreCase("t10")) {
        target = Target.t10();
      } else {
        double c;
        try {
          c = Quantities.parse(text, Dimension.TEMPERATURE, "policy.target");
        } catch (QuantityException ex) {
          throw p.bad(t.get(), quote(t.get()) + " is neither t10 nor a temperature; write t10 (the"
              + " stage's 10 % kill temperature) or a temperature such as -1.5C or 29F");
        }
        if (!(c >= Target.MIN_FIXED_C && c <= Target.MAX_FIXED_C)) {
          throw p.bad(t.get(), String.format(Locale.ROOT, "%s (%.2f °C) is outside %.0f to %.0f °C;"
              + " give the temperature to protect to, e.g. -1.5C, or write t10",
              quote(t.get()), c, Target.MIN_FIXED_C, Target.MAX_FIXED_C));
        }
        target = Target.fixed(c);
      }
    }
    double margin = Policy.DEFAULT.startMarginC();
    Optional<Entry> m = p.optional("start_margin");
    if (m.isPresent()) {
      margin = p.quantity(m.get(), Dimension.TEMPERATURE_DELTA);
      if (!(margin >= 0 && margin <= Policy.MAX_START_MARGIN_C)) {
        throw p.bad(m.get(), String.format(Locale.ROOT, "%s (%.2f °C) is outside 0 to %.0f °C; give how"
            + " far above the start temperature to begin sprinkling, e.g. 1.0C or 2F",
            quote(m.get()), margin, Policy.MAX_START_MARGIN_C));
      }
    }
    StopRule stop = Policy.DEFAULT.stopRule();
    Optional<Entry> s = p.optional("stop_rule");
    if (s.isPresent()) {
      String text = p.text(s.get());
      stop = StopRule.fromYaml(text).orElseThrow(() -> p.bad(s.get(), quote(s.get())
          + " is not a stop rule; write one of: " + StopRule.allowed()));
    }
    return new Policy(target, margin, stop);
  }

  private List<WaterSource> waterSources(Section top, Entry e) {
    ListNode list = top.list(e);
    List<WaterSource> out = new ArrayList<>();
    Map<String, Integer> lines = new HashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Section s = section(list.items().get(i), "water_sources item " + (i + 1), "id, max_flow and volume");
      Entry idEntry = s.required("id", "a short name blocks refer to, e.g. id: pond");
      String id = id(s, idEntry);
      s = s.renamed("water_sources[" + id + "]");
      s.allow("id", "max_flow", "volume");
      Integer previous = lines.putIfAbsent(id, idEntry.keyLine());
      if (previous != null) {
        throw s.bad(idEntry, "'" + id + "' is already the id of the water source on line " + previous
            + "; give each source its own id");
      }
      Entry flowEntry = s.required("max_flow", "the most the source delivers, e.g. max_flow: 450 m3/h or 2000 gpm");
      double flow = s.quantity(flowEntry, Dimension.FLOW);
      if (!(flow > 0)) {
        throw s.bad(flowEntry, quote(flowEntry) + " must be above 0; give the most the source can"
            + " deliver, e.g. 450 m3/h or 2000 gpm");
      }
      OptionalDouble volume = OptionalDouble.empty();
      Optional<Entry> v = s.optional("volume");
      if (v.isPresent()) {
        double m3 = s.quantity(v.get(), Dimension.VOLUME);
        if (!(m3 > 0)) {
          throw s.bad(v.get(), quote(v.get()) + " must be above 0; give the usable volume, e.g. 9000 m3"
              + " or 7.3 acre-ft, or leave volume out for a well with no volume limit");
        }
        volume = OptionalDouble.of(m3);
      }
      out.add(new WaterSource(id, flow, volume));
    }
    return out;
  }

  private Block block(Node item, int index, Map<String, WaterSource> sources) {
    Section s = section(item, "blocks item " + index, "id, crop, stage and area");
    Map<String, SourceRef> refs = new HashMap<>();
    Entry idEntry = s.required("id", "a short name for the block, e.g. id: north-gala");
    String id = id(s, idEntry);
    s = s.renamed("blocks[" + id + "]");
    s.allow("id", "crop", "variety", "stage", "area", "cold_air_offset", "crop_value", "sprinklers", "covers");
    refs.put("id", ref(idEntry));
    Section b = s;

    Entry cropEntry = b.required("crop", "e.g. crop: apple");
    String crop = b.text(cropEntry).trim();
    refs.put("crop", ref(cropEntry));
    String variety = null;
    Optional<Entry> v = b.optional("variety");
    if (v.isPresent()) {
      variety = b.text(v.get()).trim();
      refs.put("variety", ref(v.get()));
    }
    Entry stageEntry = b.required("stage", "the bud stage tonight, e.g. stage: full-bloom");
    String stage = b.text(stageEntry).trim();
    refs.put("stage", ref(stageEntry));

    Entry areaEntry = b.required("area", "the planted area, e.g. area: 4.5 ha or 11 ac");
    double areaHa = b.quantity(areaEntry, Dimension.AREA);
    refs.put("area", ref(areaEntry));
    if (!(areaHa > 0)) {
      throw b.bad(areaEntry, quote(areaEntry) + " must be above 0; give the planted area, e.g. 4.5 ha or 11 ac");
    }

    double offsetC = 0;
    Optional<Entry> o = b.optional("cold_air_offset");
    if (o.isPresent()) {
      offsetC = b.quantity(o.get(), Dimension.TEMPERATURE_DELTA);
      refs.put("cold_air_offset", ref(o.get()));
      if (!(Math.abs(offsetC) <= Block.MAX_COLD_AIR_OFFSET_C)) {
        throw b.bad(o.get(), String.format(Locale.ROOT, "%s (%.2f °C) is outside -%.0f to %.0f °C; give how"
            + " much colder (negative) the block runs than the forecast point, e.g. -0.5C or -1F",
            quote(o.get()), offsetC, Block.MAX_COLD_AIR_OFFSET_C, Block.MAX_COLD_AIR_OFFSET_C));
      }
    }

    OptionalDouble value = OptionalDouble.empty();
    Optional<Entry> cv = b.optional("crop_value");
    if (cv.isPresent()) {
      value = OptionalDouble.of(cropValue(b, cv.get()));
      refs.put("crop_value", ref(cv.get()));
    }

    Optional<Sprinklers> sprinklers = b.optional("sprinklers").map(e -> {
      refs.put("sprinklers", ref(e));
      return sprinklers(b.map(e), sources, refs, areaHa);
    });
    Optional<Covers> covers = b.optional("covers").map(e -> {
      refs.put("covers", ref(e));
      return covers(b.map(e), refs);
    });
    try {
      return new Block(id, crop, variety, stage, areaHa, offsetC, value, sprinklers, covers,
          new SourceRef(file, item.line()), refs);
    } catch (IllegalArgumentException e) {
      throw bad(item.line(), b.path, e.getMessage());
    }
  }

  private double cropValue(Section b, Entry e) {
    String text = b.text(e);
    Matcher m = CROP_VALUE.matcher(text);
    if (!m.matches()) {
      throw b.bad(e, quote(e) + " is not a value per area; write <number> per ha or <number> per ac,"
          + " e.g. 30000 per ha or 12000 per ac (in the farm's currency, no symbol)");
    }
    double number = Double.parseDouble(m.group(1));
    if (!(number >= 0 && Double.isFinite(number))) {
      throw b.bad(e, quote(e) + " must be 0 or more; give the crop's value, e.g. 30000 per ha");
    }
    String unit = m.group(2).toLowerCase(Locale.ROOT);
    // A value per acre spread over the hectares in one acre.
    double haPerUnit = unit.startsWith("ac") ? Quantities.parse("1 ac", Dimension.AREA, "acre") : 1.0;
    return number / haPerUnit;
  }

  private Sprinklers sprinklers(Section s, Map<String, WaterSource> sources, Map<String, SourceRef> refs,
      double blockAreaHa) {
    s.allow("rate", "source", "water_temp", "sets");
    Entry rateEntry = s.required("rate", "the application rate, e.g. rate: 3.8 mm/h or 0.15 in/h");
    refs.put("sprinklers.rate", ref(rateEntry));
    double rate = s.quantity(rateEntry, Dimension.RATE);
    if (!(rate > 0)) {
      throw s.bad(rateEntry, quote(rateEntry) + " must be above 0; give the application rate, e.g. 3.8 mm/h or 0.15 in/h");
    }
    if (!(rate >= Sprinklers.MIN_RATE_MM_H && rate <= Sprinklers.MAX_RATE_MM_H)) {
      throw s.bad(rateEntry, String.format(Locale.ROOT, "%s (%.2f mm/h) is outside %.0f to %.0f mm/h;"
          + " over-plant frost sprinklers usually apply 2.5-6.5 mm/h (0.10-0.25 in/h), check the unit",
          quote(rateEntry), rate, Sprinklers.MIN_RATE_MM_H, Sprinklers.MAX_RATE_MM_H));
    }
    String known = sources.isEmpty() ? "the farm has no water_sources; add one"
        : "the farm's water sources are " + String.join(", ", sources.keySet());
    Entry srcEntry = s.required("source", "the id of the water source that feeds them; " + known);
    refs.put("sprinklers.source", ref(srcEntry));
    String source = s.text(srcEntry).trim();
    if (!sources.containsKey(source)) {
      throw s.bad(srcEntry, quote(srcEntry) + " is not among water_sources; " + known
          + (sources.isEmpty() ? "" : "; use one of them or add this source"));
    }
    double waterC = Sprinklers.DEFAULT_WATER_TEMP_C;
    Optional<Entry> w = s.optional("water_temp");
    if (w.isPresent()) {
      refs.put("sprinklers.water_temp", ref(w.get()));
      waterC = s.quantity(w.get(), Dimension.TEMPERATURE);
      if (!(waterC >= Sprinklers.MIN_WATER_TEMP_C && waterC <= Sprinklers.MAX_WATER_TEMP_C)) {
        throw s.bad(w.get(), String.format(Locale.ROOT, "%s (%.1f °C) is outside %.0f to %.0f °C; give the"
            + " supply water temperature, e.g. 8C or 46F, or leave it out to assume %.0f °C",
            quote(w.get()), waterC, Sprinklers.MIN_WATER_TEMP_C, Sprinklers.MAX_WATER_TEMP_C,
            Sprinklers.DEFAULT_WATER_TEMP_C));
      }
    }
    List<SprinklerSet> sets = s.optional("sets").map(e -> sets(s, e, rate, blockAreaHa)).orElse(List.of());
    return new Sprinklers(rate, source, waterC, sets);
  }

  /** Irrigation sets: parts of the block switched as one, each with its area and, optionally, flow. */
  private List<SprinklerSet> sets(Section parent, Entry e, double rateMmH, double blockAreaHa) {
    ListNode list = parent.list(e);
    if (list.items().isEmpty()) {
      throw parent.bad(e, "the list is empty; give each set's id and area, or leave sets out");
    }
    List<SprinklerSet> out = new ArrayList<>();
    Map<String, Integer> lines = new HashMap<>();
    double total = 0;
    for (int i = 0; i < list.items().size(); i++) {
      Section s = section(list.items().get(i), parent.field("sets") + " item " + (i + 1), "id, area and flow");
      Entry idEntry = s.required("id", "a short name for the set, e.g. id: north-valve");
      String id = id(s, idEntry);
      s = s.renamed(parent.field("sets") + "[" + id + "]");
      s.allow("id", "area", "flow");
      Integer previous = lines.putIfAbsent(id, idEntry.keyLine());
      if (previous != null) {
        throw s.bad(idEntry, "'" + id + "' is already the id of the set on line " + previous
            + "; give each set its own id");
      }
      Entry areaEntry = s.required("area", "the area the set wets, e.g. area: 1.2 ha or 3 ac");
      double area = s.quantity(areaEntry, Dimension.AREA);
      if (!(area > 0)) {
        throw s.bad(areaEntry, quote(areaEntry) + " must be above 0; give the area the set wets, e.g. 1.2 ha");
      }
      // Without a measured flow, the set draws the block's rate over its area: 1 mm on 1 ha is 10 m³.
      double flow = rateMmH * area * 10.0;
      Optional<Entry> f = s.optional("flow");
      if (f.isPresent()) {
        flow = s.quantity(f.get(), Dimension.FLOW);
        if (!(flow > 0)) {
          throw s.bad(f.get(), quote(f.get()) + " must be above 0; give what the set draws, e.g. 48 m3/h"
              + " or 210 gpm, or leave flow out to take the block's rate over the set's area");
        }
      }
      total += area;
      out.add(new SprinklerSet(id, area, flow));
    }
    if (total > blockAreaHa * 1.001) {
      throw parent.bad(e, String.format(Locale.ROOT, "the sets cover %.2f ha, more than the block's"
          + " %.2f ha; check each set's area and the block's area", total, blockAreaHa));
    }
    return List.copyOf(out);
  }

  private Covers covers(Section s, Map<String, SourceRef> refs) {
    s.allow("protection", "fabric", "deploy_hours");
    Optional<Entry> p = s.optional("protection");
    Optional<Entry> f = s.optional("fabric");
    if (p.isPresent() && f.isPresent()) {
      throw s.bad(f.get(), "give either protection or fabric, not both (protection is on line "
          + p.get().keyLine() + "); keep protection if you measured it, else the fabric weight");
    }
    double protectionC;
    String source;
    if (p.isPresent()) {
      refs.put("covers.protection", ref(p.get()));
      protectionC = s.quantity(p.get(), Dimension.TEMPERATURE_DELTA);
      if (!(protectionC > 0 && protectionC <= Covers.MAX_PROTECTION_C)) {
        throw s.bad(p.get(), String.format(Locale.ROOT, "%s (%.2f °C) must be above 0 and at most %.0f °C;"
            + " give how much warmer the plants stay under the cover, e.g. 2.0C or 4F",
            quote(p.get()), protectionC, Covers.MAX_PROTECTION_C));
      }
      source = "given in " + Path.of(file).getFileName() + " line " + p.get().keyLine();
    } else if (f.isPresent()) {
      refs.put("covers.fabric", ref(f.get()));
      double gM2 = s.quantity(f.get(), Dimension.AREAL_MASS);
      FabricProtection.Protection prot;
      try {
        prot = FabricProtection.forWeight(gM2);
      } catch (IllegalArgumentException ex) {
        throw s.bad(f.get(), quote(f.get()) + ": " + ex.getMessage()
            + "; give the cover's protection directly instead, e.g. protection: 2.0C");
      }
      protectionC = prot.protectionC();
      source = prot.source();
    } else {
      throw s.bad(s.line, "needs protection (e.g. protection: 2.0C) or fabric (e.g. fabric: 50 g/m2"
          + " or 1.5 oz/yd2)");
    }
    Entry d = s.required("deploy_hours", "how many hours it takes to put the covers on, e.g. deploy_hours: 2");
    refs.put("covers.deploy_hours", ref(d));
    double hours = s.number(d, "a number of hours from 0 to 12, e.g. 2 or 1.5");
    if (!(hours >= 0 && hours <= Covers.MAX_DEPLOY_HOURS)) {
      throw s.bad(d, quote(d) + " is outside 0 to 12 hours; give how long it takes to put the covers on,"
          + " e.g. 2 or 1.5");
    }
    return new Covers(protectionC, source, hours);
  }

  private String id(Section s, Entry e) {
    String id = s.text(e).trim();
    if (!Ids.ID.matcher(id).matches()) {
      throw s.bad(e, quote(e) + " is not a usable id; use " + Ids.RULE);
    }
    return id;
  }

  private SourceRef ref(Entry e) {
    return new SourceRef(file, e.keyLine());
  }

  private static String quote(Entry e) {
    Node n = e.value();
    return n instanceof Scalar sc && sc.text() != null ? "'" + sc.text() + "'" : "the value";
  }

  private BadInputException bad(int line, String field, String message) {
    return BadInputException.at(file + ":" + line, field + ": " + message);
  }

  private Section section(Node n, String path, String expected) {
    if (n instanceof MapNode m) {
      return new Section(m, path, m.line());
    }
    throw bad(n.line(), path, "expected a section with " + expected + " (key: value lines), found "
        + describe(n));
  }

  private static String describe(Node n) {
    if (n instanceof ListNode) {
      return "a list";
    }
    Scalar s = (Scalar) n;
    return s.isNull() || s.text().isBlank() ? "nothing" : "'" + s.text() + "'";
  }

  /** A map in the file with its dotted path, for messages. */
  private final class Section {
    private final MapNode node;
    private final String path;
    private final int line;

    Section(MapNode node, String path, int line) {
      this.node = node;
      this.path = path;
      this.line = line;
    }

    Section renamed(String newPath) {
      return new Section(node, newPath, line);
    }

    void allow(String... keys) {
      List<String> allowed = List.of(keys);
      for (Entry e : node.entries().values()) {
        if (!allowed.contains(e.key())) {
          throw FarmLoader.this.bad(e.keyLine(), field(e.key()), "unknown key; allowed here: "
              + String.join(", ", allowed) + " (check the spelling)");
        }
      }
    }

    Optional<Entry> optional(String key) {
      return Optional.ofNullable(node.entries().get(key));
    }

    Entry required(String key, String hint) {
      return optional(key).orElseThrow(() -> FarmLoader.this.bad(line, path, "'" + key + "' is required; " + hint));
    }

    String field(String key) {
      return path.equals("the farm file") ? key : path + "." + key;
    }

    BadInputException bad(Entry e, String message) {
      return FarmLoader.this.bad(e.keyLine(), field(e.key()), message);
    }

    BadInputException bad(int atLine, String message) {
      return FarmLoader.this.bad(atLine, path, message);
    }

    String text(Entry e) {
      if (e.value() instanceof Scalar s && !s.isNull() && !s.text().isBlank()) {
        return s.text();
      }
      throw bad(e, "expected a value, found " + describe(e.value()) + "; write it after the colon"
          + " or leave the line out");
    }

    double quantity(Entry e, Dimension dim) {
      String text = text(e);
      try {
        return Quantities.parse(text, dim, field(e.key()));
      } catch (QuantityException ex) {
        throw withCause(file + ":" + e.keyLine(), ex.getMessage(), ex);
      }
    }

    double number(Entry e, String hint) {
      String text = text(e).trim();
      if (!NUMBER.matcher(text).matches()) {
        throw bad(e, quote(e) + " is not a number; write " + hint);
      }
      return Double.parseDouble(text);
    }

    Section map(Entry e) {
      return section(e.value(), field(e.key()), "its fields").renamedLine(e.keyLine());
    }

    Section renamedLine(int keyLine) {
      return new Section(node, path, keyLine);
    }

    ListNode list(Entry e) {
      if (e.value() instanceof ListNode l) {
        return l;
      }
      throw bad(e, "expected a list ('- ' items), found " + describe(e.value()));
    }
  }


  private static BadInputException withCause(String where, String message, Throwable cause) {
    return new BadInputException(where + ": " + message, cause);
  }
}
