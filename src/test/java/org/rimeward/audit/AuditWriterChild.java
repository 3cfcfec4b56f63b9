package org.rimeward.audit;

import java.nio.file.Path;
import java.time.Instant;
import java.util.Random;

/**
 * A separate program that appends runs of a known shape to an audit file, for the crash and
 * concurrency tests: {@code DBFILE SEED MAXRUNS(0 = until killed) TAG}. It prints {@code ready}
 * once the store is open and {@code ok RUNID} after each run is committed.
 */
public final class AuditWriterChild {
  static final int INPUTS = 3;
  static final int INPUT_BYTES = 32 * 1024;
  static final int BLOCKS = 4;
  static final int RULES_PER_BLOCK = 3;

  private AuditWriterChild() {}

  public static void main(String[] args) {
    Path db = Path.of(args[0]);
    Random random = new Random(Long.parseLong(args[1]));
    int max = Integer.parseInt(args[2]);
    String tag = args[3];
    try (AuditStore store = AuditStore.open(db)) {
      System.out.println("ready");
      System.out.flush();
      for (int i = 0; max == 0 || i < max; i++) {
        String id = tag + "-" + i;
        store.appendRun(AuditSamples.shapedRun(id, Instant.now(), random, INPUTS, INPUT_BYTES,
            BLOCKS, RULES_PER_BLOCK));
        System.out.println("ok " + id);
        System.out.flush();
      }
    }
  }
}
