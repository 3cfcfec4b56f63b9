package org.rimeward.water;

import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * How a source's water is shared out tonight.
 *
 * @param wantedPeakFlowM3H the largest total draw if every block ran at its installed rate
 * @param wantedVolumeM3 the total water if every block ran at its installed rate
 * @param rankedByValue blocks were ranked by crop value saved per m³; false when some block had no
 *     crop value and they were ranked by hectares of buds saved per m³ instead
 * @param grants every block, best ranked first, with what it gets
 * @param draws the source's total draw, piece by piece through the night, in time order; pieces
 *     with no draw are left out
 */
public record Allocation(double wantedPeakFlowM3H, double wantedVolumeM3, boolean rankedByValue,
    List<Grant> grants, List<Draw> draws) {
  public Allocation {
    grants = List.copyOf(grants);
    draws = List.copyOf(draws);
  }

  /** The source draws {@code flowM3H} from {@code from} to {@code to}. */
  public record Draw(Instant from, Instant to, double flowM3H) {}

  /** The largest total draw the plan runs. */
  public double peakFlowM3H() {
    return draws.stream().mapToDouble(Draw::flowM3H).max().orElse(0);
  }

  /** The water the plan uses. */
  public double volumeM3() {
    return grants.stream().mapToDouble(Grant::volumeM3).sum();
  }

  public Optional<Grant> grant(String blockId) {
    return grants.stream().filter(g -> g.blockId().equals(blockId)).findFirst();
  }

  /** Blocks protected whole, at the installed or a reduced rate, sorted. */
  public List<String> served() {
    return ids(GrantKind.FULL, GrantKind.REDUCED_RATE);
  }

  /** Blocks protected in part, sorted. */
  public List<String> part() {
    return ids(GrantKind.SETS, GrantKind.PART_AREA);
  }

  /** Blocks that get no water, sorted. */
  public List<String> dropped() {
    return ids(GrantKind.NONE);
  }

  private List<String> ids(GrantKind... kinds) {
    List<GrantKind> k = List.of(kinds);
    return grants.stream().filter(g -> k.contains(g.kind())).map(Grant::blockId).sorted().toList();
  }
}
