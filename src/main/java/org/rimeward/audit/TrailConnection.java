package org.rimeward.audit;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.time.Duration;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteErrorCode;

/**
 * Opening the trail's SQLite file, for writing (creating or migrating its schema) or for reading
 * only, and running work in its transactions. Every SQLite failure leaves here as an
 * {@link AuditUnavailableException} that names the file, the cause and what to do.
 *
 * <p>A trail handed over as a copy (to an insurer, on a read-only share) can be read even where
 * neither the file nor its folder can be written: SQLite then opens it as immutable, which needs
 * no {@code -shm} or {@code -wal} file beside it.
 */
final class TrailConnection implements AutoCloseable {
  final Path file;
  final Connection conn;
  final boolean readOnly;
  final Duration busyTimeout;
  final Clock clock;

  private TrailConnection(Path file, Connection conn, boolean readOnly, Duration busyTimeout,
      Clock clock) {
    this.file = file;
    this.conn = conn;
    this.readOnly = readOnly;
    this.busyTimeout = busyTimeout;
    this.clock = clock;
  }

  /** Opens for writing and brings the schema to the latest version. */
  static TrailConnection openForWriting(Path dbFile, Duration busyTimeout, Clock clock) {
    SQLiteConfig config = new SQLiteConfig();
    config.setBusyTimeout((int) busyTimeout.toMillis());
    config.setJournalMode(SQLiteConfig.JournalMode.WAL);
    // FULL: a run that COMMIT reported as recorded survives a power cut, not only a crash.
    config.setSynchronous(SQLiteConfig.SynchronousMode.FULL);
    TrailConnection c = connect(dbFile, "jdbc:sqlite:" + dbFile.toAbsolutePath(), config, false,
        busyTimeout, clock);
    try {
      c.inImmediateTransaction("create or update its tables", () -> {
        Schema.migrate(c.conn, dbFile, clock);
        return null;
      });
    } catch (RuntimeException e) {
      c.close();
      throw e;
    }
    return c;
  }

  /**
   * Opens an existing file for reading only. Where the file or its folder cannot be written, the
   * file is opened immutable: nothing else may be changing it then, which is what a read-only copy
   * means.
   */
  static TrailConnection openForReading(Path dbFile, Duration busyTimeout, Clock clock) {
    Path abs = dbFile.toAbsolutePath();
    boolean writable = Files.isWritable(abs) && Files.isWritable(abs.getParent());
    if (writable) {
      try {
        TrailConnection c = connect(dbFile, "jdbc:sqlite:" + abs, readOnlyConfig(busyTimeout),
            true, busyTimeout, clock);
        c.probe();
        return c;
      } catch (AuditUnavailableException e) {
        if (!(e.getCause() instanceof SQLException se) || !cannotShareReadOnly(se)) {
          throw e;
        }
        // A read-only mount the permission bits do not show: fall through to immutable.
      }
    }
    TrailConnection c = connect(dbFile, "jdbc:sqlite:" + abs.toUri() + "?immutable=1",
        readOnlyConfig(busyTimeout), true, busyTimeout, clock);
    c.probe();
    return c;
  }

  private static boolean cannotShareReadOnly(SQLException e) {
    SQLiteErrorCode code = SqliteFailure.primaryCode(e);
    return code == SQLiteErrorCode.SQLITE_READONLY || code == SQLiteErrorCode.SQLITE_CANTOPEN;
  }

  private static SQLiteConfig readOnlyConfig(Duration busyTimeout) {
    SQLiteConfig config = new SQLiteConfig();
    config.setBusyTimeout((int) busyTimeout.toMillis());
    config.setReadOnly(true);
    return config;
  }

  private static TrailConnection connect(Path dbFile, String url, SQLiteConfig config,
      boolean readOnly, Duration busyTimeout, Clock clock) {
    try {
      return new TrailConnection(dbFile, config.createConnection(url), readOnly, busyTimeout,
          clock);
    } catch (SQLException e) {
      throw SqliteFailure.unavailable(dbFile, "open it", e, false, busyTimeout);
    }
  }

  /** Reads the schema once, so an unreadable file fails here and not halfway through a command. */
  private void probe() {
    try {
      read("read it", () -> {
        try (Statement st = conn.createStatement()) {
          st.executeQuery("SELECT count(*) FROM sqlite_master").close();
        }
        return null;
      });
    } catch (RuntimeException e) {
      close();
      throw e;
    }
  }

  @FunctionalInterface
  interface SqlWork<T> {
    T run() throws SQLException;
  }

  /** Runs {@code work} in one {@code BEGIN IMMEDIATE} transaction: all of it or nothing. */
  <T> T inImmediateTransaction(String doing, SqlWork<T> work) {
    try (Statement st = conn.createStatement()) {
      st.execute("BEGIN IMMEDIATE");
      boolean committed = false;
      try {
        T result = work.run();
        st.execute("COMMIT");
        committed = true;
        return result;
      } finally {
        if (!committed) {
          rollbackQuietly();
        }
      }
    } catch (SQLException e) {
      throw SqliteFailure.unavailable(file, doing, e, true, busyTimeout);
    }
  }

  /** Runs {@code work} in one read transaction, so it sees one snapshot while others append. */
  <T> T inReadTransaction(String doing, SqlWork<T> work) {
    return read(doing, () -> {
      try (Statement st = conn.createStatement()) {
        st.execute("BEGIN DEFERRED");
        try {
          return work.run();
        } finally {
          st.execute("COMMIT");
        }
      }
    });
  }

  <T> T read(String doing, SqlWork<T> work) {
    try {
      return work.run();
    } catch (SQLException e) {
      throw SqliteFailure.unavailable(file, doing, e, false, busyTimeout);
    }
  }

  private void rollbackQuietly() {
    try (Statement st = conn.createStatement()) {
      st.execute("ROLLBACK");
    } catch (SQLException e) {
      // No transaction left to roll back (a failed BEGIN, or SQLite already rolled it back).
    }
  }

  @Override
  public void close() {
    try {
      conn.close();
    } catch (SQLException e) {
      // The data is committed or rolled back already; a failing close loses nothing.
    }
  }
}
