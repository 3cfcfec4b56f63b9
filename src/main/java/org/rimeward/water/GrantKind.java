package org.rimeward.water;

/** How much of its call a block gets. */
public enum GrantKind {
  /** The installed rate over the whole block. */
  FULL,
  /** A lower flow over the whole block, still at or above its need plus the margin. */
  REDUCED_RATE,
  /** Whole irrigation sets at the installed rate; the other sets stay dry. */
  SETS,
  /** A share of the area at the installed rate; the rest stays dry. */
  PART_AREA,
  /** Nothing: the block's sprinklers stay off. */
  NONE
}
