package org.rimeward.weather;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.OptionalDouble;
import org.rimeward.io.BadInputException;
import org.rimeward.units.Dimension;

/**
 * Reads an Open-Meteo forecast response: {@code hourly} arrays named by variable, with their
 * units in {@code hourly_units}. Times are local to the response's {@code timezone} at the one
 * {@code utc_offset_seconds} the service applies to the whole response, or Unix seconds (UTC)
 * when {@code hourly_units.time} is {@code unixtime}.
 */
final class OpenMeteoReader {
  static final String SERVICE = "Open-Meteo";

  /** Current names first; the older spellings the service still answers to after. */
  private static final List<String> AIR = List.of("temperature_2m");
  private static final List<String> DEW = List.of("dew_point_2m", "dewpoint_2m");
  private static final List<String> RH = List.of("relative_humidity_2m", "relativehumidity_2m");
  private static final List<String> WIND = List.of("wind_speed_10m", "windspeed_10m");
  private static final List<String> CLOUD = List.of("cloud_cover", "cloudcover");
  private static final List<String> SOLAR = List.of("shortwave_radiation");

  /** Open-Meteo's unit labels mapped to the unit table's symbols. */
  private static final Map<String, String> TEMPERATURE = Map.of("°C", "C", "°F", "F");
  private static final Map<String, String> SPEED = Map.of("km/h", "km/h", "m/s", "m/s",
      "mp/h", "mph", "mph", "mph", "kn", "kn", "knots", "kn");

  private OpenMeteoReader() {}

  static boolean matches(JsonNode root) {
    return root.path("hourly").isObject() && root.has("hourly_units");
  }

  static Forecast read(Path path, JsonNode root, Site site) {
    String file = path.toString();
    JsonNode hourly = root.path("hourly");
    JsonNode units = root.path("hourly_units");
    List<String> notes = new ArrayList<>();
    if (root.has("latitude") && root.has("longitude")) {
      JsonInput.checkPoint(file, SERVICE, root.path("latitude").asDouble(),
          root.path("longitude").asDouble(), site).ifPresent(notes::add);
    } else {
      throw JsonInput.missing(file, "latitude/longitude", "the point the forecast is for");
    }
    JsonNode times = hourly.path("time");
    if (!times.isArray() || times.isEmpty()) {
      throw JsonInput.missing(file, "hourly.time", "the hours of the forecast");
    }
    String airName = pick(hourly, AIR);
    String dewName = pick(hourly, DEW);
    String rhName = pick(hourly, RH);
    String windName = pick(hourly, WIND);
    String cloudName = pick(hourly, CLOUD);
    String solarName = pick(hourly, SOLAR);
    if (airName == null) {
      throw JsonInput.missing(file, "hourly.temperature_2m", "the air temperature");
    }
    if (dewName == null && rhName == null) {
      throw JsonInput.missing(file, "hourly.dew_point_2m or hourly.relative_humidity_2m", "the humidity");
    }
    if (windName == null) {
      throw JsonInput.missing(file, "hourly.wind_speed_10m", "the wind speed");
    }
    if (cloudName == null) {
      throw JsonInput.missing(file, "hourly.cloud_cover", "the cloud cover");
    }
    JsonInput.Unit air = unit(file, units, airName, TEMPERATURE, Dimension.TEMPERATURE);
    JsonInput.Unit dew = dewName == null ? null : unit(file, units, dewName, TEMPERATURE, Dimension.TEMPERATURE);
    JsonInput.Unit wind = unit(file, units, windName, SPEED, Dimension.SPEED);
    if (rhName != null && dewName == null) {
      percent(file, units, rhName);
    }
    percent(file, units, cloudName);
    if (solarName != null) {
      String label = units.path(solarName).asText("");
      if (!label.equals("W/m²") && !label.equals("W/m2")) {
        throw BadInputException.at(file, "hourly_units." + solarName + ": unit '" + label
            + "' is not W/m²; ask Open-Meteo for shortwave_radiation in W/m²");
      }
    }
    JsonInput.Names names = new JsonInput.Names("hourly." + airName, "hourly." + dewName,
        "hourly." + rhName, "hourly." + windName, "hourly." + cloudName, "hourly." + solarName);

    String timeFormat = units.path("time").asText("iso8601");
    ZoneOffset offset = null;
    if (!timeFormat.equals("unixtime")) {
      if (!root.path("utc_offset_seconds").isIntegralNumber()) {
        throw JsonInput.missing(file, "utc_offset_seconds", "the offset of the local times");
      }
      offset = ZoneOffset.ofTotalSeconds(root.path("utc_offset_seconds").asInt());
      String tz = root.path("timezone").asText("");
      if (!tz.isEmpty() && !tz.equals(site.zone().getId())) {
        notes.add("Open-Meteo times were in " + tz + " (UTC" + offset.getId().replace("Z", "+00:00")
            + ") and are shown in " + site.zone().getId());
      }
    }
    List<ForecastStep> steps = new ArrayList<>();
    int skipped = 0;
    for (int i = 0; i < times.size(); i++) {
      Instant t = time(file, times.get(i), offset, i);
      double a = value(hourly, airName, i);
      double d = dewName == null ? Double.NaN : value(hourly, dewName, i);
      double rh = dewName == null ? value(hourly, rhName, i) : Double.NaN;
      double w = value(hourly, windName, i);
      double c = value(hourly, cloudName, i);
      if (Double.isNaN(a) || (dewName != null ? Double.isNaN(d) : Double.isNaN(rh))
          || Double.isNaN(w) || Double.isNaN(c)) {
        // The service writes null where its models have nothing; such hours are left out.
        skipped++;
        continue;
      }
      double s = solarName == null ? Double.NaN : value(hourly, solarName, i);
      JsonInput.Values v = new JsonInput.Values(air.canonical(a),
          dewName == null ? Double.NaN : dew.canonical(d), rh, wind.canonical(w), c,
          Double.isNaN(s) ? OptionalDouble.empty() : OptionalDouble.of(s));
      ForecastStep step = JsonInput.step(file, t, site, v, names, 10.0);
      if (!steps.isEmpty() && !step.time().isAfter(steps.get(steps.size() - 1).time())) {
        throw BadInputException.at(file, "hourly.time[" + i + "] is not after the time before it;"
            + " the response is damaged, fetch it again");
      }
      steps.add(step);
    }
    if (steps.isEmpty()) {
      throw BadInputException.at(file, "every hour has an empty (null) value; the response holds"
          + " no forecast, fetch it again for the coming night");
    }
    if (skipped > 0) {
      notes.add(skipped + " Open-Meteo hour(s) with empty values were left out");
    }
    return new Forecast(path, ForecastFormat.OPEN_METEO, steps, List.of(), notes);
  }

