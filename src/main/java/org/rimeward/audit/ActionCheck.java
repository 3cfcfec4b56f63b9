package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import java.util.Optional;

/**
 * Whether what the crew did contradicts the block's latest plan. It warns and never refuses: the
 * people in the field see what the plan cannot, and the record must show what they did.
 */
public final class ActionCheck {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private ActionCheck() {}

  /** The warning for {@code kind} done at {@code at}, given the block's recorded decision. */
  public static Optional<String> warning(CrewAction.Kind kind, Instant at, RecordedBlock advised,
      ZoneId zone) {
    JsonNode decision;
    try {
      decision = JSON.readTree(advised.decisionJson());
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException("block " + advised.blockId() + ": the recorded decision"
          + " cannot be read back; run 'rimeward audit verify'");
    }
    String method = kind.sprinkling() ? "sprinkle" : "cover";
    JsonNode action = null;
    for (JsonNode a : decision.path("actions")) {
      if (method.equals(a.path("method").asText())) {
        action = a;
      }
    }
    if (action == null) {
      return kind.starts() ? Optional.of("the plan advised no " + (kind.sprinkling()
          ? "sprinkling" : "covers") + " on " + advised.blockId() + " tonight") : Optional.empty();
    }
    String when = CLOCK.format(at.atZone(zone));
    return switch (kind) {
      case SPRINKLING_ON -> time(action, "start").filter(at::isAfter).map(s -> "sprinklers on at "
          + when + ", after the start the plan gives (" + CLOCK.format(s.atZone(zone)) + ")");
      case SPRINKLING_OFF -> time(action, "stop").filter(at::isBefore).map(s -> "sprinklers off at "
          + when + ", before the stop condition is met (the plan gives " + CLOCK.format(s.atZone(zone))
          + "): iced buds whose wet bulb is still below the threshold can cool below the air as"
          + " the ice evaporates");
      case COVERS_ON -> time(action, "deploy_by").filter(at::isAfter).map(s -> "covers on at "
          + when + ", after the plan's deadline (" + CLOCK.format(s.atZone(zone)) + "): the ground"
          + " has already lost the day's heat they were meant to keep");
      case COVERS_OFF -> time(action, "remove").filter(at::isBefore).map(s -> "covers off at "
          + when + " with the air still below the target: the plan keeps them on until "
          + CLOCK.format(s.atZone(zone)));
    };
  }

  private static Optional<Instant> time(JsonNode action, String key) {
    JsonNode v = action.path(key);
    if (!v.isTextual()) {
      return Optional.empty();
    }
    try {
      return Optional.of(OffsetDateTime.parse(v.asText()).toInstant());
    } catch (DateTimeParseException e) {
      return Optional.empty();
    }
  }
}
