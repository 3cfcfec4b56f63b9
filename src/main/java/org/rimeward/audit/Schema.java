package org.rimeward.audit;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The audit tables and the ordered schema migrations. Each table's columns are written once, in
 * {@link Table}: its {@code CREATE TABLE}, its inserts, its reads and the chain hash all come
 * from that one list, in that order.
 */
final class Schema {
  private Schema() {}

  enum Type { TEXT, INTEGER, REAL, BLOB }

  /** One column: its name, its type, and whether it may hold NULL. */
  record Col(String name, Type type, boolean nullable) {
    String ddl() {
      return name + " " + type + (nullable ? "" : " NOT NULL");
    }
  }

  private static Col col(String name, Type type) {
    return new Col(name, type, false);
  }

  private static Col nullable(String name, Type type) {
    return new Col(name, type, true);
  }

  /**
   * A table whose every row is one chain record. The row's {@code seq} is its place in the chain;
   * {@code cols} are hashed in this order. A recorded table's columns never change: an old row
   * must hash as it did when written. New facts go in new tables.
   */
  enum Table {
    RUNS("runs", List.of("UNIQUE (run_id)"), col("run_id", Type.TEXT), col("ran_at", Type.TEXT),
        col("tool_version", Type.TEXT), col("farm_name", Type.TEXT), col("night", Type.TEXT),
        col("zone_id", Type.TEXT), col("policy_json", Type.TEXT), col("cautions_json", Type.TEXT),
        col("plan_json", Type.TEXT), col("input_count", Type.INTEGER),
        col("block_count", Type.INTEGER), col("rule_count", Type.INTEGER),
        col("protection_count", Type.INTEGER)),
    RUN_INPUTS("run_inputs", List.of("UNIQUE (run_id, ord)"), col("run_id", Type.TEXT),
        col("ord", Type.INTEGER), col("kind", Type.TEXT), col("name", Type.TEXT),
        col("sha256", Type.TEXT), col("content", Type.BLOB)),
    RUN_BLOCKS("run_blocks", List.of("UNIQUE (run_id, block_id)"), col("run_id", Type.TEXT),
        col("ord", Type.INTEGER), col("block_id", Type.TEXT), col("status", Type.TEXT),
        col("risk", Type.TEXT), col("protection_needed", Type.INTEGER),
        col("decision_json", Type.TEXT), col("rule_count", Type.INTEGER)),
    RUN_RULES("run_rules", List.of("UNIQUE (run_id, block_id, fire_seq)"),
        col("run_id", Type.TEXT), col("block_id", Type.TEXT), col("fire_seq", Type.INTEGER),
        col("rule_id", Type.TEXT), col("explanation", Type.TEXT), col("facts_json", Type.TEXT)),
    PROFILE_EDITS("profile_edits", List.of(), col("at", Type.TEXT), col("edited_by", Type.TEXT),
        col("file", Type.TEXT), col("crop", Type.TEXT), nullable("variety", Type.TEXT),
        nullable("stage", Type.TEXT), col("field", Type.TEXT), nullable("before_c", Type.REAL),
        nullable("after_c", Type.REAL), col("note", Type.TEXT)),
    CREW_ACTIONS("crew_actions", List.of(), col("at", Type.TEXT), col("recorded_at", Type.TEXT),
        col("night", Type.TEXT), col("block_id", Type.TEXT), col("kind", Type.TEXT),
        col("done_by", Type.TEXT), col("note", Type.TEXT), nullable("advised_run_id", Type.TEXT),
        nullable("warning", Type.TEXT)),
    /**
     * A change to a crop file, recorded as {@code pending} (with its edits, in one transaction)
     * before the file is written; a later row names the outcome and the pending row it settles.
     */
    FILE_CHANGES("file_changes", List.of(), col("at", Type.TEXT), col("file", Type.TEXT),
        col("state", Type.TEXT), nullable("settles_seq", Type.INTEGER),
        col("sha256_before", Type.TEXT), col("sha256_after", Type.TEXT),
        col("edit_count", Type.INTEGER), nullable("detail", Type.TEXT)),
    /**
     * Each schema step from version 3 on, in the chain: a version row in schema_version without
     * its chained step was added by hand.
     */
    SCHEMA_STEPS("schema_steps", List.of("UNIQUE (version)"), col("version", Type.INTEGER),
        col("applied_at", Type.TEXT), col("description", Type.TEXT)),
    WATCH_ALARMS("watch_alarms", List.of(), col("at", Type.TEXT), col("night", Type.TEXT),
        col("block_id", Type.TEXT), col("kind", Type.TEXT), col("level", Type.INTEGER),
        col("message", Type.TEXT), nullable("run_id", Type.TEXT),
        nullable("command_status", Type.TEXT));

