package org.rimeward.weather;

import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import java.time.Instant;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.QuantityException;

/**
 * What the weather services' readers share: parsing, units named by the file converted through
 * the one unit table, the check that a response is for the farm's point, and one step built with
 * messages that name the file, the time and the property.
 */
final class JsonInput {
  /** Beyond this the response is for another place, km: a Rimeward choice, a few model cells. */
  static final double REFUSE_BEYOND_KM = 30;
  /** Beyond this the plan says how far the forecast point is, km. */
  static final double NOTE_BEYOND_KM = 5;
  /**
   * A dew point this little above the air temperature is the service's rounding of a saturated
   * hour and is read as saturated; more is refused. Services round both to 0.1 °C (Open-Meteo,
   * MET Norway) or convert from whole °F (NWS), so 0.5 °C covers their rounding.
   */
  static final double DEW_ROUNDING_C = 0.5;

  private static final ObjectMapper READER = JsonMapper.builder()
      .enable(JsonParser.Feature.STRICT_DUPLICATE_DETECTION).build();

  private JsonInput() {}

  /** The text parsed as JSON, or null when it does not begin like a JSON object. */
  static JsonNode parseIfJson(String file, String text) {
    String t = text.stripLeading();
    if (!t.startsWith("{")) {
      return null;
    }
    try {
      return READER.readTree(t);
    } catch (JsonProcessingException e) {
      throw BadInputException.at(file, "looks like JSON but does not parse (line "
          + e.getLocation().getLineNr() + ", column " + e.getLocation().getColumnNr() + ": "
          + e.getOriginalMessage() + "); save the service's response unchanged, or fetch it again"
          + " with 'rimeward forecast fetch'");
    }
  }

  /** Converts a value in a unit the file names into the canonical unit, via the unit table. */
  record Unit(String label, double scale, double offset) {
    double canonical(double v) {
      return v * scale + offset;
    }
  }

  /**
   * The unit {@code label} as the file writes it, mapped by {@code symbol} to the unit table's
   * name; a label the table does not know is refused with the property and the file.
   */
  static Unit unit(String file, String property, String label, String symbol, Dimension dim) {
    try {
      double zero = Quantities.parse("0 " + symbol, dim, property);
      double one = Quantities.parse("1 " + symbol, dim, property);
      return new Unit(label, one - zero, zero);
    } catch (QuantityException e) {
      throw new BadInputException(file + ": " + property + ": unit '" + label + "' is not one"
          + " Rimeward reads; ask the service for " + dim.examples(), e);
    }
  }

  static BadInputException missing(String file, String property, String what) {
    return BadInputException.at(file, "no " + property + " (" + what + ") in the response;"
        + " ask the service for it, or fetch with 'rimeward forecast fetch', which asks for every"
        + " quantity Rimeward needs");
  }

  /** A note when the response's point is some way off; a refusal when it is for another place. */
  static Optional<String> checkPoint(String file, String service, double lat, double lon, Site site) {
    double km = site.distanceKm(lat, lon);
    if (km > REFUSE_BEYOND_KM) {
      throw BadInputException.at(file, String.format(Locale.ROOT, "this %s response is for %.4f,"
          + " %.4f, %.0f km from the farm (%.4f, %.4f); fetch the forecast for the farm's point"
          + " ('rimeward forecast fetch') or check the farm's latitude and longitude",
          service, lat, lon, km, site.latitude(), site.longitude()));
    }
    if (km > NOTE_BEYOND_KM) {
      return Optional.of(String.format(Locale.ROOT, "the %s forecast point (%.4f, %.4f) is %.1f km"
          + " from the farm", service, lat, lon, km));
    }
    return Optional.empty();
  }

  /** The values of one hour, canonical units; humidity as a dew point or, if NaN, as rhPct. */
  record Values(double airC, double dewC, double rhPct, double windMs, double cloudPct,
      OptionalDouble solarWm2) {}

  /**
   * One step; a value out of range is refused naming the file, the time and the property. A dew
   * point up to {@link #DEW_ROUNDING_C} above the air is read as saturated.
   */
  static ForecastStep step(String file, Instant time, Site site, Values v, Names names,
      double windHeightM) {
    String at = time.atZone(site.zone()).toOffsetDateTime().toString();
    range(file, at, names.air(), v.airC(), ForecastStep.MIN_TEMP_C, ForecastStep.MAX_TEMP_C, "°C");
    double dewC;
    if (Double.isNaN(v.dewC())) {
      if (!(v.rhPct() > 0 && v.rhPct() <= 100)) {
        throw BadInputException.at(file, names.rh() + " at " + at + ": " + v.rhPct()
            + " % is outside above 0 to 100 %; check the file");
      }
      dewC = Math.min(v.airC(), Psychrometrics.dewPointFromRhC(v.airC(), v.rhPct()));
    } else {
      range(file, at, names.dew(), v.dewC(), ForecastStep.MIN_TEMP_C, ForecastStep.MAX_TEMP_C, "°C");
      dewC = v.dewC();
      if (dewC > v.airC() + DEW_ROUNDING_C) {
        throw BadInputException.at(file, String.format(Locale.ROOT, "%s at %s: %.1f °C is above the"
            + " air temperature (%.1f °C) by more than rounding; the response is damaged or its"
            + " properties are swapped", names.dew(), at, dewC, v.airC()));
      }
      dewC = Math.min(dewC, v.airC());
    }
    range(file, at, names.wind(), v.windMs(), 0, ForecastStep.MAX_WIND_MS, "m/s");
    range(file, at, names.cloud(), v.cloudPct(), 0, 100, "%");
    OptionalDouble solar = v.solarWm2();
    if (solar.isPresent()) {
      range(file, at, names.solar(), solar.getAsDouble(), 0, ForecastStep.MAX_SOLAR_WM2, "W/m²");
    }
    return new ForecastStep(time, site.zone().getRules().getOffset(time), v.airC(), dewC,
        v.windMs(), windHeightM, v.cloudPct(), solar, 0);
  }

  /** The service's names of the properties, for messages. */
  record Names(String air, String dew, String rh, String wind, String cloud, String solar) {}

  private static void range(String file, String at, String property, double v, double min,
      double max, String unit) {
    if (!(v >= min && v <= max)) {
      throw BadInputException.at(file, String.format(Locale.ROOT, "%s at %s: %s %s (after"
          + " conversion) is outside %s to %s %s; check the file and the unit it states",
          property, at, fmt(v), unit, fmt(min), fmt(max), unit));
    }
  }

  private static String fmt(double v) {
    return v == Math.rint(v) ? String.format(Locale.ROOT, "%.0f", v) : String.format(Locale.ROOT, "%.2f", v);
  }
}
