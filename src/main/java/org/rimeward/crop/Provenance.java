package org.rimeward.crop;

/** Where a stage's effective values came from, strongest last. */
public enum Provenance {
  /** The crop's published table, unchanged. */
  BASE,
  /** The table shifted by the variety's hardiness offset. */
  OFFSET,
  /** At least one value is the variety's own override. */
  OVERRIDE
}
