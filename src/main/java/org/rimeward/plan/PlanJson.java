package org.rimeward.plan;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.rimeward.io.Json;

/**
 * The plan as JSON: its {@link PlanDocument}, always metric. This schema is stable: other tools
 * and the audit trail read it. Keys are documented in the README; new keys may be added,
 * existing ones keep their meaning.
 */
public final class PlanJson {
  private PlanJson() {}

  public static String toText(Plan plan) {
    return Json.pretty(PlanDocuments.of(plan));
  }

  public static ObjectNode toTree(Plan plan) {
    return Json.mapper().valueToTree(PlanDocuments.of(plan));
  }

  /** A time as the plan document writes it. */
  static String time(java.time.Instant t, java.time.ZoneId zone) {
    return Json.time(PlanDocuments.time(t, zone));
  }

  /**
   * Reads a plan document back, as a recorded run or another tool wrote it.
   *
   * @throws IllegalArgumentException naming what is wrong when the text is not a plan document
   */
  public static PlanDocument read(String json) {
    try {
      PlanDocument d = Json.mapper().readValue(json, PlanDocument.class);
      if (d == null || d.night() == null) {
        throw new IllegalArgumentException("not a plan document: it has no night");
      }
      return d;
    } catch (JsonProcessingException e) {
      throw new IllegalArgumentException("not a plan document: " + e.getOriginalMessage(), e);
    }
  }
}
