package org.rimeward.farm;

import java.util.Locale;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The temperature a block is protected to: either the stage's 10 % kill temperature (T10) from
 * the crop profile, or a fixed temperature the grower chose.
 */
public record Target(Kind kind, OptionalDouble tempC) {
  /** Lowest and highest fixed target accepted, °C; spring bud critical temperatures lie inside. */
  public static final double MIN_FIXED_C = -20.0;
  public static final double MAX_FIXED_C = 5.0;

  public enum Kind {
    /** The crop stage's 10 % kill temperature, looked up by the planner. */
    T10,
    /** A fixed air temperature in °C. */
    FIXED
  }

  public Target {
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(tempC, "tempC");
    if (kind == Kind.T10 && tempC.isPresent()) {
      throw new IllegalArgumentException("a t10 target carries no temperature, got " + tempC);
    }
    if (kind == Kind.FIXED) {
      if (tempC.isEmpty()) {
        throw new IllegalArgumentException("a fixed target needs a temperature");
      }
      double t = tempC.getAsDouble();
      if (!(t >= MIN_FIXED_C && t <= MAX_FIXED_C)) {
        throw new IllegalArgumentException(String.format(Locale.ROOT,
            "target %.2f °C is outside %.0f to %.0f °C", t, MIN_FIXED_C, MAX_FIXED_C));
      }
    }
  }

  public static Target t10() {
    return new Target(Kind.T10, OptionalDouble.empty());
  }

  public static Target fixed(double tempC) {
    return new Target(Kind.FIXED, OptionalDouble.of(tempC));
  }

  public boolean isT10() {
    return kind == Kind.T10;
  }

  /** {@code t10} or the temperature, e.g. {@code -1.50 °C}. */
  @Override
  public String toString() {
    return isT10() ? "t10" : String.format(Locale.ROOT, "%.2f °C", tempC.getAsDouble());
  }
}
