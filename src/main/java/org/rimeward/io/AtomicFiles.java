package org.rimeward.io;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Replaces a file's content so that a reader, or a crash, sees either the old file or the new one,
 * never half of either: the text goes to a temporary file in the same folder, is forced to disk,
 * and is then renamed over the old one.
 */
public final class AtomicFiles {
  private AtomicFiles() {}

  public static void writeString(Path target, String content) throws IOException {
    write(target, content.getBytes(StandardCharsets.UTF_8));
  }

  public static void write(Path target, byte[] content) throws IOException {
    Path dir = target.toAbsolutePath().getParent();
    Path tmp = Files.createTempFile(dir, "." + target.getFileName() + ".", ".tmp");
    try {
      try (var ch = java.nio.channels.FileChannel.open(tmp,
          java.nio.file.StandardOpenOption.WRITE, java.nio.file.StandardOpenOption.TRUNCATE_EXISTING)) {
        java.nio.ByteBuffer buf = java.nio.ByteBuffer.wrap(content);
        while (buf.hasRemaining()) {
          ch.write(buf);
        }
        ch.force(true);
      }
      try {
        Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
      }
    } finally {
      Files.deleteIfExists(tmp);
    }
  }
}