  private static String pick(JsonNode hourly, List<String> names) {
    return names.stream().filter(hourly::has).findFirst().orElse(null);
  }

  private static JsonInput.Unit unit(String file, JsonNode units, String name, Map<String, String> known,
      Dimension dim) {
    if (!units.has(name)) {
      throw JsonInput.missing(file, "hourly_units." + name, "the unit of " + name);
    }
    String label = units.path(name).asText();
    String symbol = known.get(label);
    if (symbol == null) {
      throw BadInputException.at(file, "hourly_units." + name + ": unit '" + label + "' is not one"
          + " Rimeward reads; known: " + String.join(", ", known.keySet().stream().sorted().toList()));
    }
    return JsonInput.unit(file, "hourly_units." + name, label, symbol, dim);
  }

  private static void percent(String file, JsonNode units, String name) {
    if (!units.has(name)) {
      throw JsonInput.missing(file, "hourly_units." + name, "the unit of " + name);
    }
    if (!units.path(name).asText().equals("%")) {
      throw BadInputException.at(file, "hourly_units." + name + ": unit '" + units.path(name).asText()
          + "' is not %; Rimeward reads " + name + " in percent");
    }
  }

  private static double value(JsonNode hourly, String name, int i) {
    JsonNode arr = hourly.path(name);
    JsonNode v = arr.path(i);
    return v.isNumber() ? v.asDouble() : Double.NaN;
  }

  private static Instant time(String file, JsonNode t, ZoneOffset offset, int i) {
    if (offset == null) {
      if (!t.isIntegralNumber()) {
        throw BadInputException.at(file, "hourly.time[" + i + "]: '" + t.asText() + "' is not Unix"
            + " seconds, though hourly_units.time says unixtime");
      }
      return Instant.ofEpochSecond(t.asLong());
    }
    String s = t.asText();
    try {
      return LocalDateTime.parse(s).toInstant(offset);
    } catch (DateTimeParseException local) {
      try {
        return OffsetDateTime.parse(s).toInstant();
      } catch (DateTimeParseException e) {
        throw BadInputException.at(file, String.format(Locale.ROOT, "hourly.time[%d]: '%s' is not"
            + " an ISO-8601 time such as 2025-04-15T03:00", i, s));
      }
    }
  }
}
