package org.rimeward.units;

import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/**
 * How Rimeward shows numbers and times to a person in one unit system: the one place that says
 * how many decimals a temperature, a rate, a flow or a volume gets and how a clock time reads.
 * Machine formats (JSON, CSV) stay metric and do not use it.
 */
public final class UnitFormat {
  private static final UnitFormat METRIC = new UnitFormat(UnitSystem.METRIC);
  private static final UnitFormat US = new UnitFormat(UnitSystem.US);
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);
  private static final DateTimeFormatter DAY_CLOCK =
      DateTimeFormatter.ofPattern("EEE HH:mm", Locale.ENGLISH);
  private static final DateTimeFormatter STAMP =
      DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss", Locale.ROOT);

  private final UnitSystem system;

  private UnitFormat(UnitSystem system) {
    this.system = system;
  }

  public static UnitFormat of(UnitSystem system) {
    return system == UnitSystem.US ? US : METRIC;
  }

  public UnitSystem system() {
    return system;
  }

  /** A temperature to 0.1 degree: {@code -2.2 °C}, {@code 28.0 °F}. */
  public String temp(double c) {
    return Quantities.format(c, Dimension.TEMPERATURE, system, 1);
  }

  /** A temperature difference to 0.1 degree. */
  public String tempDelta(double c) {
    return Quantities.format(c, Dimension.TEMPERATURE_DELTA, system, 1);
  }

  /** An application rate: 0.1 mm/h, or 0.01 in/h (a tenth of an inch would hide the answer). */
  public String rate(double mmH) {
    return Quantities.format(mmH, Dimension.RATE, system, system == UnitSystem.US ? 2 : 1);
  }

  /** A flow in whole m³/h or gpm. */
  public String flow(double m3H) {
    return Quantities.format(m3H, Dimension.FLOW, system, 0);
  }

  /** A volume in whole m³ or gallons. */
  public String volume(double m3) {
    return Quantities.format(m3, Dimension.VOLUME, system, 0);
  }

  /** An area to 0.1 ha or acre. */
  public String area(double ha) {
    return Quantities.format(ha, Dimension.AREA, system, 1);
  }

  /** A height to 0.1 m or ft. */
  public String length(double m) {
    return Quantities.format(m, Dimension.LENGTH, system, 1);
  }

  /** A wind speed to 0.1 m/s or mph. */
  public String speed(double ms) {
    return Quantities.format(ms, Dimension.SPEED, system, 1);
  }

  /** A temperature in the display unit, as a bare number for a chart axis. */
  public double tempValue(double c) {
    return Quantities.display(c, Dimension.TEMPERATURE, system);
  }

  /** A flow in the display unit, as a bare number. */
  public double flowValue(double m3H) {
    return Quantities.display(m3H, Dimension.FLOW, system);
  }

  /** A volume in the display unit, as a bare number. */
  public double volumeValue(double m3) {
    return Quantities.display(m3, Dimension.VOLUME, system);
  }

  /** The display symbol of a dimension: {@code °C}, {@code gpm}. */
  public String symbol(Dimension dim) {
    return Quantities.symbol(dim, system);
  }

  /** A local clock time, {@code 00:46}; {@code ?} when there is none. */
  public String clock(OffsetDateTime t) {
    return t == null ? "?" : CLOCK.format(t);
  }

  /** A local day and clock time, {@code Wed 00:46}. */
  public String dayClock(OffsetDateTime t) {
    return t == null ? "?" : DAY_CLOCK.format(t);
  }

  /** A local date and time to the second, {@code 2026-04-14 20:15:03}. */
  public String stamp(OffsetDateTime t) {
    return t == null ? "?" : STAMP.format(t);
  }
}
