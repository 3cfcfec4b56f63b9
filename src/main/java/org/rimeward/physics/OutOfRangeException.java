package org.rimeward.physics;

/**
 * A physics input outside the range its method is valid for, or physically impossible (a dew point
 * above the air temperature). Never clamped: the caller must fix the input.
 */
public final class OutOfRangeException extends IllegalArgumentException {
  private static final long serialVersionUID = 1L;

  public OutOfRangeException(String message) {
    super(message);
  }
}
