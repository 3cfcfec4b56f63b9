package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Optional;
import org.rimeward.audit.Schema.Table;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;

/**
 * The audit trail: one SQLite file holding every nightly run and every crop-profile edit,
 * append-only and hash-chained. This class is the door to it; the work is done by
 * {@link TrailConnection} (opening and migrating), {@link ChainWriter} (appending),
 * {@link ChainVerifier} (checking) and {@link RunReader} (reading back by column name).
 *
 * <p>Every row of every audit table is one record of a single chain, numbered by a global
 * sequence. A record's hash covers its table, its sequence number, the previous record's hash and
 * every column of its row, so a changed byte, a removed row or a row slipped in shows up. A run is
 * written in one {@code BEGIN IMMEDIATE} transaction: it lands whole or not at all, and since the
 * chain head is read inside that transaction, two programs appending at once still form one chain.
 * A second writer waits for the first (the busy timeout) instead of failing.
 *
 * <p>One store holds one connection; its methods are synchronized. Open one store per thread or
 * process for parallel writers.
 */
public final class AuditStore implements AutoCloseable {
  /** How long a writer waits for another writer before giving up. */
  public static final Duration DEFAULT_BUSY_TIMEOUT = Duration.ofSeconds(30);

  /** The file name of a farm's audit trail, kept in its farm folder. */
  public static final String FILE_NAME = "audit.db";

  static final DateTimeFormatter STORED_INSTANT =
      DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSSSSSSS'Z'").withZone(ZoneOffset.UTC);
  private static final ObjectMapper JSON = org.rimeward.io.Json.mapper();

  private final TrailConnection db;

  private AuditStore(TrailConnection db) {
    this.db = db;
  }

  /** A farm's audit trail: {@code audit.db} in the farm folder, or beside the farm file given. */
  public static Path fileFor(Path farmDirOrFile) {
    Path dir = Files.isRegularFile(farmDirOrFile)
        ? farmDirOrFile.toAbsolutePath().getParent() : farmDirOrFile;
    return dir.resolve(FILE_NAME);
  }

  /** Opens the trail at {@code dbFile} for writing, creating or migrating its schema. */
  public static AuditStore open(Path dbFile) {
    return open(dbFile, DEFAULT_BUSY_TIMEOUT, Clock.systemUTC());
  }

  /** As {@link #open(Path)}, waiting at most {@code busyTimeout} for another writer. */
  public static AuditStore open(Path dbFile, Duration busyTimeout) {
    return open(dbFile, busyTimeout, Clock.systemUTC());
  }

  /** As {@link #open(Path, Duration)}, stamping what the store itself records with {@code clock}. */
  public static AuditStore open(Path dbFile, Duration busyTimeout, Clock clock) {
    Path seals = Seals.fileFor(dbFile);
    if (!Files.exists(dbFile) && Files.exists(seals)) {
      throw new AuditUnavailableException("audit database " + dbFile + " is missing, but " + seals
          + " beside it shows this farm kept a trail there. A new trail is not started silently:"
          + " restore the file from a backup; or, to start a new trail on purpose, move " + seals
          + " aside and keep it with the old trail's records. Nothing was recorded.");
    }
    return new AuditStore(TrailConnection.openForWriting(dbFile, busyTimeout, clock));
  }

  /**
   * Opens an existing trail for reading only; appends then fail with
   * {@link AuditUnavailableException}. For commands that only look. A file that neither it nor
   * its folder can be written (a copy on a read-only share) is read as it is.
   */
  public static AuditStore openReadOnly(Path dbFile) {
    if (!Files.isRegularFile(dbFile)) {
      throw new AuditUnavailableException("audit database " + dbFile + " does not exist. Runs are"
          + " recorded there by 'rimeward plan'; check --farm or --audit.");
    }
    AuditStore store = new AuditStore(
        TrailConnection.openForReading(dbFile, DEFAULT_BUSY_TIMEOUT, Clock.systemUTC()));
    try {
      store.db.read("check its schema versions", () -> {
        Schema.checkVersionRows(store.db.conn, dbFile);
        return null;
      });
      int version = store.schemaVersion();
      if (version != Schema.latestVersion()) {
        throw new AuditUnavailableException("audit database " + dbFile + " has schema version "
            + version + " but this rimeward reads version " + Schema.latestVersion()
            + (version < Schema.latestVersion()
                ? "; open it once for writing (any 'rimeward plan' run) to update it"
                : "; use the newer rimeward that wrote it"));
      }
    } catch (RuntimeException e) {
      store.close();
      throw e;
    }
    return store;
  }

