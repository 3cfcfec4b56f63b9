package org.rimeward.audit;

import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import java.util.stream.Collectors;

/** The audit tables, their columns as the chain hashes them, and the ordered schema migrations. */
final class Schema {
  enum Type { TEXT, INTEGER, REAL, BLOB }

  record Col(String name, Type type) {}

  /**
   * A table whose every row is one chain record. The row's {@code seq} is its place in the chain;
   * {@code cols} are hashed in this order.
   */
  enum Table {
    RUNS("runs", col("run_id", Type.TEXT), col("ran_at", Type.TEXT), col("tool_version", Type.TEXT),
        col("farm_name", Type.TEXT), col("night", Type.TEXT), col("zone_id", Type.TEXT),
        col("policy_json", Type.TEXT), col("cautions_json", Type.TEXT), col("plan_json", Type.TEXT),
        col("input_count", Type.INTEGER), col("block_count", Type.INTEGER),
        col("rule_count", Type.INTEGER), col("protection_count", Type.INTEGER)),
    RUN_INPUTS("run_inputs", col("run_id", Type.TEXT), col("ord", Type.INTEGER),
        col("kind", Type.TEXT), col("name", Type.TEXT), col("sha256", Type.TEXT),
        col("content", Type.BLOB)),
    RUN_BLOCKS("run_blocks", col("run_id", Type.TEXT), col("ord", Type.INTEGER),
        col("block_id", Type.TEXT), col("status", Type.TEXT), col("risk", Type.TEXT),
        col("protection_needed", Type.INTEGER), col("decision_json", Type.TEXT),
        col("rule_count", Type.INTEGER)),
    RUN_RULES("run_rules", col("run_id", Type.TEXT), col("block_id", Type.TEXT),
        col("fire_seq", Type.INTEGER), col("rule_id", Type.TEXT), col("explanation", Type.TEXT),
        col("facts_json", Type.TEXT)),
    PROFILE_EDITS("profile_edits", col("at", Type.TEXT), col("edited_by", Type.TEXT),
        col("file", Type.TEXT), col("crop", Type.TEXT), col("variety", Type.TEXT),
        col("stage", Type.TEXT), col("field", Type.TEXT), col("before_c", Type.REAL),
        col("after_c", Type.REAL), col("note", Type.TEXT));

    final String sql;
    final List<Col> cols;

    Table(String sql, Col... cols) {
      this.sql = sql;
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

    String columnList() {
      return cols.stream().map(Col::name).collect(Collectors.joining(", "));
    }

    String insertSql() {
      return "INSERT INTO " + sql + " (seq, " + columnList() + ") VALUES (?"
          + ", ?".repeat(cols.size()) + ")";
    }

    String selectBySeqSql() {
      return "SELECT " + columnList() + " FROM " + sql + " WHERE seq = ?";
    }
  }

  private static Col col(String name, Type type) {
    return new Col(name, type);
  }

  /** One schema step; steps run in order, each in the migrating transaction. */
  record Migration(int version, String description, List<String> statements) {}

  static final List<Migration> MIGRATIONS = List.of(
      new Migration(1, "hash-chained runs, inputs, blocks, rules and profile edits", v1()));

  static int latestVersion() {
    return MIGRATIONS.get(MIGRATIONS.size() - 1).version();
  }

  private static List<String> v1() {
    List<String> s = new java.util.ArrayList<>(List.of(
        "CREATE TABLE records (seq INTEGER PRIMARY KEY, kind TEXT NOT NULL,"
            + " prev_hash TEXT NOT NULL, hash TEXT NOT NULL)",
        "CREATE TABLE runs (seq INTEGER PRIMARY KEY, run_id TEXT NOT NULL UNIQUE,"
            + " ran_at TEXT NOT NULL, tool_version TEXT NOT NULL, farm_name TEXT NOT NULL,"
            + " night TEXT NOT NULL, zone_id TEXT NOT NULL, policy_json TEXT NOT NULL,"
            + " cautions_json TEXT NOT NULL, plan_json TEXT NOT NULL, input_count INTEGER NOT NULL,"
            + " block_count INTEGER NOT NULL, rule_count INTEGER NOT NULL,"
            + " protection_count INTEGER NOT NULL)",
        "CREATE TABLE run_inputs (seq INTEGER PRIMARY KEY, run_id TEXT NOT NULL,"
            + " ord INTEGER NOT NULL, kind TEXT NOT NULL, name TEXT NOT NULL, sha256 TEXT NOT NULL,"
            + " content BLOB NOT NULL, UNIQUE (run_id, ord))",
        "CREATE TABLE run_blocks (seq INTEGER PRIMARY KEY, run_id TEXT NOT NULL,"
            + " ord INTEGER NOT NULL, block_id TEXT NOT NULL, status TEXT NOT NULL,"
            + " risk TEXT NOT NULL, protection_needed INTEGER NOT NULL,"
            + " decision_json TEXT NOT NULL, rule_count INTEGER NOT NULL,"
            + " UNIQUE (run_id, block_id))",
        "CREATE TABLE run_rules (seq INTEGER PRIMARY KEY, run_id TEXT NOT NULL,"
            + " block_id TEXT NOT NULL, fire_seq INTEGER NOT NULL, rule_id TEXT NOT NULL,"
            + " explanation TEXT NOT NULL, facts_json TEXT NOT NULL,"
            + " UNIQUE (run_id, block_id, fire_seq))",
        "CREATE TABLE profile_edits (seq INTEGER PRIMARY KEY, at TEXT NOT NULL,"
            + " edited_by TEXT NOT NULL, file TEXT NOT NULL, crop TEXT NOT NULL, variety TEXT,"
            + " stage TEXT, field TEXT NOT NULL, before_c REAL, after_c REAL, note TEXT NOT NULL)",
        "CREATE INDEX runs_by_night ON runs (night, ran_at)",
        "CREATE INDEX runs_by_time ON runs (ran_at)",
        "CREATE INDEX blocks_by_block ON run_blocks (block_id, run_id)"));
    // Defence in depth: the tool never changes a recorded row, and neither may a stray UPDATE.
    for (String t : List.of("records", "runs", "run_inputs", "run_blocks", "run_rules",
        "profile_edits")) {
      for (String op : List.of("UPDATE", "DELETE")) {
        s.add("CREATE TRIGGER " + t + "_no_" + op.toLowerCase(java.util.Locale.ROOT)
            + " BEFORE " + op + " ON " + t + " BEGIN SELECT RAISE(ABORT, 'the audit trail is"
            + " append-only: " + op + " on " + t + " is refused'); END");
      }
    }
    return List.copyOf(s);
  }

  /** Brings the schema to the latest version; the caller holds an IMMEDIATE transaction. */
  static void migrate(Connection c, java.nio.file.Path file) throws SQLException {
    try (Statement st = c.createStatement()) {
      st.execute("CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY,"
          + " applied_at TEXT NOT NULL, description TEXT NOT NULL)");
      int current = currentVersion(c);
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
        try (var ps = c.prepareStatement(
            "INSERT INTO schema_version (version, applied_at, description) VALUES (?, ?, ?)")) {
          ps.setInt(1, m.version());
          ps.setString(2, java.time.Instant.now().toString());
          ps.setString(3, m.description());
          ps.executeUpdate();
        }
      }
    }
  }

  static int currentVersion(Connection c) throws SQLException {
    try (Statement st = c.createStatement();
        ResultSet rs = st.executeQuery("SELECT coalesce(max(version), 0) FROM schema_version")) {
      return rs.next() ? rs.getInt(1) : 0;
    }
  }
}
