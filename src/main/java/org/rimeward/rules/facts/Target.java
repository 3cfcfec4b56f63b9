package org.rimeward.rules.facts;

import java.util.Objects;

/** Derived: the bud temperature this block is protected to tonight, and what it rests on. */
public record Target(String blockId, double targetC, TargetBasis basis) {
  public Target {
    Objects.requireNonNull(basis, "basis");
  }
}
