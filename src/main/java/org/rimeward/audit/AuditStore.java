package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rimeward.audit.Schema.Col;
import org.rimeward.audit.Schema.Table;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.io.BadInputException;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteException;

/**
 * The audit trail: one SQLite file holding every nightly run and every crop-profile edit,
 * append-only and hash-chained (see {@link #verify()}).
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

  private static final DateTimeFormatter STORED_INSTANT =
      DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSSSSSSS'Z'").withZone(ZoneOffset.UTC);
  private static final ObjectMapper JSON = new ObjectMapper();

  private final Path file;
  private final Connection conn;
  private final boolean readOnly;
  private final Duration busyTimeout;

  private AuditStore(Path file, Connection conn, boolean readOnly, Duration busyTimeout) {
    this.file = file;
    this.conn = conn;
    this.readOnly = readOnly;
    this.busyTimeout = busyTimeout;
  }

  /** The file name of a farm's audit trail, kept in its farm folder. */
  public static final String FILE_NAME = "audit.db";

  /** A farm's audit trail: {@code audit.db} in the farm folder, or beside the farm file given. */
  public static Path fileFor(Path farmDirOrFile) {
    Path dir = java.nio.file.Files.isRegularFile(farmDirOrFile)
        ? farmDirOrFile.toAbsolutePath().getParent() : farmDirOrFile;
    return dir.resolve(FILE_NAME);
  }

  /** Opens the trail at {@code dbFile} for writing, creating or migrating its schema. */
  public static AuditStore open(Path dbFile) {
    return open(dbFile, DEFAULT_BUSY_TIMEOUT);
  }

  /** As {@link #open(Path)}, waiting at most {@code busyTimeout} for another writer. */
  public static AuditStore open(Path dbFile, Duration busyTimeout) {
    SQLiteConfig config = new SQLiteConfig();
    config.setBusyTimeout((int) busyTimeout.toMillis());
    config.setJournalMode(SQLiteConfig.JournalMode.WAL);
    // FULL: a run that COMMIT reported as recorded survives a power cut, not only a crash.
    config.setSynchronous(SQLiteConfig.SynchronousMode.FULL);
    AuditStore store = connect(dbFile, config, false, busyTimeout);
    try {
      store.inImmediateTransaction("create or update its tables", () -> {
        Schema.migrate(store.conn, dbFile);
        return null;
      });
    } catch (RuntimeException e) {
      store.close();
      throw e;
    }
    return store;
  }

  /**
   * Opens an existing trail for reading only; appends then fail with
   * {@link AuditUnavailableException}. For commands that only look.
   */
  public static AuditStore openReadOnly(Path dbFile) {
    if (!Files.isRegularFile(dbFile)) {
      throw new AuditUnavailableException("audit database " + dbFile + " does not exist. Runs are"
          + " recorded there by 'rimeward plan'; check --farm or --audit.");
    }
    SQLiteConfig config = new SQLiteConfig();
    config.setBusyTimeout((int) DEFAULT_BUSY_TIMEOUT.toMillis());
    config.setReadOnly(true);
    AuditStore store = connect(dbFile, config, true, DEFAULT_BUSY_TIMEOUT);
    try {
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

  private static AuditStore connect(Path dbFile, SQLiteConfig config, boolean readOnly,
      Duration busyTimeout) {
    try {
      Connection c = config.createConnection("jdbc:sqlite:" + dbFile.toAbsolutePath());
      return new AuditStore(dbFile, c, readOnly, busyTimeout);
    } catch (SQLException e) {
      throw unavailable(dbFile, "open it", e, false, busyTimeout);
    }
  }

  public Path file() {
    return file;
  }

  public boolean isReadOnly() {
    return readOnly;
  }

  /** The schema version of the open file. */
  public synchronized int schemaVersion() {
    try (Statement st = conn.createStatement();
        ResultSet rs = st.executeQuery(
            "SELECT count(*) FROM sqlite_master WHERE type = 'table' AND name = 'schema_version'")) {
      if (!rs.next() || rs.getInt(1) == 0) {
        return 0;
      }
      return Schema.currentVersion(conn);
    } catch (SQLException e) {
      throw unavailable(file, "read its schema version", e, false, busyTimeout);
    }
  }

  /**
   * Records the whole run in one transaction and returns its id. Nothing of it is kept when this
   * throws.
   *
   * @throws IllegalArgumentException when a run with the same id is already recorded
   * @throws AuditUnavailableException when the file cannot be written
   */
  public synchronized String appendRun(RunRecord run) {
    return inImmediateTransaction("record run " + run.runId(), () -> {
      try (PreparedStatement ps = conn.prepareStatement("SELECT 1 FROM runs WHERE run_id = ?")) {
        ps.setString(1, run.runId());
        try (ResultSet rs = ps.executeQuery()) {
          if (rs.next()) {
            throw new IllegalArgumentException("run " + run.runId() + " is already recorded in "
                + file + "; every run needs a new id (RunRecord.newRunId)");
          }
        }
      }
      try (Appender a = new Appender()) {
        int ruleCount = run.blocks().stream().mapToInt(b -> b.rules().size()).sum();
        a.append(Table.RUNS, run.runId(), STORED_INSTANT.format(run.ranAt()), run.toolVersion(),
            run.farmName(), run.night().toString(), run.zoneId(), run.policyJson(),
            toJson(run.cautions()), run.planJson(), (long) run.inputs().size(),
            (long) run.blocks().size(), (long) ruleCount, (long) run.protectionNeededCount());
        int ord = 0;
        for (RecordedInput in : run.inputs()) {
          a.append(Table.RUN_INPUTS, run.runId(), (long) ord++, in.kind().name(), in.name(),
              in.sha256(), in.content());
        }
        ord = 0;
        for (RecordedBlock b : run.blocks()) {
          a.append(Table.RUN_BLOCKS, run.runId(), (long) ord++, b.blockId(), b.status(), b.risk(),
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
    inImmediateTransaction("record the profile edit of " + edits.get(0).file(), () -> {
      try (Appender a = new Appender()) {
        for (ProfileEdit edit : edits) {
          a.append(Table.PROFILE_EDITS, STORED_INSTANT.format(edit.at()), edit.by(), edit.file(),
              edit.crop(), edit.variety(), edit.stage(), edit.field(), edit.beforeC(),
              edit.afterC(), edit.note());
        }
      }
      return null;
    });
  }

  /**
   * Runs newest first.
   *
   * @param since only runs for this night or later
   * @param blockId only runs that planned this block
   */
  public synchronized List<RunSummary> listRuns(Optional<LocalDate> since, Optional<String> blockId) {
    String sql = "SELECT run_id, ran_at, night, farm_name, block_count, protection_count FROM runs"
        + " WHERE (?1 IS NULL OR night >= ?1) AND (?2 IS NULL OR EXISTS (SELECT 1 FROM run_blocks b"
        + " WHERE b.run_id = runs.run_id AND b.block_id = ?2)) ORDER BY ran_at DESC, seq DESC";
    return read("list its runs", () -> {
      try (PreparedStatement ps = conn.prepareStatement(sql)) {
        ps.setString(1, since.map(LocalDate::toString).orElse(null));
        ps.setString(2, blockId.orElse(null));
        List<RunSummary> out = new ArrayList<>();
        try (ResultSet rs = ps.executeQuery()) {
          while (rs.next()) {
            out.add(new RunSummary(rs.getString(1), Instant.parse(rs.getString(2)),
                LocalDate.parse(rs.getString(3)), rs.getString(4), rs.getInt(5), rs.getInt(6)));
          }
        }
        return out;
      }
    });
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
    return read("load run " + p, () -> {
      List<String> ids = new ArrayList<>();
      try (PreparedStatement ps = conn.prepareStatement(
          "SELECT run_id FROM runs WHERE run_id = ?1 OR substr(run_id, 1, length(?1)) = ?1"
              + " ORDER BY run_id = ?1 DESC, run_id LIMIT 6")) {
        ps.setString(1, p);
        try (ResultSet rs = ps.executeQuery()) {
          while (rs.next()) {
            ids.add(rs.getString(1));
          }
        }
      }
      if (ids.isEmpty()) {
        return Optional.empty();
      }
      if (!ids.get(0).equals(p) && ids.size() > 1) {
        throw new BadInputException("run '" + p + "' matches " + (ids.size() > 5 ? "more than 5"
            : ids.size()) + " runs (" + String.join(", ", ids.subList(0, Math.min(5, ids.size())))
            + "); give more of the id");
      }
      return Optional.of(loadExact(ids.get(0)));
    });
  }

  /** The newest run that planned {@code blockId} for {@code night}. */
  public synchronized Optional<RunRecord> latestRunFor(String blockId, LocalDate night) {
    return read("find the latest run for block " + blockId, () -> {
      try (PreparedStatement ps = conn.prepareStatement("SELECT r.run_id FROM runs r JOIN"
          + " run_blocks b ON b.run_id = r.run_id WHERE b.block_id = ? AND r.night = ?"
          + " ORDER BY r.ran_at DESC, r.seq DESC LIMIT 1")) {
        ps.setString(1, blockId);
        ps.setString(2, night.toString());
        try (ResultSet rs = ps.executeQuery()) {
          return rs.next() ? Optional.of(loadExact(rs.getString(1))) : Optional.empty();
        }
      }
    });
  }

  /** Every recorded profile edit, oldest first. */
  public synchronized List<ProfileEdit> listProfileEdits() {
    return read("list its profile edits", () -> {
      List<ProfileEdit> out = new ArrayList<>();
      for (Row r : rows(Table.PROFILE_EDITS, "1 = 1 ORDER BY t.seq")) {
        List<Object> v = r.values;
        out.add(new ProfileEdit(Instant.parse((String) v.get(0)), (String) v.get(1),
            (String) v.get(2), (String) v.get(3), (String) v.get(4), (String) v.get(5),
            (String) v.get(6), (Double) v.get(7), (Double) v.get(8), (String) v.get(9)));
      }
      return out;
    });
  }

  /**
   * Walks the whole chain and reports the first record that does not match: a changed row, a
   * missing one, one added outside the chain, or a run cut short. Deleting the newest records
   * together is only seen against a head hash kept elsewhere ({@link VerifyResult#headHash()}).
   */
  public synchronized VerifyResult verify() {
    return read("verify it", () -> {
      // One read transaction: the walk sees one snapshot even while another program appends.
      try (Statement st = conn.createStatement()) {
        st.execute("BEGIN DEFERRED");
        try {
          return new Verifier().run();
        } finally {
          st.execute("COMMIT");
        }
      }
    });
  }

  @Override
  public synchronized void close() {
    try {
      conn.close();
    } catch (SQLException e) {
      // The data is committed or rolled back already; a failing close loses nothing.
    }
  }

  // ---------------------------------------------------------------------------------------------

  private RunRecord loadExact(String runId) throws SQLException {
    List<Row> runRows = rows(Table.RUNS, "t.run_id = ?", runId);
    Row run = runRows.get(0);
    List<Object> v = run.values;
    List<RecordedInput> inputs = new ArrayList<>();
    for (Row r : rows(Table.RUN_INPUTS, "t.run_id = ? ORDER BY t.ord", runId)) {
      List<Object> iv = r.values;
      try {
        inputs.add(new RecordedInput(InputKind.valueOf((String) iv.get(2)), (String) iv.get(3),
            (String) iv.get(4), (byte[]) iv.get(5)));
      } catch (IllegalArgumentException e) {
        throw new AuditIntegrityException(r.describe() + " cannot be read back: " + e.getMessage());
      }
    }
    Map<String, List<RecordedRule>> rulesByBlock = new java.util.HashMap<>();
    for (Row r : rows(Table.RUN_RULES, "t.run_id = ? ORDER BY t.block_id, t.fire_seq", runId)) {
      List<Object> rv = r.values;
      rulesByBlock.computeIfAbsent((String) rv.get(1), k -> new ArrayList<>()).add(new RecordedRule(
          Math.toIntExact((Long) rv.get(2)), (String) rv.get(3), (String) rv.get(4),
          (String) rv.get(5)));
    }
    List<RecordedBlock> blocks = new ArrayList<>();
    for (Row r : rows(Table.RUN_BLOCKS, "t.run_id = ? ORDER BY t.ord", runId)) {
      List<Object> bv = r.values;
      String blockId = (String) bv.get(2);
      List<RecordedRule> rules = rulesByBlock.getOrDefault(blockId, List.of());
      if (rules.size() != (Long) bv.get(7)) {
        throw new AuditIntegrityException(r.describe() + " lists " + bv.get(7) + " rules but "
            + rules.size() + " are recorded; run 'rimeward audit verify'");
      }
      blocks.add(new RecordedBlock(blockId, (String) bv.get(3), (String) bv.get(4),
          (Long) bv.get(5) != 0, (String) bv.get(6), rules));
    }
    if (inputs.size() != (Long) v.get(9) || blocks.size() != (Long) v.get(10)) {
      throw new AuditIntegrityException(run.describe() + " lists " + v.get(9) + " inputs and "
          + v.get(10) + " blocks but " + inputs.size() + " and " + blocks.size()
          + " are recorded; run 'rimeward audit verify'");
    }
    List<String> cautions;
    try {
      cautions = JSON.readValue((String) v.get(7), new TypeReference<List<String>>() {});
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException(run.describe() + " has unreadable cautions");
    }
    return new RunRecord(runId, Instant.parse((String) v.get(1)), (String) v.get(2),
        (String) v.get(3), LocalDate.parse((String) v.get(4)), (String) v.get(5),
        (String) v.get(6), inputs, blocks, cautions, (String) v.get(8));
  }

  /** One content row with its chain record, checked against its hash as it is read. */
  private record Row(Table table, long seq, List<Object> values) {
    String describe() {
      return "record " + seq + " (" + table.sql + ", " + AuditStore.describe(table, values) + ")";
    }
  }

  private List<Row> rows(Table t, String where, Object... params) throws SQLException {
    String sql = "SELECT t.seq, r.prev_hash, r.hash, " + t.cols.stream().map(c -> "t." + c.name())
        .collect(java.util.stream.Collectors.joining(", ")) + " FROM " + t.sql
        + " t LEFT JOIN records r ON r.seq = t.seq AND r.kind = '" + t.sql + "' WHERE " + where;
    List<Row> out = new ArrayList<>();
    try (PreparedStatement ps = conn.prepareStatement(sql)) {
      for (int i = 0; i < params.length; i++) {
        ps.setObject(i + 1, params[i]);
      }
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          long seq = rs.getLong(1);
          List<Object> values = readValues(rs, t, 4);
          Row row = new Row(t, seq, values);
          String prev = rs.getString(2);
          if (prev == null || !ChainHash.of(t.sql, seq, prev, values).equals(rs.getString(3))) {
            throw new AuditIntegrityException(row.describe() + " does not match its chain hash:"
                + " the trail was changed or damaged; run 'rimeward audit verify'");
          }
          out.add(row);
        }
      }
    }
    return out;
  }

  static List<Object> readValues(ResultSet rs, Table t, int first) throws SQLException {
    List<Object> values = new ArrayList<>(t.cols.size());
    int i = first;
    for (Col c : t.cols) {
      Object v = switch (c.type()) {
        case TEXT -> rs.getString(i);
        case INTEGER -> {
          long l = rs.getLong(i);
          yield rs.wasNull() ? null : l;
        }
        case REAL -> {
          double d = rs.getDouble(i);
          yield rs.wasNull() ? null : d;
        }
        case BLOB -> {
          byte[] b = rs.getBytes(i);
          // SQLite hands back no pointer for a zero-length blob; the column is NOT NULL.
          yield b == null ? new byte[0] : b;
        }
      };
      values.add(v);
      i++;
    }
    return values;
  }

  static String describe(Table t, List<Object> v) {
    return switch (t) {
      case RUNS -> "run " + v.get(0);
      case RUN_INPUTS -> "run " + v.get(0) + " input " + v.get(3);
      case RUN_BLOCKS -> "run " + v.get(0) + " block " + v.get(2);
      case RUN_RULES -> "run " + v.get(0) + " block " + v.get(1) + " rule #" + v.get(2) + " "
          + v.get(3);
      case PROFILE_EDITS -> "profile edit at " + v.get(0) + " of " + v.get(2) + " " + v.get(6);
    };
  }

  /** Appends rows to the chain within the caller's transaction, reading the head once. */
  private final class Appender implements AutoCloseable {
    private final Map<Table, PreparedStatement> inserts = new EnumMap<>(Table.class);
    private final PreparedStatement chain;
    private long seq;
    private String hash;

    Appender() throws SQLException {
      try (Statement st = conn.createStatement();
          ResultSet rs = st.executeQuery("SELECT seq, hash FROM records ORDER BY seq DESC LIMIT 1")) {
        if (rs.next()) {
          seq = rs.getLong(1);
          hash = rs.getString(2);
        } else {
          seq = 0;
          hash = ChainHash.GENESIS;
        }
      }
      chain = conn.prepareStatement(
          "INSERT INTO records (seq, kind, prev_hash, hash) VALUES (?, ?, ?, ?)");
    }

    void append(Table t, Object... values) throws SQLException {
      long next = seq + 1;
      List<Object> list = java.util.Arrays.asList(values);
      String h = ChainHash.of(t.sql, next, hash, list);
      PreparedStatement ps = inserts.get(t);
      if (ps == null) {
        ps = conn.prepareStatement(t.insertSql());
        inserts.put(t, ps);
      }
      ps.setLong(1, next);
      for (int i = 0; i < values.length; i++) {
        bind(ps, i + 2, t.cols.get(i), values[i]);
      }
      ps.executeUpdate();
      chain.setLong(1, next);
      chain.setString(2, t.sql);
      chain.setString(3, hash);
      chain.setString(4, h);
      chain.executeUpdate();
      seq = next;
      hash = h;
    }

    private void bind(PreparedStatement ps, int i, Col c, Object v) throws SQLException {
      if (v == null) {
        ps.setNull(i, java.sql.Types.NULL);
        return;
      }
      switch (c.type()) {
        case TEXT -> ps.setString(i, (String) v);
        case INTEGER -> ps.setLong(i, (Long) v);
        case REAL -> ps.setDouble(i, (Double) v);
        case BLOB -> ps.setBytes(i, (byte[]) v);
      }
    }

    @Override
    public void close() throws SQLException {
      chain.close();
      for (PreparedStatement ps : inserts.values()) {
        ps.close();
      }
    }
  }

  /** Walks the chain in sequence order, then checks for rows outside it and runs cut short. */
  private final class Verifier {
    private final Map<Table, PreparedStatement> bySeq = new EnumMap<>(Table.class);

    VerifyResult run() throws SQLException {
      try (Statement st = conn.createStatement();
          ResultSet rs = st.executeQuery("PRAGMA quick_check")) {
        String first = rs.next() ? rs.getString(1) : "no answer";
        if (!"ok".equals(first)) {
          return VerifyResult.broken(0, ChainHash.GENESIS, "the database file is damaged: " + first);
        }
      }
      try {
        return walk();
      } finally {
        for (PreparedStatement ps : bySeq.values()) {
          ps.close();
        }
      }
    }

    private VerifyResult walk() throws SQLException {
      String prev = ChainHash.GENESIS;
      long expected = 1;
      long count = 0;
      try (Statement st = conn.createStatement();
          ResultSet rs = st.executeQuery("SELECT seq, kind, prev_hash, hash FROM records ORDER BY seq")) {
        while (rs.next()) {
          long seq = rs.getLong(1);
          String kind = rs.getString(2);
          if (seq != expected) {
            return VerifyResult.broken(count, prev, expected, "record " + expected + " is missing:"
                + " the chain goes from record " + (expected - 1) + " to record " + seq);
          }
          Table t = Table.ofSql(kind);
          if (t == null) {
            return VerifyResult.broken(count, prev, seq, "record " + seq + " has an unknown kind '"
                + kind + "'");
          }
          List<Object> values = content(t, seq);
          if (values == null) {
            return VerifyResult.broken(count, prev, seq, "record " + seq + " (" + t.sql
                + ") is missing: its row in " + t.sql + " was deleted");
          }
          String where = "record " + seq + " (" + t.sql + ", " + describe(t, values) + ")";
          if (!prev.equals(rs.getString(3))) {
            return VerifyResult.broken(count, prev, seq, where + " does not follow record "
                + (seq - 1) + ": its link to the previous record does not match");
          }
          if (!ChainHash.of(t.sql, seq, prev, values).equals(rs.getString(4))) {
            return VerifyResult.broken(count, prev, seq, where + " hash does not match its content");
          }
          prev = rs.getString(4);
          count++;
          expected++;
        }
      }
      for (Table t : Table.values()) {
        try (PreparedStatement ps = conn.prepareStatement("SELECT t.seq FROM " + t.sql + " t"
            + " LEFT JOIN records r ON r.seq = t.seq AND r.kind = ? WHERE r.seq IS NULL"
            + " ORDER BY t.seq LIMIT 1")) {
          ps.setString(1, t.sql);
          try (ResultSet rs = ps.executeQuery()) {
            if (rs.next()) {
              long seq = rs.getLong(1);
              List<Object> values = content(t, seq);
              return VerifyResult.broken(count, prev, seq, "a row of " + t.sql + " ("
                  + describe(t, values) + ", seq " + seq + ") is not in the chain: it was added"
                  + " outside rimeward");
            }
          }
        }
      }
      String whole = "SELECT r.seq, r.run_id, r.input_count, r.block_count, r.rule_count,"
          + " (SELECT count(*) FROM run_inputs i WHERE i.run_id = r.run_id),"
          + " (SELECT count(*) FROM run_blocks b WHERE b.run_id = r.run_id),"
          + " (SELECT count(*) FROM run_rules u WHERE u.run_id = r.run_id)"
          + " FROM runs r ORDER BY r.seq";
      try (Statement st = conn.createStatement(); ResultSet rs = st.executeQuery(whole)) {
        while (rs.next()) {
          String[] what = {"inputs", "blocks", "rules"};
          for (int k = 0; k < 3; k++) {
            long listed = rs.getLong(3 + k);
            long found = rs.getLong(6 + k);
            if (listed != found) {
              return VerifyResult.broken(count, prev, rs.getLong(1), "record " + rs.getLong(1)
                  + " (runs, run " + rs.getString(2) + ") lists " + listed + " " + what[k] + " but "
                  + found + " are recorded: the run's newest records are missing");
            }
          }
        }
      }
      return VerifyResult.ok(count, prev);
    }

    private List<Object> content(Table t, long seq) throws SQLException {
      PreparedStatement ps = bySeq.get(t);
      if (ps == null) {
        ps = conn.prepareStatement(t.selectBySeqSql());
        bySeq.put(t, ps);
      }
      ps.setLong(1, seq);
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next() ? readValues(rs, t, 1) : null;
      }
    }
  }

  // ---------------------------------------------------------------------------------------------

  @FunctionalInterface
  private interface SqlWork<T> {
    T run() throws SQLException;
  }

  private <T> T inImmediateTransaction(String doing, SqlWork<T> work) {
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
      throw unavailable(file, doing, e, true, busyTimeout);
    }
  }

  private <T> T read(String doing, SqlWork<T> work) {
    try {
      return work.run();
    } catch (SQLException e) {
      throw unavailable(file, doing, e, false, busyTimeout);
    }
  }

  private void rollbackQuietly() {
    try (Statement st = conn.createStatement()) {
      st.execute("ROLLBACK");
    } catch (SQLException e) {
      // No transaction left to roll back (a failed BEGIN, or SQLite already rolled it back).
    }
  }

  private static AuditUnavailableException unavailable(Path file, String doing, SQLException e,
      boolean writing, Duration busyTimeout) {
    int code = (e instanceof SQLiteException se ? se.getResultCode().code : e.getErrorCode()) & 0xff;
    String cause;
    String todo;
    switch (code) {
      case 8 -> {
        cause = "it is read-only (the file or its folder cannot be written, or it was opened"
            + " read-only)";
        todo = "make the file and its folder writable (SQLite writes -wal and -shm files beside"
            + " it), or record to another file with --audit";
      }
      case 5, 6 -> {
        cause = "another program kept it locked for more than " + busyTimeout.toSeconds() + " s";
        todo = "wait for the other rimeward run (or the program holding the file) to finish, then"
            + " run again";
      }
      case 13 -> {
        cause = "the disk is full";
        todo = "free space on the disk that holds it, then run again";
      }
      case 14 -> {
        cause = "it cannot be opened (its folder is missing or not accessible)";
        todo = "check the folder given with --farm or the file given with --audit";
      }
      case 3, 10, 23 -> {
        cause = "the system refused or failed the access (" + e.getMessage() + ")";
        todo = "check the disk and the permissions of the file and its folder";
      }
      case 11, 26 -> {
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

  private static String toJson(Object o) {
    try {
      return JSON.writeValueAsString(o);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }
}
