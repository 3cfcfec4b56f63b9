package org.rimeward.farm;

import java.nio.file.InvalidPathException;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Fields;
import org.rimeward.io.Loaded;
import org.rimeward.io.Numbers;
import org.rimeward.io.Problems;
import org.rimeward.io.Text;
import org.rimeward.io.TextFile;
import org.rimeward.io.Yaml;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;

/**
 * Reads and checks a farm file: the {@code farm} section and the forecast's name here, the
 * policy, water sources, blocks and stations in their own readers. Every problem in the file is collected
 * and reported at once, each starting with {@code file:line}, naming the field and the value,
 * and saying what to write instead. Checks that need the crop profiles (unknown crop or stage)
 * are left to the planner, which gets each block's field lines through {@link Block#lineOf}.
 */
public final class FarmLoader {
  /** The farm file's name inside a farm folder. */
  public static final String FILE_NAME = "farm.yaml";
  /** The forecast file used when farm.yaml names none, relative to the farm folder. */
  public static final String DEFAULT_FORECAST = "forecast.csv";

  private FarmLoader() {}

  /**
   * Loads {@code farm.yaml} from the farm folder {@code farmDirOrFile}, or the file itself when
   * given a file.
   */
  public static Farm load(Path farmDirOrFile) {
    return loadWithContent(farmDirOrFile).value();
  }

  /** As {@link #load(Path)}, with the bytes of the farm file as read. */
  public static Loaded<Farm> loadWithContent(Path farmDirOrFile) {
    boolean folderGiven = java.nio.file.Files.isDirectory(farmDirOrFile);
    Path path = folderGiven ? farmDirOrFile.resolve(FILE_NAME) : farmDirOrFile;
    TextFile file = TextFile.read(path, TextFile.MAX_DOCUMENT_BYTES, "farm file", folderGiven
        ? "the farm folder has no " + FILE_NAME + "; create one there or give the farm file's path"
        : "give a farm folder or the path to its " + FILE_NAME);
    Node root = Yaml.parse(file, "write the farm, water_sources and blocks sections");
    Problems problems = new Problems(file.label());
    Farm farm = read(root, path.toAbsolutePath().getParent(), problems);
    problems.throwIfAny();
    return new Loaded<>(farm, file.bytes());
  }

  private static Farm read(Node root, Path folder, Problems problems) {
    Fields top = Fields.of(root, "", "farm, forecast, policy, water_sources and blocks sections",
        problems);
    if (top == null) {
      return null;
    }
    top.allow("farm", "forecast", "policy", "water_sources", "blocks", "stations", "crop_profiles",
        "rules");
    if (!top.has("farm")) {
      top.text("farm", "the farm's name, latitude, longitude, elevation and timezone");
    }
    Fields farm = top.map("farm", "name, latitude, longitude, elevation and timezone");
    String name = null;
    Double latitude = null;
    Double longitude = null;
    Double elevationM = null;
    ZoneId zone = null;
    Optional<String> contact = Optional.empty();
    if (farm != null) {
      farm.allow("name", "latitude", "longitude", "elevation", "timezone", "contact");
      name = name(farm);
      latitude = degrees(farm, "latitude", 90, "north positive, e.g. 46.21 (or -33.9 south of the"
          + " equator)");
      longitude = degrees(farm, "longitude", 180, "east positive, e.g. -119.76 for the western"
          + " hemisphere");
      elevationM = elevation(farm);
      zone = zone(farm);
      contact = Optional.ofNullable(farm.optionalText("contact")).map(String::strip);
    }
    Path forecastFile = forecast(top, folder);
    Optional<Path> cropProfiles = dataFolder(top, "crop_profiles", folder, Farm.DEFAULT_CROP_PROFILES);
    Optional<Path> rules = dataFolder(top, "rules", folder, Farm.DEFAULT_RULES);
    Policy policy = top.has("policy") ? PolicyReader.read(top.map("policy", "target, start_margin"
        + " and stop_rule")) : Policy.DEFAULT;
    Set<String> declared = new HashSet<>();
    List<WaterSource> sources = WaterSourceReader.read(top, declared);
    Map<String, WaterSource> sourcesById = new LinkedHashMap<>();
    sources.forEach(s -> sourcesById.put(s.id(), s));
    List<Block> blocks = blocks(top, sourcesById, declared);
    List<Station> stations = StationReader.read(top, writtenBlockIds(top));
    if (!problems.isEmpty() || name == null || latitude == null || longitude == null
        || elevationM == null || zone == null || policy == null || forecastFile == null) {
      return null;
    }
    try {
      return new Farm(name, latitude, longitude, elevationM, zone, folder, forecastFile, policy,
          sources, blocks, new SourceRef(problems.label(), 1), cropProfiles, rules, contact,
          stations);
    } catch (IllegalArgumentException e) {
      throw BadInputException.at(problems.label(), e.getMessage());
    }
  }

