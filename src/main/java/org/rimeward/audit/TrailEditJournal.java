package org.rimeward.audit;

import org.rimeward.crop.EditJournal;
import org.rimeward.crop.PendingChange;

/**
 * Records profile edits in the audit trail around the file write: the edits and a pending change
 * before the crop file is replaced, then that it was written. See {@link FileChanges} for the
 * invariant this keeps.
 */
public final class TrailEditJournal implements EditJournal {
  private final AuditStore store;
  private long pendingSeq = -1;
  private boolean confirmed;

  public TrailEditJournal(AuditStore store) {
    this.store = store;
  }

  @Override
  public void beforeWrite(PendingChange change) {
    pendingSeq = store.recordPendingChange(change);
  }

  @Override
  public void afterWrite(PendingChange change) {
    store.settleChange(pendingSeq, FileChanges.State.WRITTEN, null);
    confirmed = true;
  }

  @Override
  public void notWritten(PendingChange change, String why) {
    store.settleChange(pendingSeq, FileChanges.State.NOT_WRITTEN, why);
  }

  /** Whether the pending change was recorded (the file may have been written since). */
  public boolean pendingRecorded() {
    return pendingSeq >= 0;
  }

  /** Whether the write was confirmed in the trail (false when that last step failed). */
  public boolean confirmed() {
    return confirmed;
  }
}
