package org.rimeward.crop;

import java.io.IOException;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.rimeward.io.BadInputException;
import org.rimeward.io.BundledData;
import org.rimeward.io.Problems;
import org.rimeward.io.TextFile;
import org.rimeward.io.Yaml.MapNode;

/**
 * How a profile edit reaches its crop file safely: the file is found in the writable profiles
 * folder, locked, read and checked; the edited text is read back and checked in full; the change
 * is journalled as pending, the file replaced atomically, and the change journalled as written.
 * {@link ProfileEditor} decides what text to write; this class decides nothing about it.
 */
final class CropFileEdits {
  private final Path dir;
  private final ProfileEditor.TextWriter writer;

  CropFileEdits(Path dir, ProfileEditor.TextWriter writer) {
    this.dir = dir;
    this.writer = writer;
  }

  /** A crop file as read under its lock: its bytes, text, YAML and the crop they give. */
  record Loaded(Path path, String file, byte[] bytes, String text, MapNode root, Crop crop) {}

  /**
   * Runs {@code edit} on the crop file holding its lock: the file is read, edited and replaced
   * by one program at a time, so two edits at once both land.
   */
  @SuppressWarnings("try") // the lock is held for the block's duration, not read
  <T> T locked(String crop, Function<Loaded, T> edit) {
    Path path = cropFile(crop);
    Path real;
    try {
      real = CropFileWriter.target(path);
    } catch (IOException e) {
      throw new BadInputException(path + ": cannot be followed to its file (" + e.getMessage()
          + ")", e);
    }
    try (CropFileLock lock = CropFileLock.acquire(real)) {
      return edit.apply(load(crop, path));
    }
  }

  private Path cropFile(String crop) {
    if (BundledData.isReadOnly(dir)) {
      throw new BadInputException("the crop profiles in use (" + dir + ") are the copy packed inside"
          + " the rimeward jar, which cannot be changed. Copy the crop-profiles folder somewhere"
          + " you can write and pass it with --crop-profiles DIR");
    }
    Path path = dir.resolve(crop + CropLibrary.EXTENSION);
    if (!CropFields.ID.matcher(crop).matches() || !Files.isRegularFile(path)) {
      throw new BadInputException("unknown crop '" + crop + "' in " + dir + "; known crops: "
          + knownCrops());
    }
    if (!Files.isWritable(path)) {
      throw new BadInputException(path + ": permission denied: the file cannot be written; check"
          + " its permissions or pass a folder you can write with --crop-profiles DIR");
    }
    return path;
  }

  private Loaded load(String crop, Path path) {
    TextFile file = TextFile.read(path, TextFile.MAX_DOCUMENT_BYTES, "crop file",
        "check --crop-profiles");
    byte[] bytes = file.bytes();
    String text = file.text();
    Problems problems = new Problems(path.toString());
    Crop c = CropFileReader.read(text, crop, problems);
    if (c == null) {
      throw new BadInputException("fix these problems in " + path + " before editing it"
          + " (rimeward profile check lists them):" + System.lineSeparator()
          + String.join(System.lineSeparator(), problems.all()));
    }
    return new Loaded(path, path.toString(), bytes, text,
        CropFileReader.parse(text, path.toString()), c);
  }

  private String knownCrops() {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).filter(n -> n.endsWith(CropLibrary.EXTENSION))
          .map(n -> n.substring(0, n.length() - CropLibrary.EXTENSION.length())).sorted()
          .collect(Collectors.joining(", "));
    } catch (IOException e) {
      return "(the folder cannot be listed)";
    }
  }

  /** The crop the edited text gives, checked in full; nothing is written when it has problems. */
  Crop check(Loaded f, String edited) {
    Problems problems = new Problems(f.file());
    Crop c;
    try {
      c = CropFileReader.read(edited, f.crop().id(), problems);
    } catch (BadInputException e) {
      throw new BadInputException("the change was not written: " + e.getMessage(), e);
    }
    if (c == null) {
      throw new BadInputException("the change was not written, because the file would then have"
          + " these problems:" + System.lineSeparator()
          + String.join(System.lineSeparator(), problems.all()));
    }
    return c;
  }

  /**
   * Records the change as pending, replaces the file, then records it as written. The file is not
   * touched unless the journal took the pending record.
   */
  void commit(Loaded f, String edited, List<ProfileEdit> edits, EditJournal journal) {
    Path real;
    try {
      real = CropFileWriter.target(f.path());
    } catch (IOException e) {
      throw new BadInputException(f.file() + ": cannot be followed to its file (" + e.getMessage()
          + "); the file is unchanged", e);
    }
    PendingChange change = new PendingChange(real, PendingChange.sha256(f.bytes()),
        PendingChange.sha256(edited), edits);
    journal.beforeWrite(change);
    try {
      writer.write(f.path(), edited);
    } catch (AccessDeniedException e) {
      notWritten(journal, change, "permission denied");
      throw new BadInputException(f.file() + ": permission denied (" + e.getMessage() + "); the file"
          + " is unchanged", e);
    } catch (IOException e) {
      notWritten(journal, change, e.getMessage());
      throw new BadInputException(f.file() + ": the change could not be written (" + e.getMessage()
          + "); the file is unchanged", e);
    }
    journal.afterWrite(change);
  }

  /** Tells the journal the write failed; the write's own error is what the user must see. */
  private static void notWritten(EditJournal journal, PendingChange change, String why) {
    try {
      journal.notWritten(change, why);
    } catch (RuntimeException e) {
      // The pending change stays unsettled; the next command finds the old file and settles it.
    }
  }
}
