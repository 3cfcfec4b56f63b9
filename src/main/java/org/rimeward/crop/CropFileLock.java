package org.rimeward.crop;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.file.AccessDeniedException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Duration;
import java.util.Optional;
import org.rimeward.io.BadInputException;

/**
 * An exclusive lock on one crop file, held by one program at a time across read, edit and rename.
 * It is an operating-system lock on a small file beside the crop file ({@code .apple.yaml.lock}),
 * so it is released when the holder ends, even when it is killed. Two edits of the same file, from
 * two programs, then run one after the other and neither loses the other's change.
 */
public final class CropFileLock implements AutoCloseable {
  /** How long an edit waits for another edit of the same file. */
  public static final Duration WAIT = Duration.ofSeconds(30);

  private final FileChannel channel;
  private final FileLock lock;

  private CropFileLock(FileChannel channel, FileLock lock) {
    this.channel = channel;
    this.lock = lock;
  }

  /** The lock file of a crop file (already resolved to its real path). */
  public static Path lockFileOf(Path cropFile) {
    return cropFile.resolveSibling("." + cropFile.getFileName() + ".lock");
  }

  /**
   * Waits up to {@link #WAIT} for the lock.
   *
   * @throws BadInputException when the folder cannot be written or another edit holds the lock
   */
  public static CropFileLock acquire(Path cropFile) {
    long deadline = System.nanoTime() + WAIT.toNanos();
    while (true) {
      Optional<CropFileLock> l = tryAcquire(cropFile);
      if (l.isPresent()) {
        return l.get();
      }
      if (System.nanoTime() > deadline) {
        throw new BadInputException(cropFile + ": another edit of this file has been running for"
            + " more than " + WAIT.toSeconds() + " s; let it finish, then run again");
      }
      try {
        Thread.sleep(20);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new BadInputException(cropFile + ": interrupted while waiting for another edit");
      }
    }
  }

  /** The lock when no other program holds it, else empty. */
  public static Optional<CropFileLock> tryAcquire(Path cropFile) {
    Path lockFile = lockFileOf(cropFile);
    FileChannel ch;
    try {
      ch = FileChannel.open(lockFile, StandardOpenOption.CREATE, StandardOpenOption.WRITE);
    } catch (AccessDeniedException e) {
      throw new BadInputException(lockFile.getParent() + ": permission denied: the folder of the"
          + " crop file cannot be written, so the file cannot be edited safely; make the folder"
          + " writable or copy the profiles to a folder you can write", e);
    } catch (IOException e) {
      throw new BadInputException(lockFile + ": cannot create the edit lock (" + e.getMessage()
          + "); check the folder", e);
    }
    try {
      FileLock l = ch.tryLock();
      if (l == null) {
        ch.close();
        return Optional.empty();
      }
      return Optional.of(new CropFileLock(ch, l));
    } catch (OverlappingFileLockException e) {
      // Held by this very program, on another thread: just as busy.
      closeQuietly(ch);
      return Optional.empty();
    } catch (IOException e) {
      closeQuietly(ch);
      throw new BadInputException(lockFile + ": cannot lock (" + e.getMessage() + ")", e);
    }
  }

  private static void closeQuietly(FileChannel ch) {
    try {
      ch.close();
    } catch (IOException e) {
      // Closing releases nothing we still need.
    }
  }

  @Override
  public void close() {
    try {
      lock.release();
    } catch (IOException e) {
      // Closing the channel below releases it too.
    }
    closeQuietly(channel);
  }
}
