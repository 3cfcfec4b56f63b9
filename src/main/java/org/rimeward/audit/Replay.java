package org.rimeward.audit;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Stream;
import org.rimeward.io.Json;
import org.rimeward.plan.NightPlanner;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanInputs;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanRequest;

/**
 * Runs a recorded night again from the inputs the trail kept, or with today's rules or crop
 * profiles in their place, and says what came out different. It only reads the trail.
 */
public final class Replay {
  /** Keys of the plan document that say nothing about the decision. */
  // Where a replay's inputs sit is a temporary folder; what they were is compared file by file.
  static final Set<String> IGNORED = Set.of("tool_version", "inputs");

  /**
   * Keys at any depth left out of the comparison: a block's night series is the physics behind
   * its decision, step by step, and would bury the decision's own differences.
   */
  static final Set<String> IGNORED_ANYWHERE = Set.of("series");

  private static final ObjectMapper JSON = Json.mapper();

  private final NightPlanner planner;

  public Replay(NightPlanner planner) {
    this.planner = Objects.requireNonNull(planner, "planner");
  }

  /** One input whose content differs between the recorded run and the replay. */
  public record InputChange(InputKind kind, String name, String recordedSha256, String nowSha256) {
    /** What happened to the file: {@code changed}, {@code added} or {@code removed}. */
    public String what() {
      return recordedSha256 == null ? "added" : nowSha256 == null ? "removed" : "changed";
    }
  }

  /**
   * One value of the plan document that differs.
   *
   * @param path a JSON pointer into the plan document, except that blocks are named by their id
   *     and water entries by their source ({@code /blocks/hollow-cherry/status}), since a change can
   *     reorder them
   * @param recorded null when the replay added the value
   * @param now null when the replay no longer has the value
   */
  public record Difference(String path, JsonNode recorded, JsonNode now) {}

  /** The outcome: which inputs were not the recorded ones, and what the plan says differently. */
  public record Result(RunRecord run, boolean currentRules, boolean currentProfiles,
      List<InputChange> inputChanges, List<Difference> differences) {
    public Result {
      inputChanges = List.copyOf(inputChanges);
      differences = List.copyOf(differences);
    }

    public boolean same() {
      return differences.isEmpty();
    }

    /** What a person reads: what was replayed with what, then each difference or "no difference". */
    public String text() {
      StringBuilder s = new StringBuilder();
      s.append("Replay of run ").append(run.runId()).append(", night of ").append(run.night())
          .append(", farm ").append(run.farmName()).append('\n');
      s.append("  rules: ").append(currentRules ? "today's" : "as recorded")
          .append("; crop profiles: ").append(currentProfiles ? "today's" : "as recorded")
          .append("; farm file and forecast: as recorded\n");
      if (!inputChanges.isEmpty()) {
        s.append("\nInputs that differ from the recorded ones\n");
        for (InputChange c : inputChanges) {
          s.append("  ").append(RunReport.kindName(c.kind())).append(' ').append(c.name())
              .append(": ").append(c.what());
          if (c.recordedSha256() != null && c.nowSha256() != null) {
            s.append(" (sha256 ").append(c.recordedSha256(), 0, 12).append("… → ")
                .append(c.nowSha256(), 0, 12).append("…)");
          }
          s.append('\n');
        }
      }
      if (differences.isEmpty()) {
        s.append("\nno difference: the replay decides exactly as the recorded run did\n");
        return s.toString();
      }
      java.util.Map<String, java.util.Set<String>> decisions = new java.util.TreeMap<>();
      for (Difference d : differences) {
        String[] p = d.path().split("/");
        if (p.length >= 4 && p[1].equals("blocks") && Set.of("status", "risk", "actions",
            "target_c", "kill_pct_unprotected").contains(p[3])) {
          decisions.computeIfAbsent(p[2], k -> new java.util.TreeSet<>()).add(p[3]);
        }
      }
      if (!decisions.isEmpty()) {
        s.append("\nBlocks whose decision differs\n");
        decisions.forEach((b, f) -> s.append("  ").append(b).append(": ")
            .append(String.join(", ", f)).append('\n'));
      }
      s.append("\n").append(differences.size()).append(differences.size() == 1 ? " difference"
          : " differences").append(" (recorded → now)\n");
      for (Difference d : differences) {
        s.append("  ").append(d.path()).append(": ").append(shown(d.recorded())).append(" → ")
            .append(shown(d.now())).append('\n');
      }
      return s.toString();
    }

    private static String shown(JsonNode n) {
      if (n == null) {
        return "(absent)";
      }
      if (n.isObject() && n.has("id") && n.has("explanation")) {
        return n.get("id").asText() + ": " + n.get("explanation").asText();
      }
      return n.toString();
    }
  }

