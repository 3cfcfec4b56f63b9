package org.rimeward.rules.facts;

/** Wind over the sub-zero hours of a sprinkling run, in the bands extension guidance uses. */
public enum WindLevel {
  /** Sustained wind that raises the water sprinkling needs. */
  BREEZY,
  /** Wind in which over-plant sprinkling alone is unsafe and covers are hard to put on. */
  WINDY
}
