package org.rimeward.report;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.ChainHead;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.RecordedInput;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunReport;
import org.rimeward.audit.RunSummary;
import org.rimeward.units.UnitFormat;

/**
 * Pages from the audit trail: a recorded run's night page with the footer that lets a filed copy
 * be checked against the trail, and the runs a season is made of. It only reads the trail.
 */
public final class RecordedPages {
  private RecordedPages() {}

  /**
   * The page of a recorded run, as {@code plan --format html} made it that night, with what the
   * crew recorded beside the advice and a footer naming the run, its inputs and the chain head.
   */
  public static String night(RunRecord run, List<CrewAction> actions, ChainHead head,
      UnitFormat fmt, Instant now) {
    ZoneId zone = ZoneId.of(run.zoneId());
    List<NightPage.Input> inputs = new ArrayList<>();
    for (RecordedInput in : run.inputs()) {
      inputs.add(new NightPage.Input(in.kind().name().toLowerCase(java.util.Locale.ROOT)
          .replace('_', '-'), in.name(), in.sha256()));
    }
    NightPage.Footer footer = new NightPage.Footer(run.runId(),
        fmt.stamp(run.ranAt().atZone(zone).toOffsetDateTime()) + " " + zone.getId(),
        run.toolVersion(), inputs, head.seq(), head.hash(),
        fmt.stamp(now.atZone(zone).toOffsetDateTime()) + " " + zone.getId());
    return NightPage.html(NightPage.of(RunReport.plan(run), fmt,
        RunReport.explainer(run, fmt.system()), doneWords(actions, fmt, zone), footer));
  }

  /** What the crew recorded, per block, in words with local times, marked by who did it. */
  static Map<String, List<String>> doneWords(List<CrewAction> actions, UnitFormat fmt, ZoneId zone) {
    Map<String, List<String>> out = new TreeMap<>();
    actions.stream().sorted(Comparator.comparing(CrewAction::at)).forEach(a -> out
        .computeIfAbsent(a.blockId(), k -> new ArrayList<>())
        .add(a.kind().word().replace('-', ' ') + " at " + fmt.clock(a.at().atZone(zone)
            .toOffsetDateTime()) + " (recorded by " + a.by() + ")"
            + a.warning().map(w -> "; " + w).orElse("")));
    return out;
  }

  /**
   * The runs a season is made of: for each night between {@code from} and {@code to}, its
   * latest run, with the hours of sprinkling the crew recorded for each block.
   */
  public static List<Season.Run> seasonRuns(AuditStore store, LocalDate from, LocalDate to) {
    Map<LocalDate, RunSummary> latest = new TreeMap<>();
    for (RunSummary s : store.listRuns(Optional.empty(), Optional.empty())) {
      if ((from != null && s.night().isBefore(from)) || (to != null && s.night().isAfter(to))) {
        continue;
      }
      latest.merge(s.night(), s, (a, b) -> Comparator.comparing(RunSummary::ranAt)
          .thenComparing(RunSummary::runId).compare(a, b) >= 0 ? a : b);
    }
    List<Season.Run> runs = new ArrayList<>();
    for (RunSummary s : latest.values()) {
      RunRecord run = store.loadRun(s.runId()).orElseThrow();
      runs.add(new Season.Run(run.runId(), run.ranAt(), RunReport.plan(run),
          doneSprinkleHours(store.listActions(s.night(), Optional.empty()))));
    }
    return runs;
  }

  /** Hours between each block's recorded sprinkling on and the next off, summed. */
  static Map<String, Double> doneSprinkleHours(List<CrewAction> actions) {
    Map<String, Double> hours = new HashMap<>();
    Map<String, Instant> on = new HashMap<>();
    for (CrewAction a : actions.stream().sorted(Comparator.comparing(CrewAction::at)).toList()) {
      if (a.kind() == CrewAction.Kind.SPRINKLING_ON) {
        on.putIfAbsent(a.blockId(), a.at());
      } else if (a.kind() == CrewAction.Kind.SPRINKLING_OFF && on.containsKey(a.blockId())) {
        hours.merge(a.blockId(),
            Duration.between(on.remove(a.blockId()), a.at()).toMinutes() / 60.0, Double::sum);
      }
    }
    return hours;
  }
}
