package org.rimeward.rules.facts;

import java.util.List;
import org.rimeward.water.IrrigationSet;

/** A block's irrigation sets, as farm.yaml declares them: the parts it can sprinkle alone. */
public record BlockSets(String blockId, List<IrrigationSet> sets) {
  public BlockSets {
    sets = List.copyOf(sets);
  }
}
