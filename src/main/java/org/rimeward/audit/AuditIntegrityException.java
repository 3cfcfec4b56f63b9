package org.rimeward.audit;

/**
 * A recorded row no longer matches what was written: the trail was altered or damaged. Reading
 * stops rather than hand a changed record to a replay or a report.
 */
public final class AuditIntegrityException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public AuditIntegrityException(String message) {
    super(message);
  }
}
