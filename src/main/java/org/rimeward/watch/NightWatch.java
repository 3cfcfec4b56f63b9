package org.rimeward.watch;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunRecorder;
import org.rimeward.audit.RunSummary;
import org.rimeward.audit.WatchAlarm;
import org.rimeward.plan.Action;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.NightUpdate;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanChanges;
import org.rimeward.plan.Replanner;
import org.rimeward.units.UnitFormat;
import org.rimeward.weather.Reading;
import org.rimeward.weather.Readings;
import org.rimeward.weather.ReadingsReader;

/**
 * The night watch: every interval it reads what the logger appended, re-plans the rest of the
 * night, and raises alarms, each once per block per night unless it escalates. Alarms, and every
 * re-plan that changed a decision, go to the audit trail, whose record of alarms also keeps a
 * restarted watch from raising them again.
 */
public final class NightWatch implements AutoCloseable {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private final Replanner replanner;
  private final Path readingsFile;
  private final ReadingsReader tail;
  private final Optional<String> station;
  private final WatchPolicy policy;
  private final UnitFormat units;
  private final Optional<Path> auditDb;
  private final Optional<GrowerCommand> command;
  private final PrintWriter out;
  private final PrintWriter err;
  private final List<Reading> readings = new ArrayList<>();
  private final List<Readings.Skipped> skipped = new ArrayList<>();
  private final Map<String, Integer> raised = new HashMap<>();
  /** Undeclared stations already reported: once a watch, not once a pass. */
  private final Set<String> announced = new HashSet<>();
  private Map<String, String> lastDecisions;
  private String lastRunId;
  private Plan lastPlan;
  private AuditStore trail;
  private Object trailKey;
  private boolean trailLoaded;
  private volatile boolean stopping;
  private final CountDownLatch wake = new CountDownLatch(1);

  public NightWatch(Replanner replanner, Path readingsFile, Optional<String> station,
      WatchPolicy policy, UnitFormat units, Optional<Path> auditDb, Optional<String> onAlarm,
      PrintWriter out, PrintWriter err) {
    this.replanner = replanner;
    this.readingsFile = readingsFile;
    this.tail = new ReadingsReader(readingsFile, replanner.farm().zone());
    this.station = station;
    this.policy = policy;
    this.units = units;
    this.auditDb = auditDb;
    this.command = onAlarm.map(c -> new GrowerCommand(c, policy.commandTimeout()));
    this.out = out;
    this.err = err;
  }

  /** The result of one pass. */
  public record Pass(Plan plan, List<Alarm> raised, boolean recorded) {}

  /** One pass at {@code now}: read, re-plan, raise. */
  public Pass pass(Instant now) {
    ReadingsReader.Batch batch = tail.poll();
    if (batch.restarted()) {
      readings.clear();
      skipped.clear();
      announced.clear();
    }
    readings.addAll(batch.readings());
    skipped.addAll(batch.skipped());
    for (Readings.Skipped s : batch.skipped()) {
      err.println("rimeward: " + s.message());
    }
    Readings all = new Readings(readingsFile, readings, skipped);
    byte[] bytes = ReadingsReader.bytes(readingsFile);
    Plan plan = replanner.replan(all, bytes, now, station);
    for (NightUpdate.StationSummary st : plan.update().readings().stations()) {
      if (!st.declared() && !replanner.farm().stations().isEmpty() && st.blocks().isEmpty()
          && announced.add(st.id())) {
        err.println("rimeward: " + readingsFile.getFileName() + ": " + (st.id().isEmpty()
            ? "" : "station '" + st.id() + "': ") + st.note());
        err.flush();
      }
    }
    ZoneId zone = replanner.farm().zone();
    Set<String> running = new HashSet<>();
    boolean recorded = false;
    String runId = null;
    AuditStore store = auditDb.map(this::trail).orElse(null);
    try {
      if (store != null) {
        if (!trailLoaded) {
          for (WatchAlarm a : store.listAlarms(replanner.night())) {
            raised.merge(a.blockId() + "\u0000" + a.kind(), a.level(), Math::max);
          }
          trailLoaded = true;
        }
        for (CrewAction a : store.listActions(replanner.night(), Optional.empty())) {
          if (a.kind() == CrewAction.Kind.SPRINKLING_ON) {
            running.add(a.blockId());
          }
        }
        Map<String, String> decisions = decisions(plan);
        if (lastDecisions == null || changed(lastDecisions, decisions)) {
          plan = withChanges(plan, store);
          RunRecord rec = RunRecorder.toRecord(plan, now);
          store.appendRun(rec);
          lastRunId = rec.runId();
          lastDecisions = decisions;
          recorded = true;
        }
        runId = lastRunId;
      }
      List<Alarm> fresh = new ArrayList<>();
      for (Alarm a : AlarmCheck.check(plan, replanner, now, policy, units)) {
        if (a.kind() == AlarmKind.START_DUE && a.level() > 1 && running.contains(a.blockId())) {
          continue;
        }
        if (a.level() > raised.getOrDefault(a.key(), 0)) {
          raised.put(a.key(), a.level());
          fresh.add(a);
          String line = String.format(Locale.ROOT, "\u0007%s  %-16s %-21s %s", CLOCK.format(
              a.at().atZone(zone)), a.blockId(), a.kind().word(), a.message());
          out.println(line);
          out.flush();
          Optional<String> status = command.map(c -> c.run(a, zone));
          status.filter(st -> !st.equals("exit 0")).ifPresent(st -> {
            err.println("rimeward: --on-alarm command for " + a.kind().word() + " on " + a.blockId()
                + ": " + st + "; the watch goes on");
            err.flush();
          });
          if (store != null) {
            store.appendAlarm(new WatchAlarm(a.at(), replanner.night(), a.blockId(), a.kind().word(),
                a.level(), a.message(), Optional.ofNullable(runId), status));
          }
        }
      }
      if (store != null && (recorded || !fresh.isEmpty())) {
        store.checkpoint();
      }
      lastPlan = plan;
      return new Pass(plan, fresh, recorded);
    } catch (RuntimeException e) {
      // The next pass opens the trail afresh rather than trust a connection that failed.
      closeTrail();
      throw e;
    }
  }

