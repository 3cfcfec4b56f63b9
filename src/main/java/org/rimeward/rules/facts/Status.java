package org.rimeward.rules.facts;

/** What the plan can do for a block tonight. */
public enum Status {
  NOT_NEEDED,
  PROTECTED,
  /** Sprinkled over part of its area: the rest stays dry. */
  PARTLY_PROTECTED,
  SHORT_OF_WATER,
  UNPROTECTED
}
