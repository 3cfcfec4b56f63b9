package org.rimeward.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Optional;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunSummary;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanChanges;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.Replanner;
import org.rimeward.rules.RuleBook;
import org.rimeward.weather.Readings;
import org.rimeward.weather.ReadingsReader;

/** 'plan --readings': the rest of the night from now, and what changed since the last plan. */
final class NightReplan {
  private NightReplan() {}

  static Plan run(PlanRequest request, Path readingsFile, String nowText, String station,
      Instant clockNow, Path auditDb) {
    Replanner rp = Replanner.load(request, RuleBook::load);
    Instant now = nowText == null ? clockNow : ActionCommand.parseTime(nowText, "--now",
        rp.farm().zone());
    Readings readings = ReadingsReader.read(readingsFile, rp.farm().zone());
    Plan plan = rp.replan(readings, ReadingsReader.bytes(readingsFile), now,
        Optional.ofNullable(station));
    return withChanges(plan, auditDb);
  }

  /** The plan with its changes against the latest recorded run for the night, if there is one. */
  static Plan withChanges(Plan plan, Path auditDb) {
    if (auditDb == null || !Files.isRegularFile(auditDb)) {
      return plan;
    }
    try (AuditStore store = AuditStore.openReadOnly(auditDb)) {
      Optional<RunRecord> last = store.listRuns(Optional.of(plan.night().date()), Optional.empty())
          .stream().filter(r -> r.night().equals(plan.night().date())).findFirst()
          .map(RunSummary::runId).flatMap(store::loadRun);
      return last.map(r -> plan.withUpdate(plan.update().withChanges(
          PlanChanges.between(r.planJson(), plan)))).orElse(plan);
    } catch (org.rimeward.audit.AuditUnavailableException e) {
      // An older trail not yet migrated, or one being written: no comparison, the plan stands.
      return plan;
    } catch (BadInputException e) {
      return plan;
    }
  }
}
