package org.rimeward.watch;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.CrewAction;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.Replanner;
import org.rimeward.rules.RuleBook;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * The watch keeps its audit trail open from pass to pass: what another program records meanwhile
 * (the crew's actions) is still read at each pass, the file alone holds what a pass wrote, and a
 * trail moved away mid-night is closed whole and a new one opened where the farm keeps it. On a
 * copy of the demo farm with invented readings equal to the demo forecast.
 */
class NightWatchTrailTest {
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  private static final LocalDate NIGHT = LocalDate.of(2026, 4, 14);
  @TempDir Path tmp;

  private static Instant at(String local) {
    return OffsetDateTime.parse("2026-04-" + local + "-07:00").toInstant();
  }

  @Test
  void theTrailKeptOpenStillSeesOthersAndMovesWithTheFarm() throws Exception {
    Path farm = DemoNight.farmWithReadings(tmp, at("14T18:00"), at("15T01:10"));
    Path readings = farm.resolve("readings.csv");
    Path db = farm.resolve("audit.db");
    Replanner rp = Replanner.load(new PlanRequest(farm, null, Path.of("crop-profiles"),
        Path.of("rules"), null), RuleBook::load);
    StringWriter out = new StringWriter();
    try (NightWatch watch = new NightWatch(rp, readings, Optional.empty(),
        WatchPolicy.from(rp.thresholds(), Duration.ofSeconds(10)),
        UnitFormat.of(UnitSystem.METRIC), Optional.of(db), Optional.empty(), new PrintWriter(out), new PrintWriter(new StringWriter()))) {
      NightWatch.Pass due = watch.pass(at("14T22:20"));
      assertThat(due.raised()).anyMatch(a -> a.blockId().equals("hollow-cherry")
          && a.kind() == AlarmKind.START_DUE);

      // The file alone, without its write-ahead log, holds what the pass wrote.
      Path copy = tmp.resolve("copy.db");
      Files.copy(db, copy);
      try (AuditStore alone = AuditStore.openReadOnly(copy)) {
        assertThat(alone.listAlarms(NIGHT)).hasSameSizeAs(due.raised());
        assertThat(alone.verify().intact()).isTrue();
      }

      // The crew records the start from another program while the watch holds the trail open.
      try (AuditStore crew = AuditStore.open(db)) {
        crew.appendAction(new CrewAction(at("14T22:45"), at("14T22:46"), NIGHT, "hollow-cherry",
            CrewAction.Kind.SPRINKLING_ON, "ana", "", Optional.empty(), Optional.empty()));
      }
      NightWatch.Pass overdue = watch.pass(at("14T23:10"));
      assertThat(overdue.raised()).noneMatch(a -> a.blockId().equals("hollow-cherry")
          && a.kind() == AlarmKind.START_DUE);
      // Overdue it is: without the crew's record the alarm would escalate.
      assertThat(overdue.plan().blocks().stream().filter(b -> b.blockId().equals("hollow-cherry"))
          .findFirst().orElseThrow().sprinkle().filter(s -> s.withWater()).orElseThrow().start())
          .isBefore(at("14T23:10"));

      // The trail is moved away mid-night: the old file is closed whole, a new one is started.
      Path moved = tmp.resolve("moved.db");
      Files.move(db, moved);
      NightWatch.Pass morning = watch.pass(at("15T09:30"));
      assertThat(morning.raised()).anyMatch(a -> a.kind() == AlarmKind.STOP_ALLOWED);
      try (AuditStore old = AuditStore.openReadOnly(moved)) {
        assertThat(old.verify().intact()).isTrue();
        assertThat(old.listAlarms(NIGHT)).noneMatch(a -> a.kind().equals("stop-allowed"));
        assertThat(old.listActions(NIGHT, Optional.empty())).hasSize(1);
      }
      try (AuditStore fresh = AuditStore.openReadOnly(db)) {
        assertThat(fresh.verify().intact()).isTrue();
        assertThat(fresh.listAlarms(NIGHT)).anyMatch(a -> a.kind().equals("stop-allowed"));
      }
    }
  }
}
