package org.rimeward.rules.facts;

/** Why over-plant sprinkling is not advised on a block tonight. */
public enum NotAdvisedReason {
  /** A wind-borne freeze: wind above the windy limit while the air is below freezing. */
  WIND,
  /** The installed rate is below what the coldest, windiest hour of the run needs. */
  RATE_SHORT,
  /** The water balance cannot give the need at some hour of the run. */
  NEED_UNKNOWN
}
