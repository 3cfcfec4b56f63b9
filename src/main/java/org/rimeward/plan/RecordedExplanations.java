package org.rimeward.plan;

import com.fasterxml.jackson.databind.JsonNode;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.Function;
import org.rimeward.rules.Explanations;
import org.rimeward.rules.facts.Moment;
import org.rimeward.units.UnitSystem;
import org.rimeward.water.Stake;

/**
 * The explanations of a recorded plan in the reader's units. The trail keeps each explanation as
 * it was said (metric), the values the rule saw and the rule files' text; the templates read from
 * those files are filled again with the values, as {@link PlanDocuments} wrote them.
 */
public final class RecordedExplanations {
  private RecordedExplanations() {}

  /**
   * Each rule's explanation in {@code units}. The template is used only where it gives back, in
   * metric, exactly what was recorded; otherwise (a rule file that changed its words, a value
   * rounded across a digit) the recorded words are kept, which are what the run said.
   *
   * @param templates rule id → template, from the run's own rule files
   */
  public static Function<PlanDocument.Rule, String> of(Map<String, String> templates,
      UnitSystem units, ZoneId zone) {
    if (units == UnitSystem.METRIC) {
      return PlanDocument.Rule::explanation;
    }
    return r -> {
      String template = templates.get(r.id());
      if (template == null || r.values() == null) {
        return r.explanation();
      }
      Map<String, Object> values = values(r.values());
      if (Explanations.render(template, values, UnitSystem.METRIC, zone).equals(r.explanation())) {
        return Explanations.render(template, values, units, zone);
      }
      // JSON writes an unknown number (NaN: "no limit") as null, like a missing value ("none").
      values.replaceAll((k, v) -> v == null ? Double.NaN : v);
      if (Explanations.render(template, values, UnitSystem.METRIC, zone).equals(r.explanation())) {
        return Explanations.render(template, values, units, zone);
      }
      return r.explanation();
    };
  }

  /** The values as {@link PlanDocuments} wrote them, typed again for a template. */
  static Map<String, Object> values(JsonNode json) {
    Map<String, Object> out = new LinkedHashMap<>();
    json.properties().forEach(e -> out.put(e.getKey(), value(e.getValue())));
    return out;
  }

  private static Object value(JsonNode v) {
    if (v == null || v.isNull()) {
      return null;
    }
    if (v.isObject() && v.has("at") && v.has("value")) {
      return new Moment(instant(v.get("at").asText()), v.get("value").asDouble(), false,
          v.path("forecast_line").asInt());
    }
    if (v.isObject() && v.has("per_m3")) {
      return new Stake(v.get("per_m3").asDouble(), v.path("by_value").asBoolean());
    }
    if (v.isIntegralNumber()) {
      return v.asLong();
    }
    if (v.isNumber()) {
      return v.asDouble();
    }
    if (v.isBoolean()) {
      return v.asBoolean();
    }
    if (v.isTextual()) {
      Instant t = instant(v.asText());
      return t != null ? t : v.asText();
    }
    return v.toString();
  }

  /** A time as the document writes it, or null for any other text. */
  private static Instant instant(String text) {
    if (text.length() < 16 || text.charAt(4) != '-' || text.charAt(10) != 'T') {
      return null;
    }
    try {
      return OffsetDateTime.parse(text).toInstant();
    } catch (DateTimeParseException e) {
      return null;
    }
  }
}
