package org.rimeward.rules.facts;

/** When sprinkling may stop after sunrise. */
public enum StopBasis {
  /** Wet bulb at or above 0 °C (UF/IFAS Circular 348). */
  WET_BULB_ABOVE_FREEZING,
  /** Wet bulb at or above the target plus the start margin. */
  WET_BULB_ABOVE_TARGET
}
