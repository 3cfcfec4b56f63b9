package org.rimeward.cli;

import java.io.PrintWriter;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RecordedEdit;
import org.rimeward.crop.ProfileEdit;
import org.rimeward.units.UnitSystem;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "edits",
    description = "List the crop-profile edits recorded in the trail, oldest first: when (local"
        + " time), who, which crop, variety, stage and value, before and after, the note, and"
        + " whether the edit reached its file.")
final class AuditEditsCommand implements Callable<Integer> {
  private static final DateTimeFormatter LOCAL =
      DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm", Locale.ROOT);

  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Option(names = "--crop", paramLabel = "CROP", description = "Only edits of this crop.")
  String crop;

  @Option(names = "--since", paramLabel = "DATE",
      description = "Only edits made on this day (YYYY-MM-DD, local time) or later.")
  LocalDate since;

  @Override
  public Integer call() throws Exception {
    return AuditCommand.guarded(spec, () -> {
      List<RecordedEdit> edits;
      try (AuditStore store = where.openForReading()) {
        edits = store.listRecordedEdits();
      }
      ZoneId zone = ZoneId.systemDefault();
      List<RecordedEdit> shown = edits.stream()
          .filter(e -> crop == null || e.edit().crop().equals(crop))
          .filter(e -> since == null || !e.edit().at().atZone(zone).toLocalDate().isBefore(since))
          .toList();
      PrintWriter out = spec.commandLine().getOut();
      if (shown.isEmpty()) {
        out.println("no profile edits recorded in " + where.file()
            + (crop != null || since != null ? " that match the filter" : ""));
        return Main.OK;
      }
      UnitSystem units = AuditCommand.units(spec);
      out.println("Profile edits in " + where.file() + " (times " + zone.getId() + ")");
      for (RecordedEdit r : shown) {
        ProfileEdit e = r.edit();
        out.printf(Locale.ROOT, "%s  %-10s %s%n", LOCAL.format(e.at().atZone(zone)), e.by(),
            what(e, units) + (r.applied() ? "" : "  [" + r.state() + ": not in the file]"));
        out.printf(Locale.ROOT, "%18s note: %s%n", "", e.note());
      }
      return Main.OK;
    });
  }

  /** "apple/rome-beauty tight-cluster T10 -2.8 °C → -3.0 °C (hardier)": what a person reads. */
  static String what(ProfileEdit e, UnitSystem units) {
    String target = e.crop() + (e.variety() == null ? "" : "/" + e.variety())
        + (e.stage() == null ? "" : " " + e.stage());
    if (e.field().equals("variety")) {
      return "new variety " + target + (e.afterC() == null ? ""
          : ", " + ProfileListWords.offset(e.afterC(), units));
    }
    String field = e.field().toUpperCase(Locale.ROOT);
    String before = e.beforeC() == null ? "none" : ProfileCommand.temp(e.beforeC(), units);
    String after = e.afterC() == null ? "none" : ProfileCommand.temp(e.afterC(), units);
    String word = e.beforeC() == null || e.afterC() == null ? ""
        : e.afterC() < e.beforeC() ? " (hardier)" : e.afterC() > e.beforeC() ? " (more tender)"
        : " (unchanged)";
    return target + " " + field + " " + before + " → " + after + word;
  }
}
