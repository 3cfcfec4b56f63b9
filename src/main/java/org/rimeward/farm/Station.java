package org.rimeward.farm;

import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * A thermometer whose readings the night's re-plans and the watch use, as farm.yaml's
 * {@code stations:} declares it: its id (the readings CSV's {@code station} column), how high it
 * hangs, and the blocks it stands for. A station listed for a block hangs in that block: its
 * readings are the block's air, so a re-plan corrects that block's forecast with them directly.
 * The default station stands for every block no station lists; those blocks keep their
 * {@code cold_air_offset} against it.
 *
 * @param id the station's id, as the readings file's {@code station} column writes it
 * @param heightM height of the thermometer above the ground, m
 * @param budHeightM height of the lowest buds of the blocks it stands for, m, when given
 * @param blockIds the blocks it is listed for, in file order
 * @param isDefault whether it stands for the blocks no station lists
 * @param origin where it was written
 */
public record Station(String id, double heightM, OptionalDouble budHeightM, List<String> blockIds,
    boolean isDefault, SourceRef origin) {
  /**
   * Highest thermometer or bud height accepted, m: a thermometer that protects buds hangs among
   * them, from a strawberry's few centimetres to a tall tree's lowest scaffolds; 10 m is a
   * weather mast's top, above the night's inversion, and a slipped unit more likely than a
   * real height (a Rimeward choice).
   */
  public static final double MAX_HEIGHT_M = 10.0;

  public Station {
    Ids.check("station id", id);
    checkHeight(id, "height", heightM);
    Objects.requireNonNull(budHeightM, "budHeightM");
    budHeightM.ifPresent(h -> checkHeight(id, "bud height", h));
    blockIds = List.copyOf(blockIds);
    Objects.requireNonNull(origin, "origin");
  }

  private static void checkHeight(String id, String what, double m) {
    if (!(m > 0 && m <= MAX_HEIGHT_M)) {
      throw new IllegalArgumentException(String.format(Locale.ROOT,
          "station %s: %s %s m is outside 0 to %.0f m", id, what, m, MAX_HEIGHT_M));
    }
  }
}
