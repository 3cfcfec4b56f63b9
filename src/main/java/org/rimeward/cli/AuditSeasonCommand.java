package org.rimeward.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.io.BadInputException;
import org.rimeward.report.RecordedPages;
import org.rimeward.report.Season;
import org.rimeward.report.SeasonReport;
import org.rimeward.units.UnitFormat;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "season",
    description = {"The season from the audit trail: per block the nights at risk and protected,"
        + " hours sprinkled, water used, cover nights, expected kill unprotected and with the"
        + " plan, and the loss avoided where crop values are set; per water source the water used"
        + " and peak flow per night and in all. Each night counts once, from its latest run; what"
        + " the crew recorded with 'rimeward action' is shown beside, marked as recorded.",
        "Decision support only: these are the plans' estimates, not measured losses or metered"
            + " water."})
final class AuditSeasonCommand implements Callable<Integer> {
  enum Format { text, csv, json, html }

  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Option(names = "--from", paramLabel = "YYYY-MM-DD", description = "First night to count.")
  LocalDate from;

  @Option(names = "--to", paramLabel = "YYYY-MM-DD", description = "Last night to count.")
  LocalDate to;

  @Option(names = "--format", paramLabel = "text|csv|json|html", defaultValue = "text",
      description = "Output format (default: ${DEFAULT-VALUE}). CSV columns carry their units in"
          + " their names; JSON is metric.")
  Format format;

  @Option(names = "--output", paramLabel = "FILE",
      description = "Write to this file (replaced whole, never half-written) instead of the screen.")
  Path output;

  @Override
  public Integer call() throws Exception {
    OutputFile.check(output);
    if (from != null && to != null && to.isBefore(from)) {
      throw new BadInputException("--to: " + to + " is before --from " + from
          + "; give the first night with --from and the last with --to");
    }
    return AuditCommand.guarded(spec, () -> {
      List<Season.Run> runs;
      try (AuditStore store = where.openForReading()) {
        runs = RecordedPages.seasonRuns(store, from, to);
      }
      List<Season.FarmBlock> blocks = new ArrayList<>();
      String farmName = runs.isEmpty() ? "" : runs.get(runs.size() - 1).plan().farm();
      // The farm file gives every block a row, planned or not, and the areas and crop values
      // for the loss avoided; without one, the blocks the runs planned are all there is.
      if (!where.auditFile.given() && Files.isRegularFile(where.farm().resolve(FarmLoader.FILE_NAME))
          || Files.isRegularFile(where.farm()) && !where.auditFile.given()) {
        Farm farm = FarmLoader.load(where.farm());
        farmName = farm.name();
        for (Block b : farm.blocks()) {
          blocks.add(new Season.FarmBlock(b.id(), b.areaHa(),
              b.cropValuePerHa().isPresent() ? b.cropValuePerHa().getAsDouble() : null));
        }
      }
      Season.Totals season = Season.of(farmName, runs, blocks, from, to);
      UnitFormat fmt = UnitFormat.of(AuditCommand.units(spec));
      String text = switch (format) {
        case csv -> SeasonReport.csv(season, fmt);
        case json -> SeasonReport.json(season);
        case html -> SeasonReport.html(season, fmt);
        default -> SeasonReport.text(season, fmt);
      };
      OutputFile.write(spec.commandLine().getOut(), output, text, "the season as " + format);
      return Main.OK;
    });
  }
}
