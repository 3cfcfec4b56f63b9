package org.rimeward.crop;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFileAttributes;
import java.nio.file.attribute.PosixFilePermissions;

/**
 * Replaces a crop file's content the way a person who shares the file expects: atomically (a
 * reader or a crash sees the old file or the new one), with the old file's permissions, and its
 * owner and group where this program may set them, through a symbolic link to the file it points
 * at (the link stays a link), and with the folder forced to disk after the rename so the new name
 * survives a power cut.
 */
public final class CropFileWriter {
  private CropFileWriter() {}

  /** Where an edit of {@code path} really lands: the file a symbolic link points at. */
  public static Path target(Path path) throws IOException {
    return path.toRealPath();
  }

  public static void replace(Path path, String content) throws IOException {
    Path real = target(path);
    Path dir = real.getParent();
    PosixFileAttributes attrs = posix(real);
    Path tmp;
    try {
      tmp = Files.createTempFile(dir, "." + real.getFileName() + ".", ".tmp");
    } catch (AccessDeniedException e) {
      throw new AccessDeniedException(dir.toString(), null, "permission denied: cannot create a"
          + " file in the folder of " + real);
    }
    try {
      try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE,
          StandardOpenOption.TRUNCATE_EXISTING)) {
        ByteBuffer buf = ByteBuffer.wrap(content.getBytes(StandardCharsets.UTF_8));
        while (buf.hasRemaining()) {
          ch.write(buf);
        }
        ch.force(true);
      }
      if (attrs != null) {
        keepOwnershipAndMode(tmp, attrs);
      }
      try {
        Files.move(tmp, real, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(tmp, real, StandardCopyOption.REPLACE_EXISTING);
      }
    } finally {
      Files.deleteIfExists(tmp);
    }
    forceFolder(dir);
  }

  private static PosixFileAttributes posix(Path real) throws IOException {
    PosixFileAttributeView v = Files.getFileAttributeView(real, PosixFileAttributeView.class);
    return v == null ? null : v.readAttributes();
  }

  private static void keepOwnershipAndMode(Path tmp, PosixFileAttributes attrs) throws IOException {
    PosixFileAttributeView v = Files.getFileAttributeView(tmp, PosixFileAttributeView.class);
    try {
      v.setGroup(attrs.group());
    } catch (IOException e) {
      // Only members of the group (or the superuser) may hand a file to it; the mode still holds.
    }
    try {
      v.setOwner(attrs.owner());
    } catch (IOException e) {
      // Only the superuser may give a file away; an edit by the owner keeps the owner anyway.
    }
    v.setPermissions(attrs.permissions());
    if (!v.readAttributes().permissions().equals(attrs.permissions())) {
      throw new IOException("cannot give the new file the mode "
          + PosixFilePermissions.toString(attrs.permissions()) + " of the old one");
    }
  }

  /** Forces the folder's entries to disk; some systems cannot open a folder, and need not. */
  private static void forceFolder(Path dir) {
    try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
      ch.force(true);
    } catch (IOException e) {
      // Not every file system lets a folder be opened or forced; the rename itself is atomic.
    }
  }
}
