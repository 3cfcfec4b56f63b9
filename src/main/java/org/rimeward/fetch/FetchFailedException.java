package org.rimeward.fetch;

/**
 * The service could not be reached, or did not answer with a forecast: the message names the
 * service, what happened (the HTTP status, a timeout) and what to try. Nothing was written.
 */
public final class FetchFailedException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public FetchFailedException(String message) {
    super(message);
  }

  public FetchFailedException(String message, Throwable cause) {
    super(message, cause);
  }
}
