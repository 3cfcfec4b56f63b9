package org.rimeward.rules.facts;

/** What the plan can do for a block tonight. */
public enum Status {
  NOT_NEEDED,
  /** No protection needed by the forecast, but the coldest bud comes within the watch band. */
  WATCH,
  PROTECTED,
  /** Sprinkled over part of its area: the rest stays dry. */
  PARTLY_PROTECTED,
  SHORT_OF_WATER,
  /** The block has sprinklers, but sprinkling them tonight is not advised (wind or rate). */
  NOT_ADVISED,
  UNPROTECTED
}
