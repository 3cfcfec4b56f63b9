package org.rimeward.rules.facts;

/** Wind while the air is below freezing, in the bands extension guidance uses. */
public enum WindLevel {
  CALM,
  /** Sustained wind that raises the water sprinkling needs. */
  BREEZY,
  /** Wind in which over-plant sprinkling alone is unsafe and covers are hard to put on. */
  WINDY
}
