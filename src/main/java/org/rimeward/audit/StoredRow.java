package org.rimeward.audit;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import org.rimeward.audit.Schema.Col;
import org.rimeward.audit.Schema.Table;

/**
 * One content row of the trail, read back with its chain record and checked against its hash as
 * it is read. Values are looked up by column name, so a reader never counts positions.
 */
record StoredRow(Table table, long seq, List<Object> values) {
  String text(String column) {
    return (String) values.get(table.index(column));
  }

  Long integer(String column) {
    return (Long) values.get(table.index(column));
  }

  Double real(String column) {
    return (Double) values.get(table.index(column));
  }

  byte[] blob(String column) {
    return (byte[]) values.get(table.index(column));
  }

  /** "record 12 (run_blocks, run R block B)": how messages name a record. */
  String describe() {
    return "record " + seq + " (" + table.sql + ", " + describe(table, values) + ")";
  }

  static String describe(Table t, List<Object> v) {
    StoredRow r = new StoredRow(t, 0, v);
    return switch (t) {
      case RUNS -> "run " + r.text("run_id");
      case RUN_INPUTS -> "run " + r.text("run_id") + " input " + r.text("name");
      case RUN_BLOCKS -> "run " + r.text("run_id") + " block " + r.text("block_id");
      case RUN_RULES -> "run " + r.text("run_id") + " block " + r.text("block_id") + " rule #"
          + r.integer("fire_seq") + " " + r.text("rule_id");
      case PROFILE_EDITS -> "profile edit at " + r.text("at") + " of " + r.text("file") + " "
          + r.text("field");
      case CREW_ACTIONS -> "crew action " + r.text("kind") + " on " + r.text("block_id") + " at "
          + r.text("at");
      case FILE_CHANGES -> "change of " + r.text("file") + " " + r.text("state");
      case SCHEMA_STEPS -> "schema step " + r.integer("version");
      case WATCH_ALARMS -> "watch alarm " + r.text("kind") + " on " + r.text("block_id") + " at "
          + r.text("at");
    };
  }

  /**
   * The rows of {@code t} matching {@code where} (over alias {@code t}), each checked against its
   * chain hash.
   *
   * @throws AuditIntegrityException at the first row that does not match its hash
   */
  static List<StoredRow> select(Connection conn, Table t, String where, Object... params)
      throws SQLException {
    String sql = "SELECT t.seq, r.prev_hash, r.hash, " + t.cols.stream().map(c -> "t." + c.name())
        .collect(Collectors.joining(", ")) + " FROM " + t.sql
        + " t LEFT JOIN records r ON r.seq = t.seq AND r.kind = '" + t.sql + "' WHERE " + where;
    List<StoredRow> out = new ArrayList<>();
    try (PreparedStatement ps = conn.prepareStatement(sql)) {
      for (int i = 0; i < params.length; i++) {
        ps.setObject(i + 1, params[i]);
      }
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          long seq = rs.getLong(1);
          StoredRow row = new StoredRow(t, seq, readValues(rs, t, 4));
          String prev = rs.getString(2);
          if (prev == null || !ChainHash.of(t.sql, seq, prev, row.values).equals(rs.getString(3))) {
            throw new AuditIntegrityException(row.describe() + " does not match its chain hash:"
                + " the trail was changed or damaged; run 'rimeward audit verify'");
          }
          out.add(row);
        }
      }
    }
    return out;
  }

  /** The columns of {@code t} from result column {@code first} on, typed as the chain hashes them. */
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
}
