package org.rimeward.audit;

import java.sql.Connection;
import java.sql.SQLException;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The newest record of the chain: its sequence number and hash, written {@code SEQ:HASH}. Held
 * somewhere the farm cannot rewrite (an insurer's file, a mail sent each night), it pins the whole
 * history up to it: a trail rebuilt or cut short since no longer holds that record with that hash.
 *
 * @param seq the record's place in the chain; 0 for an empty trail
 * @param hash its SHA-256, 64 lower-case hex digits; 64 zeros for an empty trail
 */
public record ChainHead(long seq, String hash) {
  /** The head of a trail with no records. */
  public static final ChainHead EMPTY = new ChainHead(0, ChainHash.GENESIS);

  private static final Pattern FORM = Pattern.compile("(\\d{1,18}):([0-9a-fA-F]{64})");

  public ChainHead {
    if (seq < 0) {
      throw new IllegalArgumentException("seq must not be negative: " + seq);
    }
    if (hash == null || !hash.matches("[0-9a-f]{64}")) {
      throw new IllegalArgumentException("hash must be 64 lower-case hex digits: " + hash);
    }
  }

  /**
   * Reads {@code SEQ:HASH} as {@code audit head} prints it.
   *
   * @throws IllegalArgumentException naming what is wrong with the text
   */
  public static ChainHead parse(String text) {
    Matcher m = FORM.matcher(text == null ? "" : text.strip());
    if (!m.matches()) {
      throw new IllegalArgumentException("'" + text + "' is not SEQ:HASH (a record number, a"
          + " colon and 64 hex digits, as 'rimeward audit head' prints it)");
    }
    return new ChainHead(Long.parseLong(m.group(1)), m.group(2).toLowerCase(java.util.Locale.ROOT));
  }

  static ChainHead read(Connection conn) throws SQLException {
    return ChainWriter.newest(conn);
  }

  @Override
  public String toString() {
    return seq + ":" + hash;
  }
}
