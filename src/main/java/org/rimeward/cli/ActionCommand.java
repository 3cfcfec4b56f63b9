package org.rimeward.cli;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.LocalTime;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rimeward.audit.ActionCheck;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.RunRecord;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "action",
    description = {"Record what the crew actually did on a block: sprinkling-on, sprinkling-off,"
        + " covers-on or covers-off, with the time, who and a note. It goes into the audit trail,"
        + " hash-chained like the plans, so 'audit why' and 'audit show' can put what was done"
        + " beside what was advised.",
        "When the action contradicts the block's latest plan for the night (sprinklers off before"
        + " the stop condition, covers off with the air still below the target) it is recorded"
        + " all the same, with a warning."},
    footer = {"", "Exit codes: 0 recorded (with or without a warning); 1 the trail could not be"
        + " written; 2 bad input.", "", Cautions.HELP_FOOTER})
final class ActionCommand implements Callable<Integer> {
  /** A clock a few minutes apart from the crew's watch is not an error. */
  static final Duration CLOCK_SKEW = Duration.ofMinutes(5);
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "BLOCK", description = "Block id, as in farm.yaml.")
  String block;

  @Parameters(index = "1", paramLabel = "KIND",
      description = "sprinkling-on, sprinkling-off, covers-on or covers-off.")
  String kind;

  @Option(names = "--at", paramLabel = "TIME", description = "When it was done: 23:40 (the latest"
      + " such time, local to the farm), 2026-04-14T23:40, or with an offset (default: now).")
  String at;

  @Option(names = "--note", paramLabel = "TEXT", description = "What else the record should say.")
  String note;

  @Option(names = "--by", paramLabel = "NAME", description = "Who did it (default: the login name).")
  String by;

  @Mixin FarmOption farmOption = new FarmOption();

  @Mixin AuditFileOption auditFile = new AuditFileOption();

  @Override
  public Integer call() throws Exception {
    CrewAction.Kind k = CrewAction.Kind.ofWord(kind.trim().toLowerCase(Locale.ROOT)).orElseThrow(() ->
        new BadInputException("KIND: '" + kind + "' is not an action; give sprinkling-on,"
            + " sprinkling-off, covers-on or covers-off"));
    Farm f = FarmLoader.load(farmOption.farm());
    if (f.blocks().stream().noneMatch(b -> b.id().equals(block))) {
      throw new BadInputException("BLOCK: '" + block + "' is not a block of " + f.origin()
          + "; blocks: " + String.join(", ", f.blocks().stream().map(b -> b.id()).toList()));
    }
    Instant now = RimewardCommand.clock(spec).instant();
    Instant when = at == null ? now : parseAt(at, f.zone(), now);
    if (when.isAfter(now.plus(CLOCK_SKEW))) {
      throw new BadInputException("--at: " + at + " is in the future (now is "
          + CLOCK.format(now.atZone(f.zone())) + "); record an action once it is done");
    }
    String who = by != null && !by.isBlank() ? by.strip() : System.getProperty("user.name", "unknown");
    // The evening the action belongs to: a 02:00 action is part of the night before.
    LocalDate night = when.atZone(f.zone()).minusHours(12).toLocalDate();
    Path db = auditFile.file(farmOption.farm());
    var out = spec.commandLine().getOut();
    var err = spec.commandLine().getErr();
    try (AuditStore store = AuditStore.open(db)) {
      Optional<RunRecord> advised = store.latestRunFor(block, night);
      Optional<String> warning = advised.flatMap(r -> r.block(block))
          .flatMap(b -> ActionCheck.warning(k, when, b, f.zone()));
      CrewAction action = new CrewAction(when, now, night, block, k, who, note == null ? "" : note,
          advised.map(RunRecord::runId), warning);
      store.appendAction(action);
      out.printf(Locale.ROOT, "recorded: %s %s at %s (night of %s) by %s%s%n", block, k.word(),
          CLOCK.format(when.atZone(f.zone())), night, who,
          advised.map(r -> "; plan run " + r.runId()).orElse("; no recorded plan for this night"));
      out.flush();
      warning.ifPresent(w -> err.println("rimeward: warning: " + w
          + ". Recorded as done; check the block's thermometer at bud height."));
      err.flush();
    } catch (org.rimeward.audit.AuditUnavailableException e) {
      err.println("rimeward: the action was NOT recorded: " + e.getMessage());
      err.flush();
      return Main.INTERNAL_ERROR;
    }
    return Main.OK;
  }

  /** A date-time with an offset, or local in the farm's zone; {@code option} names it in errors. */
  static Instant parseTime(String text, String option, ZoneId zone) {
    return dateTime(text, zone).orElseThrow(() -> new BadInputException(option + ": '" + text
        + "' is not a time; give 2026-04-15T00:30-07:00, or 2026-04-15T00:30 local to the farm ("
        + zone + ")"));
  }

  /** A date-time with an offset, or local in {@code zone}; a space may stand for the T. */
  private static java.util.Optional<Instant> dateTime(String text, ZoneId zone) {
    String t = text.strip().replaceFirst("^(\\d{4}-\\d{2}-\\d{2}) ", "$1T");
    try {
      return java.util.Optional.of(OffsetDateTime.parse(t).toInstant());
    } catch (DateTimeParseException e) {
      // not with an offset
    }
    try {
      return java.util.Optional.of(LocalDateTime.parse(t).atZone(zone).toInstant());
    } catch (DateTimeParseException e) {
      return java.util.Optional.empty();
    }
  }

  /** A local clock time, a local date-time in the farm's zone, or a time with an offset. */
  static Instant parseAt(String text, ZoneId zone, Instant now) {
    java.util.Optional<Instant> full = dateTime(text, zone);
    if (full.isPresent()) {
      return full.get();
    }
    try {
      LocalTime clock = LocalTime.parse(text.strip());
      LocalDate today = now.plus(CLOCK_SKEW).atZone(zone).toLocalDate();
      Instant candidate = today.atTime(clock).atZone(zone).toInstant();
      return candidate.isAfter(now.plus(CLOCK_SKEW))
          ? today.minusDays(1).atTime(clock).atZone(zone).toInstant() : candidate;
    } catch (DateTimeParseException e) {
      throw new BadInputException("--at: '" + text + "' is not a time; give 23:40, 2026-04-14T23:40"
          + " or 2026-04-14T23:40-07:00");
    }
  }
}
