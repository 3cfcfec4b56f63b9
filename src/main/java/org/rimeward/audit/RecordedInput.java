package org.rimeward.audit;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.Objects;

/**
 * One file a run read, kept whole so the run can be replayed from the trail alone.
 *
 * @param name the path relative to the farm folder (or rules/profile folder), with '/' separators
 * @param sha256 lower-case hex SHA-256 of {@code content}; checked against it here
 * @param content the exact bytes read; copied in and out so the record stays immutable
 */
public record RecordedInput(InputKind kind, String name, String sha256, byte[] content) {
  public RecordedInput {
    Objects.requireNonNull(kind, "kind");
    if (name == null || name.isBlank()) {
      throw new IllegalArgumentException("a recorded input needs a name (its relative path)");
    }
    Objects.requireNonNull(content, "content of input " + name);
    Objects.requireNonNull(sha256, "sha256 of input " + name);
    content = content.clone();
    String actual = sha256Hex(content);
    if (!actual.equals(sha256)) {
      throw new IllegalArgumentException("input " + name + ": sha256 " + sha256
          + " does not match its content (" + actual + ")");
    }
  }

  /** The record for {@code content}, its hash computed here. */
  public static RecordedInput of(InputKind kind, String name, byte[] content) {
    return new RecordedInput(kind, name, sha256Hex(content), content);
  }

  /** The record for a text input, stored as UTF-8. */
  public static RecordedInput ofText(InputKind kind, String name, String text) {
    return of(kind, name, text.getBytes(StandardCharsets.UTF_8));
  }

  @Override
  public byte[] content() {
    return content.clone();
  }

  /** The content decoded as UTF-8, for text inputs (YAML, CSV, DRL). */
  public String text() {
    return new String(content, StandardCharsets.UTF_8);
  }

  public int sizeBytes() {
    return content.length;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof RecordedInput r && kind == r.kind && name.equals(r.name)
        && sha256.equals(r.sha256) && Arrays.equals(content, r.content);
  }

  @Override
  public int hashCode() {
    return Objects.hash(kind, name, sha256);
  }

  @Override
  public String toString() {
    return "RecordedInput[" + kind + " " + name + " sha256=" + sha256 + " " + content.length + " bytes]";
  }

  static String sha256Hex(byte[] bytes) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required of every Java runtime", e);
    }
  }
}
