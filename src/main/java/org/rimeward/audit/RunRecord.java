package org.rimeward.audit;

import java.security.SecureRandom;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Everything one nightly run read and decided, as the planner hands it to the audit trail.
 *
 * @param runId sortable and unique, as made by {@link #newRunId(Instant)}
 * @param ranAt when the run was made
 * @param night the date of the evening the plan is for
 * @param zoneId the farm's time zone (an IANA id such as {@code Europe/Berlin})
 * @param policyJson the protection policy the run applied, as JSON
 * @param inputs every file the run read, whole
 * @param blocks one entry per block, in plan order
 * @param cautions the run-wide cautions shown with the plan
 * @param planJson the full plan document as the planner printed it
 */
public record RunRecord(String runId, Instant ranAt, String toolVersion, String farmName,
    LocalDate night, String zoneId, String policyJson, List<RecordedInput> inputs,
    List<RecordedBlock> blocks, List<String> cautions, String planJson) {

  private static final Pattern RUN_ID = Pattern.compile("[A-Za-z0-9][A-Za-z0-9._:-]{0,99}");
  private static final DateTimeFormatter ID_TIME =
      DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HHmmss.SSS'Z'").withZone(ZoneOffset.UTC);
  private static final SecureRandom RANDOM = new SecureRandom();

  public RunRecord {
    if (runId == null || !RUN_ID.matcher(runId).matches()) {
      throw new IllegalArgumentException("run id '" + runId + "' must be 1-100 letters, digits,"
          + " '.', '_', ':' or '-'; make one with RunRecord.newRunId");
    }
    Objects.requireNonNull(ranAt, "ranAt of run " + runId);
    Objects.requireNonNull(toolVersion, "toolVersion of run " + runId);
    Objects.requireNonNull(farmName, "farmName of run " + runId);
    Objects.requireNonNull(night, "night of run " + runId);
    Objects.requireNonNull(zoneId, "zoneId of run " + runId);
    try {
      ZoneId.of(zoneId);
    } catch (java.time.DateTimeException e) {
      throw new IllegalArgumentException("run " + runId + ": zone '" + zoneId
          + "' is not a time zone id such as Europe/Berlin", e);
    }
    if (policyJson == null || policyJson.isBlank()) {
      throw new IllegalArgumentException("run " + runId + ": policyJson is missing; use {} when none");
    }
    if (planJson == null || planJson.isBlank()) {
      throw new IllegalArgumentException("run " + runId + ": planJson is missing");
    }
    inputs = List.copyOf(Objects.requireNonNull(inputs, "inputs of run " + runId));
    blocks = List.copyOf(Objects.requireNonNull(blocks, "blocks of run " + runId));
    cautions = List.copyOf(Objects.requireNonNull(cautions, "cautions of run " + runId));
    Set<String> seen = new HashSet<>();
    for (RecordedInput in : inputs) {
      if (!seen.add(in.kind() + "\0" + in.name())) {
        throw new IllegalArgumentException("run " + runId + ": input " + in.kind() + " "
            + in.name() + " is listed twice");
      }
    }
    seen.clear();
    for (RecordedBlock b : blocks) {
      if (!seen.add(b.blockId())) {
        throw new IllegalArgumentException("run " + runId + ": block " + b.blockId()
            + " is listed twice");
      }
    }
  }

  /**
   * A new run id: the UTC time to the millisecond, then 8 random hex digits, e.g.
   * {@code 2026-04-15T201503.123Z-1a2b3c4d}. Ids sort by time as text and carry no colon, so they
   * are safe in file names.
   */
  public static String newRunId(Instant ranAt) {
    return ID_TIME.format(ranAt) + "-" + String.format("%08x", RANDOM.nextInt());
  }

  /** The recorded block with that id, if the run planned it. */
  public java.util.Optional<RecordedBlock> block(String blockId) {
    return blocks.stream().filter(b -> b.blockId().equals(blockId)).findFirst();
  }

  /** The number of blocks that needed protection in this run. */
  public int protectionNeededCount() {
    return (int) blocks.stream().filter(RecordedBlock::protectionNeeded).count();
  }
}
