package org.rimeward.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.time.LocalDate;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RunSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "list",
    description = "List recorded runs, newest first: id, time recorded, night, and how many blocks"
        + " needed protection.")
final class AuditListCommand implements Callable<Integer> {
  private static final DateTimeFormatter LOCAL =
      DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm z", Locale.ROOT);

  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Option(names = "--since", paramLabel = "DATE",
      description = "Only runs for this night (YYYY-MM-DD) or later.")
  LocalDate since;

  @Option(names = "--block", paramLabel = "ID", description = "Only runs that planned this block.")
  String block;

  @Option(names = "--json", description = "Print JSON instead of a table.")
  boolean json;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      List<RunSummary> runs;
      try (AuditStore store = where.openForReading()) {
        runs = store.listRuns(Optional.ofNullable(since), Optional.ofNullable(block));
      }
      PrintWriter out = spec.commandLine().getOut();
      if (json) {
        ObjectMapper m = org.rimeward.io.Json.mapper();
        ArrayNode arr = m.createArrayNode();
        for (RunSummary r : runs) {
          ObjectNode n = arr.addObject();
          n.put("run_id", r.runId());
          n.put("ran_at", r.ranAt().toString());
          n.put("night", r.night().toString());
          n.put("farm", r.farmName());
          n.put("blocks", r.blockCount());
          n.put("blocks_needing_protection", r.protectionNeededCount());
          n.put("blocks_unprotected", r.unprotectedCount());
        }
        out.print(org.rimeward.io.Json.pretty(arr));
        return Main.OK;
      }
      if (runs.isEmpty()) {
        out.println("no runs recorded in " + where.file()
            + (since != null || block != null ? " that match the filter" : ""));
        return Main.OK;
      }
      int idWidth = Math.max(3, runs.stream().mapToInt(r -> r.runId().length()).max().orElse(3));
      List<String> times = runs.stream().map(r -> LOCAL.format(r.ranAt().atZone(
          java.time.ZoneId.of(r.zoneId())))).toList();
      int timeWidth = Math.max(8, times.stream().mapToInt(String::length).max().orElse(8));
      String row = "%-" + idWidth + "s  %-" + timeWidth + "s  %-10s  %s%n";
      out.printf(Locale.ROOT, row, "RUN", "RECORDED", "NIGHT", "NEEDED PROTECTION");
      for (int i = 0; i < runs.size(); i++) {
        RunSummary r = runs.get(i);
        out.printf(Locale.ROOT, row, r.runId(), times.get(i), r.night(),
            r.protectionNeededCount() + " of " + r.blockCount() + " blocks"
                + (r.unprotectedCount() == 0 ? "" : " (" + r.unprotectedCount()
                    + " left unprotected)"));
      }
      return Main.OK;
    });
  }
}
