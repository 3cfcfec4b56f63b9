package org.rimeward.plan;

import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.rimeward.io.Json;

/**
 * What moved between an earlier plan for the night (as recorded, read back as a plan document)
 * and a re-plan: each block's status, sprinkling start and stop, covers on and off.
 */
public final class PlanChanges {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private PlanChanges() {}

  /** The changes from {@code previousPlanJson} to {@code now}, in block order of {@code now}. */
  public static List<NightUpdate.Change> between(String previousPlanJson, Plan now) {
    PlanDocument before = PlanJson.read(previousPlanJson);
    PlanDocument after = PlanDocuments.of(now);
    ZoneId zone = now.night().zone();
    List<NightUpdate.Change> out = new ArrayList<>();
    for (PlanDocument.Block b : after.blocks()) {
      String id = b.block();
      String reason = reason(now, id);
      Optional<PlanDocument.Block> found = before.block(id);
      if (found.isEmpty()) {
        continue;
      }
      PlanDocument.Block old = found.get();
      compare(out, id, "status", text(old.status()), text(b.status()), reason, false, zone);
      compare(out, id, "start", time(old.sprinkle().map(PlanDocument.Sprinkle::start)),
          time(b.sprinkle().map(PlanDocument.Sprinkle::start)), reason, true, zone);
      compare(out, id, "stop", time(old.sprinkle().map(PlanDocument.Sprinkle::stop)),
          time(b.sprinkle().map(PlanDocument.Sprinkle::stop)), reason, true, zone);
      compare(out, id, "covers on", time(old.cover().map(PlanDocument.Cover::deployStart)),
          time(b.cover().map(PlanDocument.Cover::deployStart)), reason, true, zone);
      compare(out, id, "covers off", time(old.cover().map(PlanDocument.Cover::remove)),
          time(b.cover().map(PlanDocument.Cover::remove)), reason, true, zone);
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

  private static String text(String value) {
    return value == null ? "" : value;
  }

  /** As the plan document writes it, so that a change's before and after read like its JSON. */
  private static String time(Optional<OffsetDateTime> t) {
    return t.map(Json::time).orElse("");
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
