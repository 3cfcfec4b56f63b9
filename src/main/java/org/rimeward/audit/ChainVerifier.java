package org.rimeward.audit;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.rimeward.audit.Schema.Table;

/**
 * Walks the whole chain in sequence order and reports the first record that does not match: a
 * changed row, a missing one, one added outside the chain, or a run cut short. Runs inside the
 * caller's read transaction, so it checks one snapshot even while another program appends.
 *
 * <p>An unkeyed chain can be rebuilt whole by anyone who edits the file; that is only caught
 * against a head held elsewhere ({@link ChainHead}), which {@link #holds} checks.
 */
final class ChainVerifier implements AutoCloseable {
  private final Connection conn;
  private final Map<Table, PreparedStatement> bySeq = new EnumMap<>(Table.class);

  ChainVerifier(Connection conn) {
    this.conn = conn;
  }

  VerifyResult run() throws SQLException {
    try (Statement st = conn.createStatement();
        ResultSet rs = st.executeQuery("PRAGMA quick_check")) {
      String first = rs.next() ? rs.getString(1) : "no answer";
      if (!"ok".equals(first)) {
        return VerifyResult.broken(0, ChainHash.GENESIS, "the database file is damaged: " + first);
      }
    }
    return walk();
  }

  /**
   * Whether the trail still holds record {@code head.seq()} with hash {@code head.hash()}; empty
   * when it does, else what differs.
   */
  java.util.Optional<String> holds(ChainHead head) throws SQLException {
    if (head.seq() == 0) {
      return java.util.Optional.empty();
    }
    try (PreparedStatement ps = conn.prepareStatement("SELECT hash FROM records WHERE seq = ?")) {
      ps.setLong(1, head.seq());
      try (ResultSet rs = ps.executeQuery()) {
        if (!rs.next()) {
          return java.util.Optional.of("the trail has no record " + head.seq() + ": records up to"
              + " the head " + head + " were removed, or the trail was started again");
        }
        String h = rs.getString(1);
        return h.equals(head.hash()) ? java.util.Optional.empty()
            : java.util.Optional.of("record " + head.seq() + " has hash " + h + ", not " + head.hash()
                + ": the history up to that head was rewritten");
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
        String where = new StoredRow(t, seq, values).describe();
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
    VerifyResult outside = rowsOutsideTheChain(count, prev);
    if (outside != null) {
      return outside;
    }
    VerifyResult cut = runsCutShort(count, prev);
    return cut != null ? cut : VerifyResult.ok(count, prev);
  }

  private VerifyResult rowsOutsideTheChain(long count, String prev) throws SQLException {
    for (Table t : Table.values()) {
      try (PreparedStatement ps = conn.prepareStatement("SELECT t.seq FROM " + t.sql + " t"
          + " LEFT JOIN records r ON r.seq = t.seq AND r.kind = ? WHERE r.seq IS NULL"
          + " ORDER BY t.seq LIMIT 1")) {
        ps.setString(1, t.sql);
        try (ResultSet rs = ps.executeQuery()) {
          if (rs.next()) {
            long seq = rs.getLong(1);
            return VerifyResult.broken(count, prev, seq, "a row of " + t.sql + " ("
                + StoredRow.describe(t, content(t, seq)) + ", seq " + seq + ") is not in the chain:"
                + " it was added outside rimeward");
          }
        }
      }
    }
    return null;
  }

  private VerifyResult runsCutShort(long count, String prev) throws SQLException {
    String whole = "SELECT r.seq, r.run_id, r.input_count, r.block_count, r.rule_count,"
        + " (SELECT count(*) FROM run_inputs i WHERE i.run_id = r.run_id),"
        + " (SELECT count(*) FROM run_blocks b WHERE b.run_id = r.run_id),"
        + " (SELECT count(*) FROM run_rules u WHERE u.run_id = r.run_id)"
        + " FROM runs r ORDER BY r.seq";
    String[] what = {"inputs", "blocks", "rules"};
    try (Statement st = conn.createStatement(); ResultSet rs = st.executeQuery(whole)) {
      while (rs.next()) {
        for (int k = 0; k < what.length; k++) {
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
    return null;
  }

  private List<Object> content(Table t, long seq) throws SQLException {
    PreparedStatement ps = bySeq.get(t);
    if (ps == null) {
      ps = conn.prepareStatement(t.selectBySeqSql());
      bySeq.put(t, ps);
    }
    ps.setLong(1, seq);
    try (ResultSet rs = ps.executeQuery()) {
      return rs.next() ? StoredRow.readValues(rs, t, 1) : null;
    }
  }

  @Override
  public void close() throws SQLException {
    for (PreparedStatement ps : bySeq.values()) {
      ps.close();
    }
  }
}