  public Path file() {
    return db.file;
  }

  public boolean isReadOnly() {
    return db.readOnly;
  }

  /** The schema version of the open file. */
  public synchronized int schemaVersion() {
    return db.read("read its schema version", () -> Schema.currentVersion(db.conn));
  }

  /**
   * Records the whole run in one transaction and returns its id. Nothing of it is kept when this
   * throws.
   *
   * @throws IllegalArgumentException when a run with the same id is already recorded
   * @throws AuditUnavailableException when the file cannot be written
   */
  public synchronized String appendRun(RunRecord run) {
    return db.inImmediateTransaction("record run " + run.runId(), () -> {
      try (PreparedStatement ps = db.conn.prepareStatement("SELECT 1 FROM runs WHERE run_id = ?")) {
        ps.setString(1, run.runId());
        try (ResultSet rs = ps.executeQuery()) {
          if (rs.next()) {
            throw new IllegalArgumentException("run " + run.runId() + " is already recorded in "
                + db.file + "; every run needs a new id (RunRecord.newRunId)");
          }
        }
      }
      try (ChainWriter a = new ChainWriter(db.conn)) {
        int ruleCount = run.blocks().stream().mapToInt(b -> b.rules().size()).sum();
        a.append(Table.RUNS, run.runId(), STORED_INSTANT.format(run.ranAt()), run.toolVersion(),
            run.farmName(), run.night().toString(), run.zoneId(), run.policyJson(),
            toJson(run.cautions()), run.planJson(), (long) run.inputs().size(),
            (long) run.blocks().size(), (long) ruleCount, (long) run.protectionNeededCount());
        long ord = 0;
        for (RecordedInput in : run.inputs()) {
          // Bytes already in the trail are kept once: a night of re-plans every few minutes must
          // not copy the farm, the profiles and the rules each time. The hash names them.
          byte[] content = RunReader.storedOnce(db.conn, in.sha256()) ? new byte[0] : in.content();
          a.append(Table.RUN_INPUTS, run.runId(), ord++, in.kind().name(), in.name(), in.sha256(),
              content);
        }
        ord = 0;
        for (RecordedBlock b : run.blocks()) {
          a.append(Table.RUN_BLOCKS, run.runId(), ord++, b.blockId(), b.status(), b.risk(),
              b.protectionNeeded() ? 1L : 0L, b.decisionJson(), (long) b.rules().size());
          for (RecordedRule r : b.rules()) {
            a.append(Table.RUN_RULES, run.runId(), b.blockId(), (long) r.seq(), r.ruleId(),
                r.explanation(), r.factsJson());
          }
        }
      }
      return run.runId();
    });
  }

  /** Records one crop-profile edit. */
  public synchronized void appendProfileEdit(ProfileEdit edit) {
    appendProfileEdits(List.of(edit));
  }

  /**
   * Records the edits of one command (a T10 and a T90 set together) in one transaction: all of
   * them or, when this throws, none.
   */
  public synchronized void appendProfileEdits(List<ProfileEdit> edits) {
    if (edits.isEmpty()) {
      return;
    }
    db.inImmediateTransaction("record the profile edit of " + edits.get(0).file(), () -> {
      try (ChainWriter a = new ChainWriter(db.conn)) {
        for (ProfileEdit edit : edits) {
          a.append(Table.PROFILE_EDITS, STORED_INSTANT.format(edit.at()), edit.by(), edit.file(),
              edit.crop(), edit.variety(), edit.stage(), edit.field(), edit.beforeC(),
              edit.afterC(), edit.note());
        }
      }
      return null;
    });
  }

  /** Records an alarm the night watch raised. */
  public synchronized void appendAlarm(WatchAlarm alarm) {
    db.inImmediateTransaction("record the " + alarm.kind() + " alarm", () -> {
      try (ChainWriter a = new ChainWriter(db.conn)) {
        a.append(Table.WATCH_ALARMS, STORED_INSTANT.format(alarm.at()), alarm.night().toString(),
            alarm.blockId(), alarm.kind(), (long) alarm.level(), alarm.message(),
            alarm.runId().orElse(null), alarm.commandStatus().orElse(null));
      }
      return null;
    });
  }

