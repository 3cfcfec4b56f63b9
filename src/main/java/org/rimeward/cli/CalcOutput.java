package org.rimeward.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.util.Map;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Model.CommandSpec;

/** What the calc commands share: the display units, reading quantities, printing a result. */
final class CalcOutput {
  static final String TEMP_UNITS = "a temperature such as -2.2C or 28F; a bare number is °C,"
      + " or °F with --units us";
  private static final ObjectMapper JSON = org.rimeward.io.Json.mapper();

  private CalcOutput() {}

  static UnitSystem units(CommandSpec spec) {
    return UnitsOption.of(spec);
  }

  static double temperature(String text, String option, UnitSystem units) {
    return Quantities.parse(text, Dimension.TEMPERATURE, option, units);
  }

  /** Prints one JSON object (metric, insertion order kept) and a line break. */
  static void printJson(CommandSpec spec, Map<String, Object> fields) {
    try {
      spec.commandLine().getOut().println(JSON.writeValueAsString(fields));
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("could not write JSON", e);
    }
  }

  static void printLine(CommandSpec spec, String line) {
    spec.commandLine().getOut().println(line);
  }

  /** Rounds for output only; the physics keeps full precision. */
  static double round(double value, int decimals) {
    double f = Math.pow(10, decimals);
    double r = Math.round(value * f) / f;
    return r == 0 ? 0.0 : r;
  }

  static String temp(double c, UnitSystem units) {
    return UnitFormat.of(units).temp(c);
  }

  static String delta(double c, UnitSystem units) {
    return UnitFormat.of(units).tempDelta(c);
  }
}