    final String sql;
    final List<String> constraints;
    final List<Col> cols;

    Table(String sql, List<String> constraints, Col... cols) {
      this.sql = sql;
      this.constraints = constraints;
      this.cols = List.of(cols);
    }

    static Table ofSql(String name) {
      for (Table t : values()) {
        if (t.sql.equals(name)) {
          return t;
        }
      }
      return null;
    }

    int index(String column) {
      for (int i = 0; i < cols.size(); i++) {
        if (cols.get(i).name().equals(column)) {
          return i;
        }
      }
      throw new IllegalArgumentException(sql + " has no column " + column);
    }

    String columnList() {
      return cols.stream().map(Col::name).collect(Collectors.joining(", "));
    }

    String createSql() {
      List<String> parts = new ArrayList<>();
      parts.add("seq INTEGER PRIMARY KEY");
      cols.forEach(c -> parts.add(c.ddl()));
      parts.addAll(constraints);
      return "CREATE TABLE " + sql + " (" + String.join(", ", parts) + ")";
    }

    String insertSql() {
      return "INSERT INTO " + sql + " (seq, " + columnList() + ") VALUES (?"
          + ", ?".repeat(cols.size()) + ")";
    }

    String selectBySeqSql() {
      return "SELECT " + columnList() + " FROM " + sql + " WHERE seq = ?";
    }
  }

  /** One schema step; steps run in order, each in the migrating transaction. */
  record Migration(int version, String description, List<String> statements) {}

  /** Add a step at the end; never change one that has been released. */
  static final List<Migration> MIGRATIONS = List.of(
      new Migration(1, "hash-chained runs, inputs, blocks, rules and profile edits", v1()),
      new Migration(2, "what the crew did: sprinklers and covers on and off", v2()),
      new Migration(3, "crop-file changes recorded before they are written; schema steps chained",
          v3()),
      new Migration(4, "the night watch's alarms; inputs stored once by content hash", v4()));

  static int latestVersion() {
    return MIGRATIONS.get(MIGRATIONS.size() - 1).version();
  }

  private static List<String> v1() {
    List<String> s = new ArrayList<>();
    s.add("CREATE TABLE records (seq INTEGER PRIMARY KEY, kind TEXT NOT NULL,"
        + " prev_hash TEXT NOT NULL, hash TEXT NOT NULL)");
    for (Table t : List.of(Table.RUNS, Table.RUN_INPUTS, Table.RUN_BLOCKS, Table.RUN_RULES,
        Table.PROFILE_EDITS)) {
      s.add(t.createSql());
    }
    s.add("CREATE INDEX runs_by_night ON runs (night, ran_at)");
    s.add("CREATE INDEX runs_by_time ON runs (ran_at)");
    s.add("CREATE INDEX blocks_by_block ON run_blocks (block_id, run_id)");
    for (String t : List.of("records", "runs", "run_inputs", "run_blocks", "run_rules",
        "profile_edits")) {
      s.addAll(appendOnly(t));
    }
    return List.copyOf(s);
  }

  private static List<String> v2() {
    List<String> s = new ArrayList<>();
    s.add(Table.CREW_ACTIONS.createSql());
    s.add("CREATE INDEX crew_actions_by_night ON crew_actions (night, block_id, at)");
    s.addAll(appendOnly("crew_actions"));
    return List.copyOf(s);
  }

  private static List<String> v3() {
    List<String> s = new ArrayList<>();
    s.add(Table.FILE_CHANGES.createSql());
    s.add("CREATE INDEX file_changes_by_settled ON file_changes (settles_seq)");
    s.add(Table.SCHEMA_STEPS.createSql());
    s.addAll(appendOnly("file_changes"));
    s.addAll(appendOnly("schema_steps"));
    return List.copyOf(s);
  }

