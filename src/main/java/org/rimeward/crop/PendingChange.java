package org.rimeward.crop;

import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Objects;

/**
 * A change to one crop file, known in full before the file is touched: the file it lands in (the
 * target of a symbolic link), the SHA-256 of its content before and after, and the edits it makes.
 * The trail records it as pending before the rename, so the file never holds an edit the trail
 * has not seen.
 */
public record PendingChange(Path file, String sha256Before, String sha256After,
    List<ProfileEdit> edits) {
  public PendingChange {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(sha256Before, "sha256Before");
    Objects.requireNonNull(sha256After, "sha256After");
    edits = List.copyOf(edits);
  }

  /** The SHA-256 of {@code bytes}, in lower-case hex. */
  public static String sha256(byte[] bytes) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required of every Java runtime", e);
    }
  }

  static String sha256(String text) {
    return sha256(text.getBytes(StandardCharsets.UTF_8));
  }
}
