package org.rimeward.units;

import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.regex.Pattern;

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

  private static final String NUMBER = "[-+−]?\\d[\\d,]*(?:\\.\\d+)?";
  private static final String METRIC_UNIT = "(?:°C|g/m²|g/m2|m³/h|m3/h|m³|m3|m/s|mm/h|ha)";
  private static final String US_UNIT = "(?:°F|oz/yd²|oz/yd2|gpm|gal|mph|in/h|ac)";
  /** {@code -1.1 °C (30.0 °F)}: a metric figure with its US one beside it. */
  private static final Pattern METRIC_THEN_US = Pattern.compile(
      NUMBER + " ?" + METRIC_UNIT + " \\((" + NUMBER + " ?" + US_UNIT + ")\\)");
  /** {@code 5.0 °F (2.78 °C)}: a US figure with its metric one beside it. */
  private static final Pattern US_THEN_METRIC = Pattern.compile(
      "(" + NUMBER + " ?" + US_UNIT + ") \\(" + NUMBER + " ?" + METRIC_UNIT + "\\)");

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

  /**
   * A text that quotes figures in both systems, {@code -1.1 °C (30.0 °F)} or {@code 5.0 °F
   * (2.78 °C)} (a source note, a crop table's tolerance), for this system's reader: in US units
   * the US figure alone, so no metric unit is left; metric text stays as written, the source's
   * own figure beside ours.
   */
  public String quoted(String text) {
    if (system != UnitSystem.US || text == null) {
      return text;
    }
    String us = METRIC_THEN_US.matcher(text).replaceAll("$1");
    return US_THEN_METRIC.matcher(us).replaceAll("$1");
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
