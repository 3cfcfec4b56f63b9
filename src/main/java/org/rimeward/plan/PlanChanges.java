package org.rimeward.plan;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;

/**
 * What moved between an earlier plan for the night (as recorded, in the plan document's JSON) and
 * a re-plan: each block's status, sprinkling start and stop, covers on and off.
 */
public final class PlanChanges {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private PlanChanges() {}

  /** The changes from {@code previousPlanJson} to {@code now}, in block order of {@code now}. */
  public static List<NightUpdate.Change> between(String previousPlanJson, Plan now) {
    JsonNode before;
    try {
      before = JSON.readTree(previousPlanJson);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("the recorded plan cannot be read back", e);
    }
    JsonNode after = PlanJson.toTree(now);
    ZoneId zone = now.night().zone();
    List<NightUpdate.Change> out = new ArrayList<>();
    for (JsonNode b : after.path("blocks")) {
      String id = b.path("block").asText();
      String reason = reason(now, id);
      JsonNode old = block(before, id);
      if (old == null) {
        continue;
      }
      compare(out, id, "status", old.path("status").asText(""), b.path("status").asText(""), reason,
          false, zone);
      compare(out, id, "start", time(old, "sprinkle", "start"), time(b, "sprinkle", "start"),
          reason, true, zone);
      compare(out, id, "stop", time(old, "sprinkle", "stop"), time(b, "sprinkle", "stop"), reason,
          true, zone);
      compare(out, id, "covers on", time(old, "cover", "deploy_start"),
          time(b, "cover", "deploy_start"), reason, true, zone);
      compare(out, id, "covers off", time(old, "cover", "remove"), time(b, "cover", "remove"),
          reason, true, zone);
    }
    return out;
  }

  private static void compare(List<NightUpdate.Change> out, String id, String what, String before,
      String after, String reason, boolean isTime, ZoneId zone) {
    if (Objects.equals(before, after)) {
      return;
    }
    String b = isTime ? clock(before, zone) : before.replace('_', ' ');
    String a = isTime ? clock(after, zone) : after.replace('_', ' ');
    if (b.equals(a)) {
      return;
    }
    String text;
    if (isTime && before.isEmpty()) {
      text = id + ": " + what + " now " + a;
    } else if (isTime && after.isEmpty()) {
      text = id + ": " + what + " (was " + b + ") no longer planned";
    } else {
      text = id + ": " + what + " moved " + b + " → " + a;
    }
    out.add(new NightUpdate.Change(id, what, before, after, text + reason));
  }

  /** Why {@code blockId} moved: the offset of the readings that corrected it. */
  private static String reason(Plan p, String blockId) {
    if (p.update() == null) {
      return "";
    }
    NightUpdate.ReadingsSummary r = p.update().readings();
    Optional<NightUpdate.StationSummary> st = r.stationOf(blockId);
    double bias = st.map(NightUpdate.StationSummary::biasC).orElse(r.biasC());
    if (Double.isNaN(bias)) {
      return "";
    }
    // With several stations, say whose readings moved the block.
    String whose = st.isPresent() && r.planning().size() > 1 ? "station " + st.get().id() + "'s"
        + " readings" : "readings";
    if (Math.abs(bias) < 0.05) {
      return " (" + whose + " match the forecast)";
    }
    return String.format(Locale.ROOT, " (%s %.1f °C %s than forecast)", whose, Math.abs(bias),
        bias < 0 ? "colder" : "warmer");
  }

  private static JsonNode block(JsonNode plan, String id) {
    for (JsonNode b : plan.path("blocks")) {
      if (id.equals(b.path("block").asText())) {
        return b;
      }
    }
    return null;
  }

  private static String time(JsonNode block, String method, String key) {
    for (JsonNode a : block.path("actions")) {
      if (method.equals(a.path("method").asText()) && a.path(key).isTextual()) {
        return a.path(key).asText();
      }
    }
    return "";
  }

  private static String clock(String iso, ZoneId zone) {
    if (iso.isEmpty()) {
      return "none";
    }
    try {
      return CLOCK.format(OffsetDateTime.parse(iso).atZoneSameInstant(zone));
    } catch (DateTimeParseException e) {
      return iso;
    }
  }
}
