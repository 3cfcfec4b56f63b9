package org.rimeward.farm;

import java.util.Objects;

/**
 * Where a value was written: a file and a 1-based line, so that a later check (for example an
 * unknown crop stage found by the planner) can point the grower at the line to fix.
 */
public record SourceRef(String file, int line) {
  public SourceRef {
    Objects.requireNonNull(file, "file");
    if (line < 0) {
      throw new IllegalArgumentException("line must be 0 (unknown) or above, was " + line);
    }
  }

  /** A value built in code rather than read from a file. */
  public static SourceRef unknown() {
    return new SourceRef("(not from a file)", 0);
  }

  /** {@code file:line}, the prefix of every message about this value. */
  @Override
  public String toString() {
    return line > 0 ? file + ":" + line : file;
  }
}
