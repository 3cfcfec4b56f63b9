package org.rimeward.farm;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.rimeward.io.Fields;
import org.rimeward.io.Text;
import org.rimeward.io.Yaml.Node;
import org.rimeward.io.Yaml.Scalar;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.units.Dimension;

/**
 * Reads farm.yaml's {@code stations}: each thermometer's id, its height above the ground, the
 * height of the buds it stands for, the blocks it is listed for, and which one is the farm's
 * default. Checked against the blocks: a block named must exist and have one station only; only
 * one station may be the default; with several stations and no default, every block must be
 * listed. A single station is the default whether or not it says so.
 */
final class StationReader {
  private StationReader() {}

  /**
   * The stations read without problems; the others' problems go to the file's problems.
   * {@code blockIds} are the ids of every block written, usable or not, with their lines.
   */
  static List<Station> read(Fields top, Map<String, Integer> blockIds) {
    List<Station> out = new ArrayList<>();
    if (!top.has("stations")) {
      return out;
    }
    SeqNode list = top.list("stations");
    if (list == null) {
      return out;
    }
    if (list.items().isEmpty()) {
      top.problem("stations", "the list is empty; list each thermometer with id, height and"
          + " blocks, or leave the section out");
      return out;
    }
    int before = top.problems().size();
    Map<String, Integer> stationLines = new HashMap<>();
    Map<String, String> stationOfBlock = new HashMap<>();
    Map<String, Integer> defaults = new LinkedHashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Fields s = Fields.of(list.items().get(i), "stations item " + (i + 1),
          "id, height and blocks", top.problems());
      if (s == null) {
        continue;
      }
      int problemsBefore = s.problems().size();
      FarmLoader.IdItem item = FarmLoader.idItem(s, "stations", "station", "the station's id as"
          + " the readings file's 'station' column writes it, e.g. id: hollow", stationLines);
      String id = item.id();
      s = item.fields();
      s.allow("id", "height", "bud_height", "blocks", "default");
      Double heightM = height(s, "height", true, "the height of the thermometer above the ground,"
          + " e.g. height: 1.5 m or 5 ft");
      Double budM = height(s, "bud_height", false, "the height of the lowest buds of its blocks,"
          + " e.g. bud_height: 0.8 m");
      Boolean isDefault = s.has("default") ? s.optionalValue("default", StationReader::yesNo) : false;
      List<String> blocks = blocks(s, id, blockIds, stationOfBlock);
      if (Boolean.TRUE.equals(isDefault) && id != null) {
        defaults.put(id, s.lineOf("default"));
      }
      if (s.problems().size() == problemsBefore && id != null) {
        out.add(new Station(id, heightM, budM == null ? OptionalDouble.empty()
            : OptionalDouble.of(budM), blocks, Boolean.TRUE.equals(isDefault),
            new SourceRef(top.problems().label(), s.line())));
      }
    }
    if (defaults.size() > 1) {
      List<String> ids = new ArrayList<>(defaults.keySet());
      top.problems().add(defaults.get(ids.get(1)), "stations[" + ids.get(1) + "].default: station '"
          + ids.get(0) + "' (line " + defaults.get(ids.get(0)) + ") is already the default; mark"
          + " one station default: true");
    }
    if (top.problems().size() > before) {
      return out;
    }
    boolean oneStation = out.size() == 1;
    if (defaults.isEmpty() && !oneStation) {
      List<String> without = blockIds.keySet().stream().filter(b -> !stationOfBlock.containsKey(b))
          .toList();
      if (!without.isEmpty()) {
        top.problem("stations", "block" + (without.size() == 1 ? " " : "s ")
            + String.join(", ", without) + (without.size() == 1 ? " has" : " have") + " no station;"
            + " list " + (without.size() == 1 ? "it" : "them") + " under a station's blocks, or mark"
            + " one station default: true to stand for the blocks no station lists");
      }
      for (Station st : out) {
        if (st.blockIds().isEmpty()) {
          top.problems().add(st.origin().line(), "stations[" + st.id() + "]: stands for no block;"
              + " list its blocks, or mark it default: true");
        }
      }
    }
    if (oneStation && !out.get(0).isDefault()) {
      // The only thermometer stands for every block.
      Station st = out.get(0);
      out.set(0, new Station(st.id(), st.heightM(), st.budHeightM(), st.blockIds(), true, st.origin()));
    }
    return out;
  }

  private static Double height(Fields s, String key, boolean required, String hint) {
    Double m = required ? s.value(key, FarmLoader.quantity(s, key, Dimension.LENGTH), hint)
        : s.optionalValue(key, FarmLoader.quantity(s, key, Dimension.LENGTH));
    if (m != null && !(m > 0 && m <= Station.MAX_HEIGHT_M)) {
      s.problem(key, String.format(Locale.ROOT, "%s (%.2f m) is outside 0 to %.0f m; give %s",
          s.quoted(key), m, Station.MAX_HEIGHT_M, hint));
      return null;
    }
    return m;
  }

  private static Boolean yesNo(String text) {
    return switch (text.toLowerCase(Locale.ROOT)) {
      case "true", "yes" -> true;
      case "false", "no" -> false;
      default -> throw new IllegalArgumentException(Text.quote(text) + " is not true or false;"
          + " write default: true for the station that stands for the blocks no station lists");
    };
  }

  private static List<String> blocks(Fields s, String id, Map<String, Integer> blockIds,
      Map<String, String> stationOfBlock) {
    List<String> out = new ArrayList<>();
    if (!s.has("blocks")) {
      return out;
    }
    SeqNode list = s.list("blocks");
    if (list == null) {
      return out;
    }
    for (Node n : list.items()) {
      String block = n instanceof Scalar sc ? sc.value() : null;
      if (block == null) {
        s.problems().add(n.line(), s.field("blocks") + ": expected a block id, found "
            + Fields.describe(n) + "; write the ids, e.g. blocks: [hollow-cherry, creek-rome]");
        continue;
      }
      if (!blockIds.containsKey(block)) {
        s.problems().add(n.line(), s.field("blocks") + ": " + Text.quote(block) + " is not a block"
            + " of this farm; blocks: " + String.join(", ", blockIds.keySet()));
        continue;
      }
      String other = stationOfBlock.putIfAbsent(block, id == null ? "?" : id);
      if (other != null) {
        s.problems().add(n.line(), s.field("blocks") + ": '" + block + "' is already listed under"
            + (other.equals(id) ? " this station" : " station '" + other + "'") + "; a block"
            + " has one station, the thermometer that reads its air");
        continue;
      }
      out.add(block);
    }
    return out;
  }
}
