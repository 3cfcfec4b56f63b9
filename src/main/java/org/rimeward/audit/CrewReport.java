package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rimeward.plan.PlanDocument;

/**
 * What was advised beside what was done: a run's planned actions next to the crew's recorded
 * actions of the same night, with times. The evidence an insurer asks for.
 */
public final class CrewReport {
  private static final ObjectMapper JSON = org.rimeward.io.Json.mapper();
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private CrewReport() {}

  /** The text section, for every block of the run or only {@code blockId}. */
  public static String text(RunRecord run, List<CrewAction> actions, Optional<String> blockId) {
    ZoneId zone = ZoneId.of(run.zoneId());
    StringBuilder s = new StringBuilder("\nAdvised and done (night of " + run.night() + "):\n");
    boolean any = false;
    for (RecordedBlock b : run.blocks()) {
      if (blockId.isPresent() && !blockId.get().equals(b.blockId())) {
        continue;
      }
      List<CrewAction> done = actions.stream().filter(a -> a.blockId().equals(b.blockId())).toList();
      List<PlanDocument.Action> advised = b.decision().actions();
      if (done.isEmpty() && advised.isEmpty()) {
        continue;
      }
      any = true;
      s.append("  ").append(b.blockId()).append('\n');
      for (PlanDocument.Action a : advised) {
        s.append("    advised: ").append(advised(a, zone)).append('\n');
      }
      if (advised.isEmpty()) {
        s.append("    advised: nothing\n");
      }
      for (CrewAction a : done) {
        s.append("    done:    ").append(CLOCK.format(a.at().atZone(zone))).append(' ')
            .append(a.kind().word()).append(" by ").append(a.by());
        if (!a.note().isEmpty()) {
          s.append(" (").append(a.note()).append(')');
        }
        s.append('\n');
        a.warning().ifPresent(w -> s.append("             warning: ").append(w).append('\n'));
      }
      if (done.isEmpty()) {
        s.append("    done:    nothing recorded ('rimeward action' records it)\n");
      }
    }
    if (!any) {
      s.append("  nothing advised and nothing recorded\n");
    }
    return s.toString();
  }

  /** The crew's actions as a JSON array, for the JSON outputs. */
  public static ArrayNode json(List<CrewAction> actions, ZoneId zone) {
    ArrayNode arr = JSON.createArrayNode();
    for (CrewAction a : actions) {
      ObjectNode n = arr.addObject();
      n.put("block", a.blockId());
      n.put("kind", a.kind().word());
      n.put("at", OffsetDateTime.ofInstant(a.at(), zone).toString());
      n.put("by", a.by());
      n.put("note", a.note());
      n.put("recorded_at", a.recordedAt().toString());
      n.put("advised_run", a.advisedRunId().orElse(null));
      n.put("warning", a.warning().orElse(null));
    }
    return arr;
  }

  /** {@code json} (an object) with the crew's actions added under {@code key}. */
  public static String withActions(String json, String key, List<CrewAction> actions, ZoneId zone) {
    try {
      ObjectNode root = (ObjectNode) JSON.readTree(json);
      root.set(key, json(actions, zone));
      return org.rimeward.io.Json.pretty(root);
    } catch (JsonProcessingException | ClassCastException e) {
      throw new IllegalStateException("could not add the crew's actions to the JSON", e);
    }
  }

  /** When the crew started and ended what the advised action asks for: for the export's columns. */
  public static String[] doneTimes(String blockId, String method, List<CrewAction> actions, ZoneId zone) {
    boolean sprinkle = "sprinkle".equals(method);
    Optional<Instant> on = actions.stream().filter(a -> a.blockId().equals(blockId)
        && a.kind() == (sprinkle ? CrewAction.Kind.SPRINKLING_ON : CrewAction.Kind.COVERS_ON))
        .map(CrewAction::at).min(Instant::compareTo);
    Optional<Instant> off = actions.stream().filter(a -> a.blockId().equals(blockId)
        && a.kind() == (sprinkle ? CrewAction.Kind.SPRINKLING_OFF : CrewAction.Kind.COVERS_OFF))
        .map(CrewAction::at).max(Instant::compareTo);
    return new String[] {on.map(t -> OffsetDateTime.ofInstant(t, zone).toString()).orElse(""),
        off.map(t -> OffsetDateTime.ofInstant(t, zone).toString()).orElse("")};
  }

  private static String advised(PlanDocument.Action a, ZoneId zone) {
    if (a instanceof PlanDocument.Sprinkle sp && !sp.isAdvised()) {
      return "no sprinkling (not advised tonight)";
    }
    if (a instanceof PlanDocument.Sprinkle sp && !sp.waterGranted()) {
      return "no sprinkling (no water granted" + (sp.source() != null ? " from " + sp.source() : "")
          + ")";
    }
    if (a instanceof PlanDocument.Sprinkle sp) {
      return "sprinkle " + clock(sp.start(), zone) + " → " + clock(sp.stop(), zone)
          + (sp.source() != null ? " from " + sp.source() : "");
    }
    PlanDocument.Cover c = (PlanDocument.Cover) a;
    return "covers on from " + clock(c.deployStart(), zone) + " (by " + clock(c.deployBy(), zone)
        + "), off at " + clock(c.remove(), zone);
  }

  private static String clock(OffsetDateTime t, ZoneId zone) {
    return t == null ? "?" : CLOCK.format(t.atZoneSameInstant(zone));
  }
}
