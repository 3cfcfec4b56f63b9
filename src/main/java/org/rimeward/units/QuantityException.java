package org.rimeward.units;

/** A quantity that could not be read: a missing or unknown unit, or no number. */
public final class QuantityException extends IllegalArgumentException {
  private static final long serialVersionUID = 1L;

  public QuantityException(String message) {
    super(message);
  }
}
