package org.rimeward.audit;

import java.util.Optional;

/**
 * The outcome of walking the whole chain.
 *
 * @param recordCount the chain records checked (all of them when intact, those before the break
 *     otherwise)
 * @param headHash the hash of the last record, worth writing down elsewhere: it pins the whole
 *     history up to then, including against deletion of the newest runs; 64 zeros when empty
 * @param problem what did not match and where, empty when the chain is intact
 * @param brokenSeq the sequence number of the first record that does not match, when known
 */
public record VerifyResult(long recordCount, String headHash, Optional<String> problem,
    Optional<Long> brokenSeq) {
  public boolean intact() {
    return problem.isEmpty();
  }

  static VerifyResult ok(long count, String head) {
    return new VerifyResult(count, head, Optional.empty(), Optional.empty());
  }

  static VerifyResult broken(long checked, String head, long seq, String problem) {
    return new VerifyResult(checked, head, Optional.of(problem), Optional.of(seq));
  }

  static VerifyResult broken(long checked, String head, String problem) {
    return new VerifyResult(checked, head, Optional.of(problem), Optional.empty());
  }
}
