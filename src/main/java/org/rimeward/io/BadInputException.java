package org.rimeward.io;

/**
 * Input that Rimeward cannot use: a file, line or field with a value that is wrong, and what to do
 * about it. The command line turns it into one message and exit code 2.
 */
public final class BadInputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  public BadInputException(String message) {
    super(message);
  }

  public BadInputException(String message, Throwable cause) {
    super(message, cause);
  }

  /** {@code where} is a file name with an optional {@code :line}; the message follows it. */
  public static BadInputException at(String where, String message) {
    return new BadInputException(where + ": " + message);
  }
}