  private static String name(Fields farm) {
    String name = farm.text("name", "e.g. name: Hillside Orchard");
    String control = name == null ? null : Text.firstControl(name);
    if (control != null) {
      farm.problem("name", "contains the control character " + control + ", which would garble"
          + " the terminal and reports; remove it");
      return null;
    }
    return name;
  }

  private static Double degrees(Fields s, String key, double limit, String hint) {
    Double v = s.value(key, t -> Numbers.parse(t, false), hint);
    if (v != null && !(Math.abs(v) <= limit)) {
      s.problem(key, String.format(Locale.ROOT, "%s is outside -%.0f to %.0f; give decimal"
          + " degrees, %s", s.quoted(key), limit, limit, hint));
      return null;
    }
    return v;
  }

  private static Double elevation(Fields farm) {
    Double m = farm.value("elevation", quantity(farm, "elevation", Dimension.LENGTH),
        "e.g. elevation: 240 m or 800 ft");
    if (m != null && !(m >= Farm.MIN_ELEVATION_M && m <= Farm.MAX_ELEVATION_M)) {
      farm.problem("elevation", String.format(Locale.ROOT, "%s (%.0f m) is outside %.0f to %.0f m,"
          + " the range the station-pressure formula holds for; give the elevation above sea level"
          + " with its unit, e.g. 240 m or 800 ft", farm.quoted("elevation"), m,
          Farm.MIN_ELEVATION_M, Farm.MAX_ELEVATION_M));
      return null;
    }
    return m;
  }

  private static ZoneId zone(Fields farm) {
    String id = farm.text("timezone", "an IANA time zone name, e.g. America/Los_Angeles or"
        + " Europe/Paris");
    if (id == null) {
      return null;
    }
    if (ZoneId.getAvailableZoneIds().contains(id)) {
      return ZoneId.of(id);
    }
    String hint = ZoneId.getAvailableZoneIds().stream()
        .filter(z -> z.equalsIgnoreCase(id) || z.equalsIgnoreCase(id.replace(' ', '_')))
        .findFirst().map(z -> "did you mean " + z + "? ").orElse("");
    farm.problem("timezone", farm.quoted("timezone") + " is not an IANA time zone name; " + hint
        + "write the zone as Region/City, e.g. America/Los_Angeles, Europe/Paris or"
        + " Australia/Sydney (fixed offsets such as +02:00 would miss daylight-saving changes)");
    return null;
  }

  /** A crop-profiles or rules folder farm.yaml names, relative to itself; it must exist. */
  private static Optional<Path> dataFolder(Fields top, String key, Path folder, String usual) {
    String name = top.optionalText(key);
    if (name == null) {
      return Optional.empty();
    }
    try {
      Path dir = folder.resolve(name).normalize();
      if (java.nio.file.Files.isDirectory(dir)) {
        return Optional.of(dir);
      }
      top.problem(key, top.quoted(key) + " is not a folder next to the farm file (" + dir + ");"
          + " create it, or leave the line out to use " + usual + "/ beside farm.yaml if present,"
          + " else the bundled copies");
    } catch (InvalidPathException e) {
      top.problem(key, top.quoted(key) + " is not a usable folder name (" + e.getReason() + ")");
    }
    return Optional.empty();
  }

  private static Path forecast(Fields top, Path folder) {
    String f = top.optionalText("forecast");
    if (f == null) {
      return top.has("forecast") ? null : folder.resolve(DEFAULT_FORECAST);
    }
    try {
      return folder.resolve(f);
    } catch (InvalidPathException e) {
      top.problem("forecast", top.quoted("forecast") + " is not a usable file name ("
          + e.getReason() + "); give the forecast file's name relative to the farm folder, e.g."
          + " forecast.csv, or a folder of fetched forecasts, e.g. forecasts/");
      return null;
    }
  }

