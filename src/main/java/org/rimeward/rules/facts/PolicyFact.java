package org.rimeward.rules.facts;

import java.util.Objects;

/**
 * The farm's protection policy as the rules see it.
 *
 * @param fixedTargetC the fixed target temperature; NaN when the basis is {@link TargetBasis#T10}
 * @param startMarginC how far above the target sprinkling starts (a temperature difference)
 */
public record PolicyFact(TargetBasis targetBasis, double fixedTargetC, double startMarginC,
    StopBasis stopBasis) {
  public PolicyFact {
    Objects.requireNonNull(targetBasis, "targetBasis");
    Objects.requireNonNull(stopBasis, "stopBasis");
    if (targetBasis == TargetBasis.FIXED && !Double.isFinite(fixedTargetC)) {
      throw new IllegalArgumentException("a fixed target needs a temperature");
    }
    if (!(startMarginC >= 0 && startMarginC <= 5)) {
      throw new IllegalArgumentException("start margin must be 0 to 5 °C, was " + startMarginC);
    }
  }
}