  /** The alarms the watch raised for a night, in the order raised. */
  public synchronized List<WatchAlarm> listAlarms(LocalDate night) {
    return db.read("list the watch's alarms", () -> new RunReader(db.conn).alarms(night));
  }

  /** Records what the crew did, as one chain record. */
  public synchronized void appendAction(CrewAction action) {
    db.inImmediateTransaction("record the action on " + action.blockId(), () -> {
      try (ChainWriter a = new ChainWriter(db.conn)) {
        a.append(Table.CREW_ACTIONS, STORED_INSTANT.format(action.at()),
            STORED_INSTANT.format(action.recordedAt()), action.night().toString(), action.blockId(),
            action.kind().word(), action.by(), action.note(), action.advisedRunId().orElse(null),
            action.warning().orElse(null));
      }
      return null;
    });
  }

  /** The crew's actions of a night, optionally of one block, in the order they were done. */
  public synchronized List<CrewAction> listActions(LocalDate night, Optional<String> blockId) {
    return db.read("list the crew's actions", () -> new RunReader(db.conn).actions(night, blockId));
  }

  /**
   * Runs newest first.
   *
   * @param since only runs for this night or later
   * @param blockId only runs that planned this block
   */
  public synchronized List<RunSummary> listRuns(Optional<LocalDate> since,
      Optional<String> blockId) {
    return db.read("list its runs", () -> new RunReader(db.conn).list(since, blockId));
  }

  /**
   * The run with this id, or with an id starting with this text when only one does. Each row read
   * is checked against its chain hash.
   *
   * @throws BadInputException when the prefix is empty or matches more than one run
   * @throws AuditIntegrityException when a row of the run no longer matches its hash
   */
  public synchronized Optional<RunRecord> loadRun(String runIdOrUniquePrefix) {
    if (runIdOrUniquePrefix == null || runIdOrUniquePrefix.isBlank()) {
      throw new BadInputException("run: give a run id, or its first characters, as 'rimeward"
          + " audit list' shows them");
    }
    String p = runIdOrUniquePrefix.trim();
    return db.read("load run " + p, () -> {
      RunReader reader = new RunReader(db.conn);
      List<String> ids = reader.idsMatching(p);
      if (ids.isEmpty()) {
        return Optional.empty();
      }
      if (!ids.get(0).equals(p) && ids.size() > 1) {
        throw new BadInputException("run '" + p + "' matches " + (ids.size() > 5 ? "more than 5"
            : ids.size()) + " runs (" + String.join(", ", ids.subList(0, Math.min(5, ids.size())))
            + "); give more of the id");
      }
      return Optional.of(reader.load(ids.get(0)));
    });
  }

  /** The newest run that planned {@code blockId} for {@code night}. */
  public synchronized Optional<RunRecord> latestRunFor(String blockId, LocalDate night) {
    return db.read("find the latest run for block " + blockId,
        () -> new RunReader(db.conn).latestFor(blockId, Optional.of(night)));
  }

  /** The newest run that planned {@code blockId}, whatever its night. */
  public synchronized Optional<RunRecord> latestRunFor(String blockId) {
    return db.read("find the latest run for block " + blockId,
        () -> new RunReader(db.conn).latestFor(blockId, Optional.empty()));
  }

  /** Every recorded profile edit, oldest first. */
  public synchronized List<ProfileEdit> listProfileEdits() {
    return db.read("list its profile edits", () -> new RunReader(db.conn).profileEdits());
  }

  /** Every recorded profile edit with what became of it, oldest first. */
  public synchronized List<RecordedEdit> listRecordedEdits() {
    return db.read("list its profile edits", () -> new RunReader(db.conn).profileEditsWithState());
  }

  /** The newest record of the chain, to be held elsewhere (see {@link ChainHead}). */
  public synchronized ChainHead head() {
    return db.read("read its newest record", () -> ChainHead.read(db.conn));
  }

  /**
   * Walks the whole chain and reports the first record that does not match: a changed row, a
   * missing one, one added outside the chain, or a run cut short. Deleting the newest records
   * together, or rebuilding the whole chain, is only seen against a head kept elsewhere
   *.
   */
  public synchronized VerifyResult verify() {
    return db.inReadTransaction("verify it", () -> {
      try (ChainVerifier v = new ChainVerifier(db.conn)) {
        return v.run();
      }
    });
  }