  private static List<String> v4() {
    List<String> s = new ArrayList<>();
    s.add(Table.WATCH_ALARMS.createSql());
    s.add("CREATE INDEX watch_alarms_by_night ON watch_alarms (night, block_id, kind)");
    // A run's input whose bytes are already in the trail is stored empty and found by its hash.
    s.add("CREATE INDEX run_inputs_by_sha ON run_inputs (sha256)");
    s.addAll(appendOnly("watch_alarms"));
    return List.copyOf(s);
  }

  /**
   * Defence in depth: the tool never changes a recorded row, and neither may a stray UPDATE or
   * DELETE. Every new audit table gets these in the step that creates it.
   */
  static List<String> appendOnly(String table) {
    List<String> s = new ArrayList<>();
    for (String op : List.of("UPDATE", "DELETE")) {
      s.add("CREATE TRIGGER " + table + "_no_" + op.toLowerCase(Locale.ROOT) + " BEFORE " + op
          + " ON " + table + " BEGIN SELECT RAISE(ABORT, 'the audit trail is append-only: " + op
          + " on " + table + " is refused'); END");
    }
    return s;
  }

  /** Brings the schema to the latest version; the caller holds an IMMEDIATE transaction. */
  static void migrate(Connection c, Path file, Clock clock) throws SQLException {
    try (Statement st = c.createStatement()) {
      st.execute("CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY,"
          + " applied_at TEXT NOT NULL, description TEXT NOT NULL)");
      int current = currentVersion(c);
      checkVersionRows(c, file);
      if (current > latestVersion()) {
        throw new AuditUnavailableException("audit database " + file + " has schema version "
            + current + ", newer than this rimeward understands (" + latestVersion()
            + "); use the rimeward version that wrote it, or a newer one");
      }
      for (Migration m : MIGRATIONS) {
        if (m.version() <= current) {
          continue;
        }
        for (String sql : m.statements()) {
          st.execute(sql);
        }
        try (PreparedStatement ps = c.prepareStatement(
            "INSERT INTO schema_version (version, applied_at, description) VALUES (?, ?, ?)")) {
          ps.setInt(1, m.version());
          ps.setString(2, clock.instant().toString());
          ps.setString(3, m.description());
          ps.executeUpdate();
        }
        if (m.version() >= 3) {
          try (ChainWriter w = new ChainWriter(c)) {
            w.append(Table.SCHEMA_STEPS, (long) m.version(), clock.instant().toString(),
                m.description());
          }
        }
      }
    }
  }

  /**
   * Every version row from 3 on must have its step in the chain: rimeward writes both in one
   * transaction. A row without one was added by hand, to make a reader refuse the trail as "too
   * new" or to hide a table; that is tampering, not a newer rimeward.
   *
   * @throws AuditIntegrityException naming the version row
   */
  static void checkVersionRows(Connection c, Path file) throws SQLException {
    boolean chained = hasTable(c, Table.SCHEMA_STEPS.sql);
    try (Statement st = c.createStatement();
        ResultSet rs = st.executeQuery("SELECT version FROM schema_version WHERE version >= 3"
            + " ORDER BY version")) {
      while (rs.next()) {
        int v = rs.getInt(1);
        if (!chained || StoredRow.select(c, Table.SCHEMA_STEPS, "t.version = ?", (long) v)
            .isEmpty()) {
          throw new AuditIntegrityException("audit database " + file + ": schema version row " + v
              + " is not matched by a schema step in the chain: it was added outside rimeward."
              + " Keep a copy of the file as it is, for inspection");
        }
      }
    }
  }

  private static boolean hasTable(Connection c, String name) throws SQLException {
    try (PreparedStatement ps = c.prepareStatement(
        "SELECT count(*) FROM sqlite_master WHERE type = 'table' AND name = ?")) {
      ps.setString(1, name);
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next() && rs.getInt(1) > 0;
      }
    }
  }

  /** The schema version of an open file; 0 for a file rimeward never wrote. */
  static int currentVersion(Connection c) throws SQLException {
    if (!hasTable(c, "schema_version")) {
      return 0;
    }
    try (Statement st = c.createStatement();
        ResultSet rs = st.executeQuery("SELECT coalesce(max(version), 0) FROM schema_version")) {
      return rs.next() ? rs.getInt(1) : 0;
    }
  }
}
