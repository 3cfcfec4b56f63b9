package org.rimeward.rules.facts;

/** How much tonight threatens a block's buds without protection. */
public enum RiskLevel {
  /** The coldest bud stays more than the watch band above the target. */
  NONE,
  /** The coldest bud comes within the watch band of the target. */
  WATCH,
  /** The coldest bud reaches the 10 % kill temperature. */
  DAMAGE,
  /** The coldest bud reaches the 90 % kill temperature. */
  SEVERE
}