  /**
   * The audit trail, opened on the first pass and kept open through the night: opening it checks
   * and migrates the schema in a write transaction, which every pass would otherwise repeat. Each
   * pass still reads the crew's actions from it; a pass that wrote copies its log into the file
   * (as closing did), so a copy of audit.db alone holds every record; and it is opened again when
   * the file is no longer the one opened (moved, replaced or deleted), closing the old one first so
   * that its log is not left for the new file, and nothing is written to a file the farm no longer
   * keeps.
   */
  private AuditStore trail(Path db) {
    Object key = fileKey(db);
    if (trail != null && key != null && key.equals(trailKey)) {
      return trail;
    }
    closeTrail();
    trail = AuditStore.open(db);
    trailKey = fileKey(db);
    return trail;
  }

  private static Object fileKey(Path p) {
    try {
      return Files.readAttributes(p, BasicFileAttributes.class).fileKey();
    } catch (IOException e) {
      return null;
    }
  }

  private void closeTrail() {
    if (trail != null) {
      AuditStore t = trail;
      trail = null;
      trailKey = null;
      t.close();
    }
  }

  /** Closes the audit trail the passes kept open. */
  @Override
  public void close() {
    closeTrail();
  }

  /**
   * A planned time must move at least this much for a re-plan to count as a changed decision and
   * be recorded: a minute's drift as readings come in is not a new decision (a Rimeward choice;
   * any change of status, method or water grant is recorded at once).
   */
  static final Duration RECORD_SHIFT = Duration.ofMinutes(10);

  /** What the grower acts on, per block: status and method ("kind") and the planned times. */
  static Map<String, String> decisions(Plan plan) {
    Map<String, String> m = new HashMap<>();
    for (BlockPlan b : plan.blocks()) {
      StringBuilder kind = new StringBuilder(b.status().name());
      StringBuilder times = new StringBuilder();
      for (Action a : b.actions()) {
        if (a instanceof Action.Sprinkle sp) {
          kind.append(" sprinkle ").append(sp.grant());
          times.append(epoch(sp.start())).append(',').append(epoch(sp.stop())).append(',');
        } else if (a instanceof Action.Cover c) {
          kind.append(" cover");
          times.append(epoch(c.deployStart())).append(',').append(epoch(c.remove())).append(',');
        }
      }
      m.put(b.blockId(), kind + "|" + times);
    }
    return m;
  }

  static boolean changed(Map<String, String> before, Map<String, String> after) {
    if (!before.keySet().equals(after.keySet())) {
      return true;
    }
    for (var e : after.entrySet()) {
      String[] a = e.getValue().split("\\|", -1);
      String[] b = before.get(e.getKey()).split("\\|", -1);
      if (!a[0].equals(b[0])) {
        return true;
      }
      String[] ta = a[1].split(",");
      String[] tb = b[1].split(",");
      if (ta.length != tb.length) {
        return true;
      }
      for (int i = 0; i < ta.length; i++) {
        if (!ta[i].isEmpty() && Math.abs(Long.parseLong(ta[i]) - Long.parseLong(tb[i]))
            >= RECORD_SHIFT.toSeconds()) {
          return true;
        }
      }
    }
    return false;
  }

  private static String epoch(Instant t) {
    return t == null ? "0" : Long.toString(t.getEpochSecond());
  }

  private Plan withChanges(Plan plan, AuditStore store) {
    Optional<RunRecord> last = store.listRuns(Optional.of(plan.night().date()), Optional.empty())
        .stream().filter(r -> r.night().equals(plan.night().date())).findFirst()
        .map(RunSummary::runId).flatMap(store::loadRun);
    return last.map(r -> plan.withUpdate(plan.update().withChanges(
        PlanChanges.between(r.planJson(), plan)))).orElse(plan);
  }

  /** When the watch ends: after the morning's last stop, or an hour after sunrise. */
  public Instant endsAt() {
    Instant end = replanner.sunrise().plus(Duration.ofHours(1));
    if (lastPlan != null) {
      for (BlockPlan b : lastPlan.blocks()) {
        for (Action a : b.actions()) {
          Instant t = a instanceof Action.Sprinkle s ? s.stop()
              : a instanceof Action.Cover c ? c.remove() : null;
          if (t != null && t.isAfter(end)) {
            end = t;
          }
        }
      }
    }
    return end;
  }

  /** Passes every {@code every} until the morning's last stop or {@link #stop()}. */
  public int run(Clock clock, Duration every) throws InterruptedException {
    int alarms = 0;
    while (!stopping) {
      Instant now = clock.instant();
      alarms += pass(now).raised().size();
      if (now.isAfter(endsAt())) {
        out.println("watch ends: the morning's last stop (" + CLOCK.format(endsAt().atZone(
            replanner.farm().zone())) + ") has passed");
        break;
      }
      if (wake.await(every.toMillis(), TimeUnit.MILLISECONDS)) {
        break;
      }
    }
    out.flush();
    return alarms;
  }

  /** Ends {@link #run} at once, after the pass under way; safe from a signal handler thread. */
  public void stop() {
    stopping = true;
    wake.countDown();
  }

  /** How many alarm keys are held: the benchmark's check that memory does not grow with passes. */
  public int readingsHeld() {
    return readings.size();
  }
}
