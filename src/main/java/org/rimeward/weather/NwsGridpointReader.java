package org.rimeward.weather;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import org.rimeward.io.BadInputException;
import org.rimeward.units.Dimension;

/**
 * Reads the US National Weather Service's gridpoint forecast data ({@code /gridpoints/{office}/
 * {x},{y}}): each property is a list of values over ISO-8601 intervals
 * ({@code 2025-04-15T03:00:00+00:00/PT3H}) with a WMO unit code in {@code uom}. The values are
 * expanded to hourly steps: temperature and dew point are interpolated linearly between the
 * starts of consecutive intervals, the other properties hold their value over the interval.
 * Every interval longer than an hour is reported as a {@link CoarseSpan}.
 */
final class NwsGridpointReader {
  static final String SERVICE = "NWS";
  private static final Duration HOUR = Duration.ofHours(1);

  /** WMO unit codes as the service writes them, mapped to the unit table's symbols. */
  private static final Map<String, String> TEMPERATURE = Map.of("wmoUnit:degC", "C",
      "wmoUnit:degF", "F", "wmoUnit:K", "K");
  private static final Map<String, String> SPEED = Map.of("wmoUnit:km_h-1", "km/h",
      "wmoUnit:m_s-1", "m/s", "wmoUnit:kn", "kn", "wmoUnit:mi_h-1", "mph");
  private static final Map<String, String> PERCENT = Map.of("wmoUnit:percent", "%");

  private NwsGridpointReader() {}

  static boolean matches(JsonNode root) {
    JsonNode p = root.path("properties");
    return p.path("temperature").path("values").isArray() || p.path("@type").asText().equals("wx:Gridpoint");
  }

  /** One property's intervals, values canonical. */
  private record Series(String name, List<Instant> starts, List<Duration> lengths, List<Double> values) {
    /** The interval holding {@code t}, or -1. */
    int at(Instant t) {
      for (int i = 0; i < starts.size(); i++) {
        if (!t.isBefore(starts.get(i)) && t.isBefore(starts.get(i).plus(lengths.get(i)))) {
          return i;
        }
      }
      return -1;
    }

    Instant first() {
      return starts.get(0);
    }

    Instant end() {
      int last = starts.size() - 1;
      return starts.get(last).plus(lengths.get(last));
    }

    /** Held over the interval. */
    double held(Instant t) {
      int i = at(t);
      return i < 0 ? Double.NaN : values.get(i);
    }

    /** Linear between the start of the interval holding t and the start of the next one. */
    double interpolated(Instant t) {
      int i = at(t);
      if (i < 0) {
        return Double.NaN;
      }
      Instant s = starts.get(i);
      if (t.equals(s) || i + 1 >= starts.size() || !starts.get(i + 1).equals(s.plus(lengths.get(i)))) {
        return values.get(i);
      }
      double f = (double) Duration.between(s, t).toSeconds() / lengths.get(i).toSeconds();
      return values.get(i) + f * (values.get(i + 1) - values.get(i));
    }
  }

  static Forecast read(Path path, JsonNode root, Site site) {
    String file = path.toString();
    JsonNode props = root.path("properties");
    List<String> notes = new ArrayList<>();
    point(root, file, site).ifPresent(notes::add);
    Series air = series(file, props, "temperature", TEMPERATURE, Dimension.TEMPERATURE);
    Series dew = props.has("dewpoint")
        ? series(file, props, "dewpoint", TEMPERATURE, Dimension.TEMPERATURE) : null;
    Series rh = dew == null
        ? series(file, props, "relativeHumidity", PERCENT, null) : null;
    Series wind = series(file, props, "windSpeed", SPEED, Dimension.SPEED);
    Series sky = series(file, props, "skyCover", PERCENT, null);
    List<Series> all = new ArrayList<>(List.of(air, wind, sky));
    all.add(dew != null ? dew : rh);

    Instant from = all.stream().map(Series::first).max(Instant::compareTo).orElseThrow();
    Instant to = all.stream().map(Series::end).min(Instant::compareTo).orElseThrow();
    from = ceilHour(from);
    JsonInput.Names names = new JsonInput.Names("temperature", "dewpoint", "relativeHumidity",
        "windSpeed", "skyCover", "");
    List<ForecastStep> steps = new ArrayList<>();
    Set<String> gaps = new LinkedHashSet<>();
    for (Instant t = from; t.isBefore(to); t = t.plus(HOUR)) {
      double a = air.interpolated(t);
      double d = dew != null ? dew.interpolated(t) : Double.NaN;
      double r = rh != null ? rh.held(t) : Double.NaN;
      double w = wind.held(t);
      double c = sky.held(t);
      if (Double.isNaN(a) || (dew != null ? Double.isNaN(d) : Double.isNaN(r)) || Double.isNaN(w)
          || Double.isNaN(c)) {
        gaps.add(t.toString());
        continue;
      }
      steps.add(JsonInput.step(file, t, site, new JsonInput.Values(a, d, r, w, c,
          OptionalDouble.empty()), names, 10.0));
    }
    if (steps.isEmpty()) {
      throw BadInputException.at(file, "the properties' intervals have no hour in common; the"
          + " response is damaged or empty, fetch it again");
    }
    if (!gaps.isEmpty()) {
      notes.add("NWS gave no value for " + gaps.size() + " hour(s) inside the forecast; those hours"
          + " were left out");
    }
    List<CoarseSpan> coarse = new ArrayList<>();
    for (Series s : all) {
      boolean interpolated = s == air || s == dew;
      for (int i = 0; i < s.starts().size(); i++) {
        if (s.lengths().get(i).compareTo(HOUR) > 0) {
          coarse.add(new CoarseSpan(s.name(), s.starts().get(i), s.lengths().get(i), interpolated));
        }
      }
    }
    return new Forecast(path, ForecastFormat.NWS_GRIDPOINT, steps, coarse, notes);
  }

