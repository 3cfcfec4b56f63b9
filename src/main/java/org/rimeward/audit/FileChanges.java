package org.rimeward.audit;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.rimeward.audit.Schema.Table;
import org.rimeward.crop.CropFileLock;
import org.rimeward.crop.PendingChange;
import org.rimeward.crop.ProfileEdit;

/**
 * Crop-file changes in the trail, recorded before they are written.
 *
 * <p>The invariant: a crop file never holds an edit made by rimeward that the trail has not
 * recorded. An edit's rows and a {@code pending} change naming the new file's SHA-256 are
 * committed together before the file is replaced; a {@code written} row follows the rename. A
 * program killed between the two leaves a pending change without an outcome, which the next
 * command that opens the trail for writing settles under the file's lock: {@code found-written}
 * when the file holds the new content, {@code found-not-written} when it still holds the old, and
 * {@code found-changed} (reported) when it holds neither.
 */
final class FileChanges {
  /** What became of a pending change. */
  enum State {
    PENDING("pending"), WRITTEN("written"), NOT_WRITTEN("not-written"),
    FOUND_WRITTEN("found-written"), FOUND_NOT_WRITTEN("found-not-written"),
    FOUND_CHANGED("found-changed");

    final String word;

    State(String word) {
      this.word = word;
    }
  }

  /** A pending change that no later row settles. */
  record Unsettled(long seq, String at, Path file, String sha256Before, String sha256After,
      long editCount) {}

  private final Connection conn;
  private final Clock clock;

  FileChanges(Connection conn, Clock clock) {
    this.conn = conn;
    this.clock = clock;
  }

  /** Appends the edits and their pending change; returns the pending row's sequence number. */
  long recordPending(PendingChange change) throws SQLException {
    try (ChainWriter w = new ChainWriter(conn)) {
      for (ProfileEdit edit : change.edits()) {
        w.append(Table.PROFILE_EDITS, AuditStore.STORED_INSTANT.format(edit.at()), edit.by(),
            edit.file(), edit.crop(), edit.variety(), edit.stage(), edit.field(), edit.beforeC(),
            edit.afterC(), edit.note());
      }
      w.append(Table.FILE_CHANGES, now(), change.file().toString(), State.PENDING.word, null,
          change.sha256Before(), change.sha256After(), (long) change.edits().size(), null);
      return w.head().seq();
    }
  }

  void recordOutcome(Unsettled p, State state, String detail) throws SQLException {
    try (ChainWriter w = new ChainWriter(conn)) {
      w.append(Table.FILE_CHANGES, now(), p.file().toString(), state.word, p.seq(),
          p.sha256Before(), p.sha256After(), p.editCount(), detail);
    }
  }

  List<Unsettled> unsettled() throws SQLException {
    List<Unsettled> out = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.FILE_CHANGES, "t.state = 'pending' AND NOT"
        + " EXISTS (SELECT 1 FROM file_changes o WHERE o.settles_seq = t.seq) ORDER BY t.seq")) {
      out.add(of(r));
    }
    return out;
  }

  Optional<Unsettled> pendingAt(long seq) throws SQLException {
    return StoredRow.select(conn, Table.FILE_CHANGES, "t.seq = ? AND t.state = 'pending'", seq)
        .stream().findFirst().map(FileChanges::of);
  }

  /** Whether a later row already settles the pending change at {@code seq}. */
  boolean settled(long seq) throws SQLException {
    return !StoredRow.select(conn, Table.FILE_CHANGES, "t.settles_seq = ?", seq).isEmpty();
  }

  /** Every change row, oldest first: for showing what became of each edit. */
  List<StoredRow> all() throws SQLException {
    return StoredRow.select(conn, Table.FILE_CHANGES, "1 = 1 ORDER BY t.seq");
  }

  private static Unsettled of(StoredRow r) {
    return new Unsettled(r.seq(), r.text("at"), Path.of(r.text("file")), r.text("sha256_before"),
        r.text("sha256_after"), r.integer("edit_count"));
  }

  /**
   * What the file says about a pending change, read while its lock is held: the outcome and a
   * line for the user, or empty when the file's lock is held (an edit still running).
   */
  @SuppressWarnings("try") // the lock is held for the block's duration, not read
  static Optional<Outcome> inspect(Unsettled p) {
    Optional<CropFileLock> lock = CropFileLock.tryAcquire(p.file());
    if (lock.isEmpty()) {
      return Optional.empty();
    }
    try (CropFileLock held = lock.get()) {
      String now;
      try {
        now = PendingChange.sha256(Files.readAllBytes(p.file()));
      } catch (NoSuchFileException e) {
        return Optional.of(new Outcome(State.FOUND_CHANGED, "the file is missing"));
      } catch (IOException e) {
        return Optional.of(new Outcome(State.FOUND_CHANGED, "the file cannot be read: "
            + e.getMessage()));
      }
      if (now.equals(p.sha256After())) {
        return Optional.of(new Outcome(State.FOUND_WRITTEN, "the edit is in the file; the command"
            + " that made it stopped before confirming it"));
      }
      if (now.equals(p.sha256Before())) {
        return Optional.of(new Outcome(State.FOUND_NOT_WRITTEN, "the command stopped before"
            + " writing the file; the edit is not in it"));
      }
      return Optional.of(new Outcome(State.FOUND_CHANGED, "the file holds neither the content"
          + " before the edit nor after it: it was changed since by something else"));
    }
  }

  record Outcome(State state, String detail) {}

  private String now() {
    return AuditStore.STORED_INSTANT.format(clock.instant());
  }
}
