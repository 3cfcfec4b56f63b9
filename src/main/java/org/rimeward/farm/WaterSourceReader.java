package org.rimeward.farm;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import org.rimeward.io.Fields;
import org.rimeward.io.Yaml.SeqNode;
import org.rimeward.units.Dimension;

/** Reads farm.yaml's {@code water_sources}: each source's id, most flow and usable volume. */
final class WaterSourceReader {
  private WaterSourceReader() {}

  /**
   * The sources read without problems; the others' problems go to the file's problems. Every id
   * written, usable or not, is added to {@code declared}.
   */
  static List<WaterSource> read(Fields top, Set<String> declared) {
    List<WaterSource> out = new ArrayList<>();
    SeqNode list = top.list("water_sources");
    if (list == null) {
      return out;
    }
    Map<String, Integer> lines = new HashMap<>();
    for (int i = 0; i < list.items().size(); i++) {
      Fields s = Fields.of(list.items().get(i), "water_sources item " + (i + 1),
          "id, max_flow and volume", top.problems());
      if (s == null) {
        continue;
      }
      int before = s.problems().size();
      FarmLoader.IdItem item = FarmLoader.idItem(s, "water_sources", "water source",
          "a short name blocks refer to, e.g. id: pond", lines);
      String id = item.id();
      s = item.fields();
      if (id != null) {
        declared.add(id);
      }
      s.allow("id", "max_flow", "volume");
      Double flow = s.value("max_flow", FarmLoader.quantity(s, "max_flow", Dimension.FLOW),
          "the most the source delivers, e.g. max_flow: 450 m3/h or 2000 gpm");
      FarmLoader.positiveUpTo(s, "max_flow", flow, "give the most the source can deliver, e.g."
          + " 450 m3/h or 2000 gpm", WaterSource.MAX_FLOW_M3_H, "m3/h", "more than a large river"
              + " pumping station delivers; check the number and its unit (gpm, L/s or m3/h)");
      OptionalDouble volume = OptionalDouble.empty();
      if (s.has("volume")) {
        Double m3 = s.optionalValue("volume", FarmLoader.quantity(s, "volume", Dimension.VOLUME));
        if (FarmLoader.positiveUpTo(s, "volume", m3, "give the usable volume, e.g. 9000 m3 or"
            + " 7.3 acre-ft, or leave volume out for a well with no volume limit",
            WaterSource.MAX_VOLUME_M3, "m3", "the size of a large irrigation reservoir; check the"
                + " number and its unit (m3, ML, acre-ft or gal)")) {
          volume = OptionalDouble.of(m3);
        }
      }
      if (s.problems().size() == before) {
        out.add(new WaterSource(id, flow, volume));
      }
    }
    return out;
  }
}
