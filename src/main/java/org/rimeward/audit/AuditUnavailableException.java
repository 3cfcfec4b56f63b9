package org.rimeward.audit;

/**
 * The audit database cannot be opened or written: read-only, locked by another program for too
 * long, disk full, damaged, or missing. The message names the file, the cause and what to do.
 * Nothing of the record being written was kept.
 */
public final class AuditUnavailableException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public AuditUnavailableException(String message, Throwable cause) {
    super(message, cause);
  }

  public AuditUnavailableException(String message) {
    super(message);
  }
}