  /**
   * As {@link #verify()}, and then whether the trail still holds {@code held}: a head written
   * down elsewhere earlier. A trail rebuilt with recomputed hashes, or cut short, fails here.
   */
  public synchronized VerifyResult verify(ChainHead held) {
    return db.inReadTransaction("verify it", () -> {
      try (ChainVerifier v = new ChainVerifier(db.conn)) {
        VerifyResult r = v.run();
        if (!r.intact()) {
          return r;
        }
        Optional<String> differs = v.holds(held);
        return differs.isEmpty() ? r : VerifyResult.broken(r.recordCount(), r.headHash(),
            held.seq(), "the head " + held + " given with --head does not hold: " + differs.get());
      }
    });
  }

  /**
   * Records a crop-file change as pending, with its edits, before the file is written; returns
   * the pending record's sequence number.
   */
  public synchronized long recordPendingChange(org.rimeward.crop.PendingChange change) {
    return db.inImmediateTransaction("record the profile edit of " + change.file(),
        () -> new FileChanges(db.conn, db.clock).recordPending(change));
  }

  /** Records the outcome of the pending change at {@code pendingSeq}. */
  synchronized void settleChange(long pendingSeq, FileChanges.State state, String detail) {
    db.inImmediateTransaction("record the outcome of change " + pendingSeq, () -> {
      FileChanges fc = new FileChanges(db.conn, db.clock);
      FileChanges.Unsettled p = fc.pendingAt(pendingSeq).orElseThrow(() ->
          new IllegalStateException("no pending change at record " + pendingSeq));
      if (!fc.settled(pendingSeq)) {
        fc.recordOutcome(p, state, detail);
      }
      return null;
    });
  }

  /**
   * Settles every pending crop-file change a killed or failed command left behind, by what its
   * file holds now, and returns a line for each for the user. Changes whose file is locked by an
   * edit still running are left for later.
   */
  public synchronized List<String> settlePendingChanges() {
    if (db.readOnly) {
      return unsettledChanges();
    }
    List<FileChanges.Unsettled> open = db.read("look for unfinished profile edits",
        () -> new FileChanges(db.conn, db.clock).unsettled());
    List<String> lines = new java.util.ArrayList<>();
    for (FileChanges.Unsettled p : open) {
      Optional<FileChanges.Outcome> o = FileChanges.inspect(p);
      if (o.isEmpty()) {
        continue;
      }
      boolean recorded = db.inImmediateTransaction("settle profile edit " + p.seq(), () -> {
        FileChanges fc = new FileChanges(db.conn, db.clock);
        if (fc.settled(p.seq())) {
          return false;
        }
        fc.recordOutcome(p, o.get().state(), o.get().detail());
        return true;
      });
      if (recorded) {
        lines.add("profile edit of " + p.file() + " recorded at " + p.at() + " (record " + p.seq()
            + "): " + o.get().state().word + ": " + o.get().detail());
      }
    }
    return lines;
  }

  /** Pending crop-file changes no row settles yet, one line each; reads only. */
  public synchronized List<String> unsettledChanges() {
    return db.read("look for unfinished profile edits", () -> {
      List<String> lines = new java.util.ArrayList<>();
      for (FileChanges.Unsettled p : new FileChanges(db.conn, db.clock).unsettled()) {
        lines.add("profile edit of " + p.file() + " recorded at " + p.at() + " (record " + p.seq()
            + ") is pending: the command stopped before confirming it; the next profile edit or"
            + " plan settles it");
      }
      return lines;
    });
  }

  @Override
  public synchronized void close() {
    db.close();
  }

  /**
   * Copies what the write-ahead log holds into the database file itself, as closing the last
   * connection does: for a store kept open between writes (the night watch), so that the file
   * alone holds every record committed so far. Passive: it never waits for another program.
   */
  public synchronized void checkpoint() {
    db.read("copy its log into the file", () -> {
      try (java.sql.Statement st = db.conn.createStatement()) {
        st.execute("PRAGMA wal_checkpoint(PASSIVE)");
      }
      return null;
    });
  }

  private static String toJson(Object o) {
    try {
      return JSON.writeValueAsString(o);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }
}
