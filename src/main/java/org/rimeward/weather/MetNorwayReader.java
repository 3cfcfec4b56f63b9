package org.rimeward.weather;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.rimeward.io.BadInputException;
import org.rimeward.units.Dimension;

/**
 * Reads MET Norway's locationforecast response ({@code compact} or {@code complete}):
 * {@code properties.timeseries[]}, each with a UTC {@code time} and
 * {@code data.instant.details}; the units of the details are in {@code properties.meta.units}.
 * The series is hourly for the first days and coarser later; the planner decides whether the
 * night's steps are close enough.
 */
final class MetNorwayReader {
  static final String SERVICE = "MET Norway";
  private static final Map<String, String> TEMPERATURE = Map.of("celsius", "C", "fahrenheit", "F");
  private static final Map<String, String> SPEED = Map.of("m/s", "m/s", "km/h", "km/h", "knots", "kn");

  private MetNorwayReader() {}

  static boolean matches(JsonNode root) {
    return root.path("properties").path("timeseries").isArray();
  }

  static Forecast read(Path path, JsonNode root, Site site) {
    String file = path.toString();
    List<String> notes = new ArrayList<>();
    JsonNode coords = root.path("geometry").path("coordinates");
    if (!coords.path(0).isNumber() || !coords.path(1).isNumber()) {
      throw JsonInput.missing(file, "geometry.coordinates", "the point the forecast is for");
    }
    JsonInput.checkPoint(file, SERVICE, coords.path(1).asDouble(), coords.path(0).asDouble(), site)
        .ifPresent(notes::add);
    JsonNode units = root.path("properties").path("meta").path("units");
    JsonNode series = root.path("properties").path("timeseries");
    if (series.isEmpty()) {
      throw JsonInput.missing(file, "properties.timeseries", "the forecast's time steps");
    }
    JsonNode firstDetails = series.get(0).path("data").path("instant").path("details");
    boolean hasDew = firstDetails.has("dew_point_temperature");
    JsonInput.Unit air = unit(file, units, "air_temperature", TEMPERATURE, Dimension.TEMPERATURE);
    JsonInput.Unit dew = hasDew
        ? unit(file, units, "dew_point_temperature", TEMPERATURE, Dimension.TEMPERATURE) : null;
    JsonInput.Unit wind = unit(file, units, "wind_speed", SPEED, Dimension.SPEED);
    if (!hasDew) {
      percent(file, units, "relative_humidity");
    }
    percent(file, units, "cloud_area_fraction");
    JsonInput.Names names = new JsonInput.Names("air_temperature", "dew_point_temperature",
        "relative_humidity", "wind_speed", "cloud_area_fraction", "");
    List<ForecastStep> steps = new ArrayList<>();
    for (int i = 0; i < series.size(); i++) {
      JsonNode entry = series.get(i);
      String timeText = entry.path("time").asText("");
      Instant t;
      try {
        t = OffsetDateTime.parse(timeText).toInstant();
      } catch (DateTimeParseException e) {
        throw BadInputException.at(file, "properties.timeseries[" + i + "].time: '" + timeText
            + "' is not an ISO-8601 time such as 2025-04-15T03:00:00Z");
      }
      JsonNode d = entry.path("data").path("instant").path("details");
      String prefix = "properties.timeseries[" + i + "].data.instant.details.";
      double a = air.canonical(number(file, d, prefix, "air_temperature"));
      double dewC = hasDew ? dew.canonical(number(file, d, prefix, "dew_point_temperature")) : Double.NaN;
      double rh = hasDew ? Double.NaN : number(file, d, prefix, "relative_humidity");
      double w = wind.canonical(number(file, d, prefix, "wind_speed"));
      double c = number(file, d, prefix, "cloud_area_fraction");
      ForecastStep step = JsonInput.step(file, t, site,
          new JsonInput.Values(a, dewC, rh, w, c, OptionalDouble.empty()), names, 10.0);
      if (!steps.isEmpty() && !step.time().isAfter(steps.get(steps.size() - 1).time())) {
        throw BadInputException.at(file, "properties.timeseries[" + i + "].time is not after the"
            + " time before it; the response is damaged, fetch it again");
      }
      steps.add(step);
    }
    return new Forecast(path, ForecastFormat.MET_NORWAY, steps, List.of(), notes);
  }

  private static double number(String file, JsonNode details, String prefix, String name) {
    JsonNode v = details.path(name);
    if (!v.isNumber()) {
      String what = switch (name) {
        case "air_temperature" -> "the air temperature";
        case "dew_point_temperature", "relative_humidity" -> "the humidity";
        case "wind_speed" -> "the wind speed";
        default -> "the cloud cover";
      };
      throw JsonInput.missing(file, prefix + name, what);
    }
    return v.asDouble();
  }

  private static JsonInput.Unit unit(String file, JsonNode units, String name, Map<String, String> known,
      Dimension dim) {
    String label = units.path(name).asText("");
    if (label.isEmpty()) {
      throw JsonInput.missing(file, "properties.meta.units." + name, "the unit of " + name);
    }
    String symbol = known.get(label);
    if (symbol == null) {
      throw BadInputException.at(file, "properties.meta.units." + name + ": unit '" + label
          + "' is not one Rimeward reads; known: " + String.join(", ", known.keySet().stream().sorted().toList()));
    }
    return JsonInput.unit(file, "properties.meta.units." + name, label, symbol, dim);
  }

  private static void percent(String file, JsonNode units, String name) {
    String label = units.path(name).asText("");
    if (label.isEmpty()) {
      throw JsonInput.missing(file, "properties.meta.units." + name, "the unit of " + name);
    }
    if (!label.equals("%")) {
      throw BadInputException.at(file, "properties.meta.units." + name + ": unit '" + label
          + "' is not %; Rimeward reads " + name + " in percent");
    }
  }
}
