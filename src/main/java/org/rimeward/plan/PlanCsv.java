package org.rimeward.plan;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rimeward.io.Json;

/**
 * The plan as CSV, the one schema of {@code plan --format csv} and {@code audit export --format
 * csv}: one row per block action (a block with nothing to do has one row, method {@code none}),
 * metric, times local with their offset, LF line endings. An export puts the run id and the
 * trail's chain head first.
 */
public final class PlanCsv {
  /** The columns, without the export's leading {@code run_id} and {@code chain_head}. */
  public static final List<String> COLUMNS = List.of("night", "block", "crop", "variety", "stage",
      "risk", "kill_pct_unprotected", "status", "method", "start", "stop", "required_rate_mm_h",
      "installed_rate_mm_h", "water_m3", "source", "water_granted", "area_ha", "flow_m3_h", "grant",
      "decision_rules", "done_start", "done_stop");

  /** What the crew recorded for a block's action: its first start and last stop, or empty. */
  @FunctionalInterface
  public interface Done {
    /** {@code [done_start, done_stop]} for the block and the action's method. */
    String[] times(String block, String method);

    /** Nothing recorded: tonight's plan, before anyone acted on it. */
    Done NOTHING = (block, method) -> new String[] {"", ""};
  }

  /**
   * Where a recorded run's rows came from: the run, and the trail's newest record when the export
   * was made, written {@code SEQ:HASH} as {@code audit head} prints it. The head is on every row so
   * that a filed copy, or any row cut from it into a spreadsheet, can be checked later with {@code
   * audit verify --head}.
   */
  public record Recorded(String runId, String chainHead) {
    public Recorded {
      if (runId == null || runId.isBlank() || chainHead == null || chainHead.isBlank()) {
        throw new IllegalArgumentException("a recorded run's CSV needs its run id and chain head");
      }
    }
  }

  private PlanCsv() {}

  public static String render(Plan plan) {
    return render(PlanDocuments.of(plan), null, Done.NOTHING);
  }

  /**
   * The document as CSV.
   *
   * @param recorded the recorded run for the leading {@code run_id} and {@code chain_head}
   *     columns; null for tonight's plan, which has neither
   * @param done what the crew recorded for each action
   */
  public static String render(PlanDocument plan, Recorded recorded, Done done) {
    List<String> header = new ArrayList<>();
    if (recorded != null) {
      header.add("run_id");
      header.add("chain_head");
    }
    header.addAll(COLUMNS);
    StringWriter out = new StringWriter();
    try (CSVPrinter p = new CSVPrinter(out, CSVFormat.DEFAULT.builder()
        .setHeader(header.toArray(String[]::new)).setRecordSeparator("\n").get())) {
      for (PlanDocument.Block b : plan.blocks()) {
        // The decisions that made the row, so a spreadsheet reader can find the reason in the
        // trail: every decision rule that fired for the block, in firing order.
        String decided = b.rules().stream().filter(r -> "decision".equals(r.kind()))
            .map(PlanDocument.Rule::id).collect(Collectors.joining(" "));
        List<Object> head = new ArrayList<>();
        if (recorded != null) {
          head.add(recorded.runId());
          head.add(recorded.chainHead());
        }
        head.addAll(java.util.Arrays.asList(plan.night().date(), b.block(), b.crop(), b.variety(),
            b.stage(), b.risk(), Json.round(b.killPctUnprotected(), 1), b.status()));
        if (b.actions().isEmpty()) {
          p.printRecord(concat(head, "none", "", "", "", "", "", "", "", "", "", "", decided, "", ""));
        }
        for (PlanDocument.Action a : b.actions()) {
          if (a instanceof PlanDocument.Sprinkle s && !s.waterGranted()) {
            // Not "sprinkle" with times: a block granted no water keeps its sprinklers off.
            p.printRecord(concat(head, "sprinklers-off", "", "", Json.round(s.requiredRateMmH(), 2),
                "", "", s.source(), false, Json.round(0, 2), "", s.grant(), decided,
                done.times(b.block(), "sprinkle")[0], done.times(b.block(), "sprinkle")[1]));
          } else if (a instanceof PlanDocument.Sprinkle s) {
            p.printRecord(concat(head, "sprinkle", Json.time(s.start()), Json.time(s.stop()),
                Json.round(s.requiredRateMmH(), 2), Json.round(s.installedRateMmH(), 2),
                Json.round(s.waterM3(), 1), s.source(), true, Json.round(s.areaHa(), 2),
                Json.round(s.flowM3H(), 1), s.grant(), decided, done.times(b.block(), "sprinkle")[0],
                done.times(b.block(), "sprinkle")[1]));
          } else if (a instanceof PlanDocument.Cover c) {
            p.printRecord(concat(head, "cover", Json.time(c.deployStart()), Json.time(c.remove()),
                "", "", "", "", "", "", "", "", decided, done.times(b.block(), "cover")[0],
                done.times(b.block(), "cover")[1]));
          }
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  private static List<Object> concat(List<Object> head, Object... tail) {
    List<Object> all = new ArrayList<>(head);
    all.addAll(java.util.Arrays.asList(tail));
    return all;
  }
}