  private static List<Block> blocks(Fields top, Map<String, WaterSource> sources,
      Set<String> declared) {
    if (!top.has("blocks")) {
      top.text("blocks", "a list of blocks, each with id, crop, stage and area");
      return List.of();
    }
    SeqNode list = top.list("blocks");
    if (list == null) {
      return List.of();
    }
    if (list.items().isEmpty()) {
      top.problem("blocks", "the list is empty; add at least one block with id, crop, stage and"
          + " area");
      return List.of();
    }
    List<Block> blocks = new ArrayList<>();
    Map<String, Integer> blockLines = new HashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Node item = list.items().get(i);
      Block b = BlockReader.read(item, i + 1, sources, declared, top.problems());
      if (b == null) {
        continue;
      }
      Integer previous = blockLines.putIfAbsent(b.id(), item.line());
      if (previous != null) {
        top.problems().add(b.lineOf("id").line(), "blocks[" + b.id() + "].id: '" + b.id()
            + "' is already the id of the block on line " + previous + "; give each block its"
            + " own id");
        continue;
      }
      blocks.add(b);
    }
    return blocks;
  }

  /** The id of every block written, usable or not, with its line, in file order. */
  private static Map<String, Integer> writtenBlockIds(Fields top) {
    Map<String, Integer> ids = new LinkedHashMap<>();
    Node list = top.has("blocks") ? top.entry("blocks").value() : null;
    if (list instanceof SeqNode seq) {
      for (Node item : seq.items()) {
        if (item instanceof Yaml.MapNode m && m.get("id") instanceof Yaml.Scalar id
            && id.value() != null) {
          ids.putIfAbsent(id.value(), id.line());
        }
      }
    }
    return ids;
  }

  /** Reads a field as a quantity of {@code dim}, named by its field path in messages. */
  static Fields.Parser<Double> quantity(Fields f, String key, Dimension dim) {
    return t -> Quantities.parse(t, dim, f.field(key));
  }

  /** An id: typed on the command line and stored in the audit, so kept plain. */
  /**
   * Checks a quantity read from {@code key} (already in {@code unit}) is above 0 and at most
   * {@code max}, adding one problem otherwise: {@code give} says what to write instead of a
   * value not above 0; {@code tooBig} why a value over {@code max} is likely a typo.
   *
   * @return whether the value is there and usable
   */
  static boolean positiveUpTo(Fields s, String key, Double value, String give, double max,
      String unit, String tooBig) {
    if (value == null) {
      return false;
    }
    if (!(value > 0)) {
      s.problem(key, s.quoted(key) + " must be above 0; " + give);
      return false;
    }
    if (value > max) {
      s.problem(key, String.format(Locale.ROOT, "%s (%.0f %s) is more than %.0f %s, %s",
          s.quoted(key), value, unit, max, unit, tooBig));
      return false;
    }
    return true;
  }

  /** An item of a list whose entries have ids: its fields, named by the id where it has one. */
  record IdItem(Fields fields, String id) {}

  /**
   * Reads the id of one item of the list {@code listField} (water sources, sets, stations) and
   * names the item's fields by it, so later problems say {@code water_sources[pond].max_flow};
   * an id already used by an earlier item in {@code seen} (id to line) is a problem naming that
   * line.
   *
   * @param noun what an item is, for the repeated-id message ("water source")
   */
  static IdItem idItem(Fields s, String listField, String noun, String hint,
      Map<String, Integer> seen) {
    String id = id(s, hint);
    if (id == null) {
      return new IdItem(s, null);
    }
    return new IdItem(s.namedById(id, listField, seen, first -> "'" + id + "' is already the id"
        + " of the " + noun + " on line " + first + "; give each " + noun + " its own id"), id);
  }

  static String id(Fields s, String hint) {
    String id = s.text("id", hint);
    if (id != null && !Ids.ID.matcher(id).matches()) {
      s.problem("id", s.quoted("id") + " is not a usable id; use " + Ids.RULE);
      return null;
    }
    return id;
  }
}