  /**
   * Replays {@code run}.
   *
   * @param rulesDir today's rules to use instead of the recorded ones; null for the recorded ones
   * @param cropProfilesDir today's crop profiles instead of the recorded ones; null for those
   */
  public Result replay(RunRecord run, Path rulesDir, Path cropProfilesDir) {
    Path tmp;
    try {
      tmp = Files.createTempDirectory("rimeward-replay-");
    } catch (IOException e) {
      throw new UncheckedIOException("cannot make a temporary folder for the replay", e);
    }
    try {
      Path farmDir = Files.createDirectory(tmp.resolve("farm"));
      Path profiles = Files.createDirectory(tmp.resolve("crop-profiles"));
      Path rules = Files.createDirectory(tmp.resolve("rules"));
      Path farmFile = null;
      Path forecast = null;
      for (RecordedInput in : run.inputs()) {
        Path target = switch (in.kind()) {
          case FARM -> farmFile = inside(farmDir, in, run);
          case FORECAST -> forecast = inside(farmDir, in, run);
          case CROP_PROFILE -> inside(profiles, in, run);
          case RULE -> inside(rules, in, run);
          case READINGS -> throw new org.rimeward.io.BadInputException("run " + run.runId()
              + " re-planned the night from station readings; replaying such a run is not"
              + " supported yet: replay the evening's run instead");
        };
        Files.createDirectories(target.getParent());
        Files.write(target, in.content());
      }
      if (farmFile == null || forecast == null) {
        throw new org.rimeward.io.BadInputException("run " + run.runId() + ": the trail holds no "
            + (farmFile == null ? "farm file" : "forecast") + " for it, so it cannot be replayed;"
            + " only runs recorded by 'rimeward plan' can");
      }
      // The forecast is passed by name: the farm file may have named it by another path.
      Plan plan = planner.plan(new PlanRequest(farmFile, forecast,
          cropProfilesDir != null ? cropProfilesDir : profiles,
          rulesDir != null ? rulesDir : rules, run.night()));
      // The recorded text must read as a plan document; it is compared key for key as written,
      // and keys a run recorded by an older version did not write are not differences.
      RunReport.plan(run);
      JsonNode recorded = JSON.readTree(run.planJson());
      ObjectNode now = PlanJson.toTree(plan);
      List<Difference> diffs = new ArrayList<>();
      diff("", recorded, now, diffs);
      return new Result(run, rulesDir != null, cropProfilesDir != null,
          inputChanges(run.inputs(), plan.inputs()), diffs);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot write the recorded inputs into " + tmp, e);
    } finally {
      deleteQuietly(tmp);
    }
  }

  /** The place of a recorded input under {@code dir}; a name that climbs out is refused. */
  private static Path inside(Path dir, RecordedInput in, RunRecord run) {
    Path p = dir.resolve(in.name()).normalize();
    if (!p.startsWith(dir) || p.equals(dir)) {
      throw new AuditIntegrityException("run " + run.runId() + ": recorded input name '"
          + in.name() + "' is not a path inside its folder; run 'rimeward audit verify'");
    }
    return p;
  }

  static List<InputChange> inputChanges(List<RecordedInput> recorded, PlanInputs now) {
    Map<String, RecordedInput> before = new LinkedHashMap<>();
    recorded.forEach(r -> before.put(r.kind() + "\0" + r.name(), r));
    Map<String, RecordedInput> after = new LinkedHashMap<>();
    for (PlanInputs.Input in : now.files()) {
      RecordedInput r = RecordedInput.of(RunRecorder.kind(in.kind()), in.name(), in.content());
      after.put(r.kind() + "\0" + r.name(), r);
    }
    Set<String> keys = new LinkedHashSet<>(before.keySet());
    keys.addAll(after.keySet());
    List<InputChange> out = new ArrayList<>();
    for (String k : keys) {
      RecordedInput b = before.get(k);
      RecordedInput a = after.get(k);
      if (b != null && a != null && b.sha256().equals(a.sha256())) {
        continue;
      }
      RecordedInput any = b != null ? b : a;
      out.add(new InputChange(any.kind(), any.name(), b == null ? null : b.sha256(),
          a == null ? null : a.sha256()));
    }
    out.sort(Comparator.comparing(InputChange::kind).thenComparing(InputChange::name));
    return out;
  }

