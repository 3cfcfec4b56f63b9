package org.rimeward.plan;

import java.time.Instant;
import java.util.List;
import java.util.OptionalDouble;

/**
 * What tonight asks of a block's sprinklers, shown for every block that has them so that a
 * sprinkled block never goes quiet.
 *
 * @param requiredRateMmH the largest need over the hours sprinkling would run; empty when it
 *     would not run tonight, or when the water balance cannot give the need at one of those hours
 * @param advised whether sprinkling is advised; empty when it would not run tonight
 * @param notAdvised the reasons it is not advised; empty when advised
 */
public record Sprinkling(double installedRateMmH, OptionalDouble requiredRateMmH,
    java.util.Optional<Boolean> advised, List<Reason> notAdvised) {
  public Sprinkling {
    notAdvised = List.copyOf(notAdvised);
  }

  /**
   * Why sprinkling is not advised, with the hour it holds at and that hour's wind.
   *
   * @param word {@code wind}, {@code rate-short} or {@code need-unknown}
   */
  public record Reason(String word, Instant at, double wind10mMs, double wind2mMs) {}
}