  private static java.util.Optional<String> point(JsonNode root, String file, Site site) {
    JsonNode ring = root.path("geometry").path("coordinates").path(0);
    if (!ring.isArray() || ring.isEmpty()) {
      throw JsonInput.missing(file, "geometry.coordinates", "the grid cell the forecast is for");
    }
    double lat = 0;
    double lon = 0;
    int n = 0;
    for (JsonNode p : ring) {
      // A closed ring repeats its first corner last; count each corner once.
      if (n > 0 && p.equals(ring.get(0))) {
        continue;
      }
      lon += p.path(0).asDouble();
      lat += p.path(1).asDouble();
      n++;
    }
    return JsonInput.checkPoint(file, SERVICE, lat / n, lon / n, site);
  }

  private static Series series(String file, JsonNode props, String name, Map<String, String> units,
      Dimension dim) {
    JsonNode p = props.path(name);
    if (!p.path("values").isArray()) {
      throw JsonInput.missing(file, "properties." + name, switch (name) {
        case "temperature" -> "the air temperature";
        case "relativeHumidity" -> "the humidity, as properties.dewpoint or relativeHumidity";
        case "windSpeed" -> "the wind speed";
        default -> "the sky cover";
      });
    }
    String uom = p.path("uom").asText("");
    if (uom.isEmpty()) {
      throw JsonInput.missing(file, "properties." + name + ".uom", "the unit of " + name);
    }
    String symbol = units.get(uom);
    if (symbol == null) {
      throw BadInputException.at(file, "properties." + name + ".uom: '" + uom + "' is not a unit"
          + " Rimeward reads for " + name + "; known: " + String.join(", ", units.keySet().stream().sorted().toList()));
    }
    JsonInput.Unit unit = dim == null ? new JsonInput.Unit(uom, 1, 0)
        : JsonInput.unit(file, "properties." + name + ".uom", uom, symbol, dim);
    List<Instant> starts = new ArrayList<>();
    List<Duration> lengths = new ArrayList<>();
    List<Double> values = new ArrayList<>();
    JsonNode vals = p.path("values");
    for (int i = 0; i < vals.size(); i++) {
      JsonNode v = vals.get(i);
      String validTime = v.path("validTime").asText("");
      int slash = validTime.indexOf('/');
      Instant start;
      Duration length;
      try {
        start = OffsetDateTime.parse(validTime.substring(0, Math.max(slash, 0))).toInstant();
        length = Duration.parse(validTime.substring(slash + 1));
      } catch (DateTimeParseException | IndexOutOfBoundsException e) {
        throw BadInputException.at(file, "properties." + name + ".values[" + i + "].validTime: '"
            + validTime + "' is not an ISO-8601 interval such as 2025-04-15T03:00:00+00:00/PT3H");
      }
      if (length.isNegative() || length.isZero()) {
        throw BadInputException.at(file, "properties." + name + ".values[" + i + "].validTime: '"
            + validTime + "' has no length");
      }
      if (!starts.isEmpty() && start.isBefore(starts.get(starts.size() - 1).plus(lengths.get(lengths.size() - 1)))) {
        throw BadInputException.at(file, "properties." + name + ".values[" + i + "].validTime: '"
            + validTime + "' overlaps or comes before the interval before it; the response is damaged");
      }
      if (!v.path("value").isNumber()) {
        continue;
      }
      starts.add(start);
      lengths.add(length);
      values.add(unit.canonical(v.path("value").asDouble()));
    }
    if (starts.isEmpty()) {
      throw JsonInput.missing(file, "properties." + name + ".values", "values of " + name);
    }
    return new Series(name, starts, lengths, values);
  }

  private static Instant ceilHour(Instant t) {
    Instant h = t.truncatedTo(ChronoUnit.HOURS);
    return h.equals(t) ? t : h.plus(HOUR);
  }
}
