package org.rimeward.rules.facts;

import java.util.Objects;

/**
 * The farm's protection policy as the rules see it.
 *
 * @param fixedTargetC the fixed target temperature; NaN when the basis is {@link TargetBasis#T10}
 * @param startMarginC how far above the target the wet bud may fall before sprinkling starts (a
 *     temperature difference); NaN when the farm names none and the rules' default applies
 */
public record PolicyFact(TargetBasis targetBasis, double fixedTargetC, double startMarginC,
    StopBasis stopBasis) {
  public PolicyFact {
    Objects.requireNonNull(targetBasis, "targetBasis");
    Objects.requireNonNull(stopBasis, "stopBasis");
    if (targetBasis == TargetBasis.FIXED && !Double.isFinite(fixedTargetC)) {
      throw new IllegalArgumentException("a fixed target needs a temperature");
    }
    if (!Double.isNaN(startMarginC) && !(startMarginC >= 0 && startMarginC <= 5)) {
      throw new IllegalArgumentException("start margin must be 0 to 5 °C, was " + startMarginC);
    }
  }
}
