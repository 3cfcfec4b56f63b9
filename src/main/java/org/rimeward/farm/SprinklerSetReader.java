package org.rimeward.farm;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rimeward.io.Fields;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.units.Dimension;

/** Reads a block's irrigation {@code sets}: parts switched as one, each with its area and flow. */
final class SprinklerSetReader {
  private SprinklerSetReader() {}

  /** The sets, or an empty list with the problems added to the file's problems. */
  static List<SprinklerSet> read(Fields parent, double rateMmH, double blockAreaHa) {
    SeqNode list = parent.list("sets");
    if (list == null) {
      return List.of();
    }
    if (list.items().isEmpty()) {
      parent.problem("sets", "the list is empty; give each set's id and area, or leave sets out");
      return List.of();
    }
    int before = parent.problems().size();
    List<SprinklerSet> out = new ArrayList<>();
    Map<String, Integer> lines = new HashMap<>();
    double total = 0;
    for (int i = 0; i < list.items().size(); i++) {
      Fields s = Fields.of(list.items().get(i), parent.field("sets") + " item " + (i + 1),
          "id, area and flow", parent.problems());
      if (s == null) {
        continue;
      }
      FarmLoader.IdItem item = FarmLoader.idItem(s, parent.field("sets"), "set",
          "a short name for the set, e.g. id: north-valve", lines);
      String id = item.id();
      s = item.fields();
      s.allow("id", "area", "flow");
      Double area = s.value("area", FarmLoader.quantity(s, "area", Dimension.AREA),
          "the area the set wets, e.g. area: 1.2 ha or 3 ac");
      if (area != null && !(area > 0)) {
        s.problem("area", s.quoted("area") + " must be above 0; give the area the set wets, e.g."
            + " 1.2 ha");
        continue;
      }
      // Without a measured flow, the set draws the block's rate over its area: 1 mm on 1 ha is 10 m³.
      Double flow = area == null ? null : rateMmH * area * 10.0;
      if (s.has("flow")) {
        flow = s.optionalValue("flow", FarmLoader.quantity(s, "flow", Dimension.FLOW));
        if (flow != null && !(flow > 0)) {
          s.problem("flow", s.quoted("flow") + " must be above 0; give what the set draws, e.g."
              + " 48 m3/h or 210 gpm, or leave flow out to take the block's rate over the set's"
              + " area");
          continue;
        }
      }
      if (id != null && area != null && flow != null) {
        total += area;
        out.add(new SprinklerSet(id, area, flow));
      }
    }
    if (total > blockAreaHa * 1.001) {
      parent.problem("sets", String.format(Locale.ROOT, "the sets cover %.2f ha, more than the"
          + " block's %.2f ha; check each set's area and the block's area", total, blockAreaHa));
    }
    return parent.problems().size() == before ? List.copyOf(out) : List.of();
  }
}
