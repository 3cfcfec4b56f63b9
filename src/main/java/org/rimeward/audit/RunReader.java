package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.type.TypeReference;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rimeward.audit.Schema.Table;
import org.rimeward.crop.ProfileEdit;

/**
 * Reads runs and profile edits back out of the trail, by column name, checking every row against
 * its chain hash as it goes: a changed row stops the read rather than reach a replay or a report.
 * Works on a read-only connection.
 */
final class RunReader {
  private static final ObjectMapper JSON = org.rimeward.io.Json.mapper();

  private final Connection conn;

  RunReader(Connection conn) {
    this.conn = conn;
  }

  List<RunSummary> list(Optional<LocalDate> since, Optional<String> blockId) throws SQLException {
    // Blocks that needed protection: those the plan protected and those it could not (short of
    // water, unprotected), which the recorded protection_count leaves out.
    String sql = "SELECT run_id, ran_at, night, farm_name, zone_id, block_count, protection_count,"
        + " (SELECT count(*) FROM run_blocks b WHERE b.run_id = runs.run_id AND (b.protection_needed"
        + " = 1 OR b.status IN ('short-of-water', 'unprotected', 'partly-protected'))) AS needing,"
        + " (SELECT count(*) FROM run_blocks b WHERE b.run_id = runs.run_id AND b.status IN"
        + " ('short-of-water', 'unprotected')) AS unprotected FROM runs"
        + " WHERE (?1 IS NULL OR night >= ?1) AND (?2 IS NULL OR EXISTS (SELECT 1 FROM run_blocks b"
        + " WHERE b.run_id = runs.run_id AND b.block_id = ?2)) ORDER BY ran_at DESC, seq DESC";
    try (PreparedStatement ps = conn.prepareStatement(sql)) {
      ps.setString(1, since.map(LocalDate::toString).orElse(null));
      ps.setString(2, blockId.orElse(null));
      List<RunSummary> out = new ArrayList<>();
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          out.add(new RunSummary(rs.getString("run_id"), Instant.parse(rs.getString("ran_at")),
              LocalDate.parse(rs.getString("night")), rs.getString("farm_name"),
              rs.getInt("block_count"), Math.max(rs.getInt("protection_count"),
                  rs.getInt("needing")), rs.getInt("unprotected"), rs.getString("zone_id")));
        }
      }
      return out;
    }
  }

  /** The ids of runs whose id is {@code p} or starts with it, the exact match first, at most 6. */
  List<String> idsMatching(String p) throws SQLException {
    List<String> ids = new ArrayList<>();
    try (PreparedStatement ps = conn.prepareStatement(
        "SELECT run_id FROM runs WHERE run_id = ?1 OR substr(run_id, 1, length(?1)) = ?1"
            + " ORDER BY run_id = ?1 DESC, run_id LIMIT 6")) {
      ps.setString(1, p);
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          ids.add(rs.getString(1));
        }
      }
    }
    return ids;
  }

  /** The newest run that planned {@code blockId}, for {@code night} when given. */
  Optional<RunRecord> latestFor(String blockId, Optional<LocalDate> night) throws SQLException {
    try (PreparedStatement ps = conn.prepareStatement("SELECT r.run_id FROM runs r JOIN"
        + " run_blocks b ON b.run_id = r.run_id WHERE b.block_id = ?1 AND (?2 IS NULL OR"
        + " r.night = ?2) ORDER BY r.ran_at DESC, r.seq DESC LIMIT 1")) {
      ps.setString(1, blockId);
      ps.setString(2, night.map(LocalDate::toString).orElse(null));
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next() ? Optional.of(load(rs.getString(1))) : Optional.empty();
      }
    }
  }

  List<ProfileEdit> profileEdits() throws SQLException {
    List<ProfileEdit> out = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.PROFILE_EDITS, "1 = 1 ORDER BY t.seq")) {
      out.add(edit(r));
    }
    return out;
  }

  List<CrewAction> actions(LocalDate night, Optional<String> blockId) throws SQLException {
    List<CrewAction> out = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.CREW_ACTIONS, "t.night = ? AND (? IS NULL OR"
        + " t.block_id = ?) ORDER BY t.at, t.seq", night.toString(), blockId.orElse(null),
        blockId.orElse(null))) {
      CrewAction.Kind kind = CrewAction.Kind.ofWord(r.text("kind")).orElseThrow(() ->
          new AuditIntegrityException(r.describe() + " has an unknown kind '" + r.text("kind") + "'"));
      out.add(new CrewAction(Instant.parse(r.text("at")), Instant.parse(r.text("recorded_at")),
          LocalDate.parse(r.text("night")), r.text("block_id"), kind, r.text("done_by"),
          r.text("note"), Optional.ofNullable(r.text("advised_run_id")),
          Optional.ofNullable(r.text("warning"))));
    }
    return out;
  }

  /**
   * Every profile edit with what became of it, oldest first. An edit belongs to the pending change
   * committed with it (the first change row after it, which counts its edits); the change's
   * settling row says whether it reached the file.
   */
  List<RecordedEdit> profileEditsWithState() throws SQLException {
    List<StoredRow> changes = StoredRow.select(conn, Table.FILE_CHANGES, "1 = 1 ORDER BY t.seq");
    Map<Long, String> outcome = new HashMap<>();
    for (StoredRow c : changes) {
      if (c.integer("settles_seq") != null) {
        outcome.put(c.integer("settles_seq"), c.text("state"));
      }
    }
    List<RecordedEdit> out = new ArrayList<>();
    int next = 0;
    for (StoredRow r : StoredRow.select(conn, Table.PROFILE_EDITS, "1 = 1 ORDER BY t.seq")) {
      while (next < changes.size() && (changes.get(next).seq() < r.seq()
          || changes.get(next).integer("settles_seq") != null)) {
        next++;
      }
      String state = "recorded";
      if (next < changes.size()) {
        StoredRow pending = changes.get(next);
        if (pending.seq() - pending.integer("edit_count") <= r.seq()) {
          state = outcome.getOrDefault(pending.seq(), "pending");
        }
      }
      out.add(new RecordedEdit(r.seq(), edit(r), state));
    }
    return out;
  }

  private static ProfileEdit edit(StoredRow r) {
    return new ProfileEdit(Instant.parse(r.text("at")), r.text("edited_by"), r.text("file"),
        r.text("crop"), r.text("variety"), r.text("stage"), r.text("field"), r.real("before_c"),
        r.real("after_c"), r.text("note"));
  }

  List<WatchAlarm> alarms(LocalDate night) throws SQLException {
    List<WatchAlarm> out = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.WATCH_ALARMS, "t.night = ? ORDER BY t.seq",
        night.toString())) {
      out.add(new WatchAlarm(Instant.parse(r.text("at")), LocalDate.parse(r.text("night")),
          r.text("block_id"), r.text("kind"), Math.toIntExact(r.integer("level")), r.text("message"),
          Optional.ofNullable(r.text("run_id")), Optional.ofNullable(r.text("command_status"))));
    }
    return out;
  }

  /** SHA-256 of no bytes: an empty input is stored as it is. */
  private static final String EMPTY_SHA256 =
      "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855";

  /** Whether the trail already holds these bytes in full, under their hash. */
  static boolean storedOnce(Connection conn, String sha256) throws SQLException {
    if (EMPTY_SHA256.equals(sha256)) {
      return false;
    }
    try (PreparedStatement ps = conn.prepareStatement("SELECT 1 FROM run_inputs WHERE sha256 = ?"
        + " AND length(content) > 0 LIMIT 1")) {
      ps.setString(1, sha256);
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next();
      }
    }
  }

  /** The bytes of an input stored once elsewhere in the trail, checked against their row's hash. */
  private byte[] contentOf(String sha256, StoredRow referring) throws SQLException {
    List<StoredRow> full = StoredRow.select(conn, Table.RUN_INPUTS, "t.sha256 = ? AND"
        + " length(t.content) > 0 ORDER BY t.seq LIMIT 1", sha256);
    if (full.isEmpty()) {
      throw new AuditIntegrityException(referring.describe() + " refers to bytes (sha256 "
          + sha256 + ") no longer in the trail; run 'rimeward audit verify'");
    }
    return full.get(0).blob("content");
  }

  /** The whole run with this exact id, which must exist. */
  RunRecord load(String runId) throws SQLException {
    StoredRow run = StoredRow.select(conn, Table.RUNS, "t.run_id = ?", runId).get(0);
    List<RecordedInput> inputs = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.RUN_INPUTS, "t.run_id = ? ORDER BY t.ord",
        runId)) {
      try {
        byte[] content = r.blob("content");
        if (content.length == 0 && !EMPTY_SHA256.equals(r.text("sha256"))) {
          content = contentOf(r.text("sha256"), r);
        }
        inputs.add(new RecordedInput(InputKind.valueOf(r.text("kind")), r.text("name"),
            r.text("sha256"), content));
      } catch (IllegalArgumentException e) {
        throw new AuditIntegrityException(r.describe() + " cannot be read back: " + e.getMessage());
      }
    }
    Map<String, List<RecordedRule>> rulesByBlock = new HashMap<>();
    for (StoredRow r : StoredRow.select(conn, Table.RUN_RULES,
        "t.run_id = ? ORDER BY t.block_id, t.fire_seq", runId)) {
      rulesByBlock.computeIfAbsent(r.text("block_id"), k -> new ArrayList<>()).add(
          new RecordedRule(Math.toIntExact(r.integer("fire_seq")), r.text("rule_id"),
              r.text("explanation"), r.text("facts_json")));
    }
    List<RecordedBlock> blocks = new ArrayList<>();
    for (StoredRow r : StoredRow.select(conn, Table.RUN_BLOCKS, "t.run_id = ? ORDER BY t.ord",
        runId)) {
      String blockId = r.text("block_id");
      List<RecordedRule> rules = rulesByBlock.getOrDefault(blockId, List.of());
      if (rules.size() != r.integer("rule_count")) {
        throw new AuditIntegrityException(r.describe() + " lists " + r.integer("rule_count")
            + " rules but " + rules.size() + " are recorded; run 'rimeward audit verify'");
      }
      blocks.add(new RecordedBlock(blockId, r.text("status"), r.text("risk"),
          r.integer("protection_needed") != 0, r.text("decision_json"), rules));
    }
    if (inputs.size() != run.integer("input_count") || blocks.size() != run.integer("block_count")) {
      throw new AuditIntegrityException(run.describe() + " lists " + run.integer("input_count")
          + " inputs and " + run.integer("block_count") + " blocks but " + inputs.size() + " and "
          + blocks.size() + " are recorded; run 'rimeward audit verify'");
    }
    List<String> cautions;
    try {
      cautions = JSON.readValue(run.text("cautions_json"), new TypeReference<List<String>>() {});
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException(run.describe() + " has unreadable cautions");
    }
    return new RunRecord(runId, Instant.parse(run.text("ran_at")), run.text("tool_version"),
        run.text("farm_name"), LocalDate.parse(run.text("night")), run.text("zone_id"),
        run.text("policy_json"), inputs, blocks, cautions, run.text("plan_json"));
  }
}
