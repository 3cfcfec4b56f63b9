package org.rimeward.crop;

/**
 * Where the editor reports a change around writing it: the audit trail, or nothing. The editor
 * holds the crop file's lock across both calls.
 */
public interface EditJournal {
  /** Records nothing: for {@code --no-audit}. */
  EditJournal NONE = new EditJournal() {
    @Override
    public void beforeWrite(PendingChange change) {}

    @Override
    public void afterWrite(PendingChange change) {}
  };

  /** The write failed after {@link #beforeWrite}; the file is unchanged. */
  default void notWritten(PendingChange change, String why) {}

  /**
   * The change is about to be written. Record it durably or throw: when this throws, the file is
   * not touched.
   */
  void beforeWrite(PendingChange change);

  /**
   * The change is in the file. When this throws, the change stays in the file and its pending
   * record stands, for the next command to settle.
   */
  void afterWrite(PendingChange change);
}
