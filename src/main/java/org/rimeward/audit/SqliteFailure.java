package org.rimeward.audit;

import java.nio.file.Path;
import java.sql.SQLException;
import java.time.Duration;
import org.sqlite.SQLiteErrorCode;
import org.sqlite.SQLiteException;

/**
 * Turns a failing SQLite call into the one line a farm manager can act on: which file, what it
 * could not do, why, and what to do about it. SQLite's primary result codes are named here through
 * the driver's own {@link SQLiteErrorCode}, never as bare numbers.
 */
final class SqliteFailure {
  private SqliteFailure() {}

  /** The primary result code (the low byte of an extended one) of a failure. */
  static SQLiteErrorCode primaryCode(SQLException e) {
    int code = e instanceof SQLiteException se ? se.getResultCode().code : e.getErrorCode();
    return SQLiteErrorCode.getErrorCode(code & 0xff);
  }

  /**
   * @param doing what was being done, as in "cannot ...", such as "record run X"
   * @param writing whether something was being written (then the message says nothing was kept)
   */
  static AuditUnavailableException unavailable(Path file, String doing, SQLException e,
      boolean writing, Duration busyTimeout) {
    String cause;
    String todo;
    switch (primaryCode(e)) {
      case SQLITE_READONLY -> {
        cause = "it is read-only (the file or its folder cannot be written, or it was opened"
            + " read-only)";
        todo = "make the file and its folder writable (SQLite writes -wal and -shm files beside"
            + " it), or record to another file with --audit";
      }
      case SQLITE_BUSY, SQLITE_LOCKED -> {
        cause = "another program kept it locked for more than " + busyTimeout.toSeconds() + " s";
        todo = "wait for the other rimeward run (or the program holding the file) to finish, then"
            + " run again";
      }
      case SQLITE_FULL -> {
        cause = "the disk is full";
        todo = "free space on the disk that holds it, then run again";
      }
      case SQLITE_CANTOPEN -> {
        cause = "it cannot be opened (its folder is missing or not accessible)";
        todo = "check the folder given with --farm or the file given with --audit";
      }
      case SQLITE_PERM, SQLITE_IOERR, SQLITE_AUTH -> {
        cause = "the system refused or failed the access (" + e.getMessage() + ")";
        todo = "check the disk and the permissions of the file and its folder";
      }
      case SQLITE_CORRUPT, SQLITE_NOTADB -> {
        cause = "it is damaged or not a rimeward audit database";
        todo = "keep a copy of the file for inspection and record to a new file with --audit";
      }
      default -> {
        cause = e.getMessage();
        todo = "check the file; run with --debug for details";
      }
    }
    return new AuditUnavailableException("audit database " + file + ": cannot " + doing + ": "
        + cause + "." + (writing ? " Nothing of it was recorded." : "") + " What to do: " + todo
        + ".", e);
  }
}