  static void diff(String path, JsonNode a, JsonNode b, List<Difference> out) {
    if (a == null || b == null || a.isMissingNode() || b.isMissingNode()) {
      JsonNode ra = a == null || a.isMissingNode() ? null : a;
      JsonNode rb = b == null || b.isMissingNode() ? null : b;
      if (ra != null || rb != null) {
        out.add(new Difference(path, ra, rb));
      }
      return;
    }
    if (a.isObject() && b.isObject()) {
      Set<String> keys = new LinkedHashSet<>();
      a.fieldNames().forEachRemaining(keys::add);
      b.fieldNames().forEachRemaining(keys::add);
      for (String k : keys) {
        if (path.isEmpty() && IGNORED.contains(k) || IGNORED_ANYWHERE.contains(k)) {
          continue;
        }
        if (!a.has(k)) {
          continue;
        }
        // A rule's place in the firing order moves whenever any rule before it changes.
        if (k.equals("seq") && path.matches(".*rules/[^/]+")) {
          continue;
        }
        diff(path + "/" + escape(k), a.get(k), b.get(k), out);
      }
      return;
    }
    if (a.isArray() && b.isArray()) {
      String key = path.equals("/blocks") ? "block" : path.equals("/water") ? "source"
          : path.endsWith("/rules") || path.equals("/farm_rules") ? "id" : null;
      if (allText(a) && allText(b)) {
        // Lists of words or sentences (cautions, served blocks): what came and what went.
        Set<String> sa = texts(a);
        Set<String> sb = texts(b);
        for (String t : sa) {
          if (!sb.contains(t)) {
            out.add(new Difference(path, JSON.getNodeFactory().textNode(t), null));
          }
        }
        for (String t : sb) {
          if (!sa.contains(t)) {
            out.add(new Difference(path, null, JSON.getNodeFactory().textNode(t)));
          }
        }
        return;
      }
      if (key != null && key.equals("id") && !(keyed(a, key) && keyed(b, key))) {
        // Farm-wide rules fire once per water source: tell them apart by the source they name.
        key = SOURCE_KEY;
      }
      if (key != null && keyed(a, key) && keyed(b, key)) {
        Map<String, JsonNode> ma = byKey(a, key);
        Map<String, JsonNode> mb = byKey(b, key);
        Set<String> ids = new LinkedHashSet<>(ma.keySet());
        ids.addAll(mb.keySet());
        for (String id : ids) {
          diff(path + "/" + escape(id), ma.get(id), mb.get(id), out);
        }
        List<String> orderA = new ArrayList<>(ma.keySet());
        List<String> orderB = new ArrayList<>(mb.keySet());
        if (ma.keySet().equals(mb.keySet()) && !orderA.equals(orderB)) {
          out.add(new Difference(path + " (order)", JSON.valueToTree(orderA),
              JSON.valueToTree(orderB)));
        }
        return;
      }
      for (int i = 0; i < Math.max(a.size(), b.size()); i++) {
        diff(path + "/" + i, a.get(i), b.get(i), out);
      }
      return;
    }
    if (!a.equals(b) && !(a.isNumber() && b.isNumber() && a.decimalValue().compareTo(b.decimalValue()) == 0)) {
      out.add(new Difference(path, a, b));
    }
  }

  private static boolean allText(JsonNode arr) {
    for (JsonNode n : arr) {
      if (!n.isTextual()) {
        return false;
      }
    }
    return true;
  }

  private static Set<String> texts(JsonNode arr) {
    Set<String> out = new LinkedHashSet<>();
    arr.forEach(n -> out.add(n.asText()));
    return out;
  }

  private static final String SOURCE_KEY = "id@source";

  private static boolean keyed(JsonNode arr, String key) {
    Set<String> seen = new LinkedHashSet<>();
    for (JsonNode n : arr) {
      String k = keyOf(n, key);
      if (k == null || !seen.add(k)) {
        return false;
      }
    }
    return true;
  }

  /** The value that names an element: a field, or for farm-wide rules their id and source. */
  private static String keyOf(JsonNode n, String key) {
    if (!key.equals(SOURCE_KEY)) {
      return n.path(key).isTextual() ? n.path(key).asText() : null;
    }
    if (!n.path("id").isTextual()) {
      return null;
    }
    for (Iterator<Map.Entry<String, JsonNode>> it = n.path("values").properties().iterator(); it.hasNext();) {
      Map.Entry<String, JsonNode> e = it.next();
      if (e.getKey().endsWith("sourceId") && e.getValue().isTextual()) {
        return n.get("id").asText() + "@" + e.getValue().asText();
      }
    }
    return n.get("id").asText();
  }

  private static Map<String, JsonNode> byKey(JsonNode arr, String key) {
    Map<String, JsonNode> m = new LinkedHashMap<>();
    for (Iterator<JsonNode> it = arr.elements(); it.hasNext();) {
      JsonNode n = it.next();
      m.put(keyOf(n, key), n);
    }
    return m;
  }

  private static String escape(String k) {
    return k.replace("~", "~0").replace("/", "~1");
  }

  private static void deleteQuietly(Path dir) {
    try (Stream<Path> walk = Files.walk(dir)) {
      for (Path p : walk.sorted(Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    } catch (IOException e) {
      // A leftover temporary copy of inputs the trail already holds harms nothing.
    }
  }
}
