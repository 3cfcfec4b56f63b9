package org.rimeward.audit;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.sql.Types;
import java.util.EnumMap;
import java.util.Map;
import org.rimeward.audit.Schema.Col;
import org.rimeward.audit.Schema.Table;

/**
 * Appends rows to the hash chain within the caller's transaction. The head is read once, when the
 * writer is made inside that transaction, so two programs appending at once still form one chain:
 * the second waits for the first's transaction and then reads the head the first left.
 */
final class ChainWriter implements AutoCloseable {
  private final Connection conn;
  private final Map<Table, PreparedStatement> inserts = new EnumMap<>(Table.class);
  private final PreparedStatement chain;
  private long seq;
  private String hash;

  ChainWriter(Connection conn) throws SQLException {
    this.conn = conn;
    ChainHead head = ChainHead.read(conn);
    seq = head.seq();
    hash = head.hash();
    chain = conn.prepareStatement(
        "INSERT INTO records (seq, kind, prev_hash, hash) VALUES (?, ?, ?, ?)");
  }

  /** Appends one row of {@code t}, its values in the table's column order. */
  void append(Table t, Object... values) throws SQLException {
    if (values.length != t.cols.size()) {
      throw new IllegalArgumentException(t.sql + " takes " + t.cols.size() + " values, not "
          + values.length);
    }
    long next = seq + 1;
    String h = ChainHash.of(t.sql, next, hash, java.util.Arrays.asList(values));
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

  /** The head after the rows appended so far. */
  ChainHead head() {
    return new ChainHead(seq, hash);
  }

  private static void bind(PreparedStatement ps, int i, Col c, Object v) throws SQLException {
    if (v == null) {
      ps.setNull(i, Types.NULL);
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

  /** Used by {@link ChainHead#read}: the newest record, or the genesis head of an empty chain. */
  static ChainHead newest(Connection conn) throws SQLException {
    try (Statement st = conn.createStatement();
        ResultSet rs = st.executeQuery("SELECT seq, hash FROM records ORDER BY seq DESC LIMIT 1")) {
      return rs.next() ? new ChainHead(rs.getLong(1), rs.getString(2)) : ChainHead.EMPTY;
    }
  }
}
