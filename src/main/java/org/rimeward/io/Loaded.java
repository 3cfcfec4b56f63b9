package org.rimeward.io;

import java.util.Objects;

/**
 * What a loader made of a file, with the exact bytes it read: the audit trail keeps those bytes,
 * so the record shows what was planned even if the file is rewritten during the run.
 */
public record Loaded<T>(T value, byte[] content) {
  public Loaded {
    Objects.requireNonNull(value, "value");
    content = content.clone();
  }

  @Override
  public byte[] content() {
    return content.clone();
  }
}
