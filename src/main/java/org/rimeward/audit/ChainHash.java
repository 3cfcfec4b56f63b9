package org.rimeward.audit;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;

/**
 * The hash of one chain record: SHA-256 over a canonical encoding of the record's table, sequence
 * number, the previous record's hash and every column value of its row. Each value is written with
 * a type tag and its length, so no two different rows encode to the same bytes (no ambiguity
 * between "ab"+"c" and "a"+"bc", nor between null and "").
 */
final class ChainHash {
  static final String GENESIS = "0".repeat(64);
  private static final byte[] DOMAIN = "rimeward-audit-chain/1".getBytes(StandardCharsets.US_ASCII);

  private ChainHash() {}

  static String of(String table, long seq, String prevHash, List<Object> values) {
    MessageDigest md;
    try {
      md = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("SHA-256 is required of every Java runtime", e);
    }
    md.update(DOMAIN);
    update(md, table);
    update(md, seq);
    update(md, prevHash);
    update(md, (long) values.size());
    for (Object v : values) {
      update(md, v);
    }
    return HexFormat.of().formatHex(md.digest());
  }

  private static void update(MessageDigest md, Object v) {
    if (v == null) {
      md.update((byte) 'N');
    } else if (v instanceof String s) {
      byte[] b = s.getBytes(StandardCharsets.UTF_8);
      md.update((byte) 'S');
      md.update(ByteBuffer.allocate(8).putLong(b.length).array());
      md.update(b);
    } else if (v instanceof Long l) {
      md.update((byte) 'I');
      md.update(ByteBuffer.allocate(8).putLong(l).array());
    } else if (v instanceof Double d) {
      md.update((byte) 'R');
      md.update(ByteBuffer.allocate(8).putLong(Double.doubleToLongBits(d)).array());
    } else if (v instanceof byte[] b) {
      md.update((byte) 'B');
      md.update(ByteBuffer.allocate(8).putLong(b.length).array());
      md.update(b);
    } else {
      throw new IllegalArgumentException("no canonical form for " + v.getClass());
    }
  }
}
