package org.rimeward.cli;

import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.audit.AuditStore;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.Replanner;
import org.rimeward.rules.RuleBook;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitFormat;
import org.rimeward.watch.AlarmKind;
import org.rimeward.watch.NightWatch;
import org.rimeward.watch.WatchPolicy;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "watch", mixinStandardHelpOptions = true,
    versionProvider = RimewardCommand.Version.class,
    description = {"Watch the night: every interval, read what the station's logger appended,"
        + " re-plan the rest of the night, and raise alarms on the terminal (with a bell) and"
        + " through the grower's own command.",
        "Alarms (RIMEWARD_ALARM): alarm-temperature, start-due, colder-than-forecast, wind, stale,"
        + " stop-allowed; each once per block per night unless it escalates. Farm-wide alarms name"
        + " the block 'all'. Alarms, and re-plans that changed a decision, go to the audit trail."},
    footer = {"", "--on-alarm runs CMD through /bin/sh with RIMEWARD_BLOCK, RIMEWARD_ALARM,"
        + " RIMEWARD_AT and RIMEWARD_MESSAGE set; one that fails or runs past --command-timeout is"
        + " reported and stopped, and the watch goes on.",
        "", "Exit codes: 0 the watch ended (the morning's last stop passed, or SIGINT/SIGTERM), or"
        + " --once raised no alarm; 3 --once raised an alarm; 2 bad input; 1 internal error.",
        "", Cautions.HELP_FOOTER})
final class WatchCommand implements Callable<Integer> {
  private static final Pattern DURATION = Pattern.compile("(\\d+)\\s*(s|m|min|h)");

  @Spec CommandSpec spec;
  @Mixin DataFolders folders;

  @Mixin AuditOptions audit = new AuditOptions();

  @Option(names = "--readings", paramLabel = "FILE",
      description = "The station's readings CSV the logger appends to (default: <farm>/readings.csv).")
  Path readings;

  @Option(names = "--forecast", paramLabel = "FILE",
      description = "Forecast CSV to use instead of the one the farm file names.")
  Path forecast;

  @Option(names = "--every", paramLabel = "INTERVAL", defaultValue = "5m",
      description = "How often to look: 30s, 5m, 1h (default: ${DEFAULT-VALUE}).")
  String every;

  @Option(names = "--once", description = "One pass, then exit: 0 quiet, 3 when an alarm was raised.")
  boolean once;

  @Option(names = "--now", paramLabel = "TIME", description = "Start the watch's clock at this"
      + " time, e.g. 2026-04-14T23:00-07:00 (for tests and replays; default: the clock).")
  String now;

  @Option(names = "--on-alarm", paramLabel = "CMD", description = "Shell command to run for each alarm.")
  String onAlarm;

  @Option(names = "--station", paramLabel = "ID", description = "Plan every block by this"
      + " station's readings, over farm.yaml's stations (default: each block's own station).")
  String station;

  @Option(names = "--lead", paramLabel = "INTERVAL",
      description = "Raise start-due this long before a start (default: the rule files' watch"
          + " lead, rule THRESHOLDS).")
  String lead;

  @Option(names = "--colder-margin", paramLabel = "DT",
      description = "Raise colder-than-forecast beyond this, e.g. 1.0C or 2F (default: the rule"
          + " files' margin, rule THRESHOLDS).")
  String colderMargin;

  @Option(names = "--stale-after", paramLabel = "INTERVAL",
      description = "Raise stale after this long without a reading (default: the rule files',"
          + " rule THRESHOLDS).")
  String staleAfter;

  @Option(names = "--command-timeout", paramLabel = "INTERVAL", defaultValue = "10s",
      description = "Stop the --on-alarm command after this long (default: ${DEFAULT-VALUE}).")
  String commandTimeout;


  @Override
  public Integer call() throws Exception {
    boolean recording = audit.recording();
    Path farm = audit.farm();
    Duration interval = duration(every, "--every");
    if (interval.compareTo(Duration.ofSeconds(5)) < 0) {
      throw new BadInputException("--every: " + every + " is too short; give 5s or more");
    }
    // Options are read before the farm and rules, so a mistyped one fails at once.
    Duration leadGiven = lead == null ? null : duration(lead, "--lead");
    Double colderGiven = colderMargin == null ? null : Quantities.parse(colderMargin,
        Dimension.TEMPERATURE_DELTA, "--colder-margin");
    if (colderGiven != null && !(colderGiven > 0)) {
      throw new BadInputException("--colder-margin: '" + colderMargin + "' is not above zero;"
          + " give a margin such as 1.0C");
    }
    Duration staleGiven = staleAfter == null ? null : duration(staleAfter, "--stale-after");
    Duration timeout = duration(commandTimeout, "--command-timeout");
    Replanner rp = Replanner.load(new PlanRequest(farm, forecast, folders.cropProfiles,
        folders.rules, null), RuleBook::load);
    WatchPolicy rules = WatchPolicy.from(rp.thresholds(), timeout);
    WatchPolicy policy = new WatchPolicy(leadGiven != null ? leadGiven : rules.lead(),
        colderGiven != null ? colderGiven : rules.colderMarginC(),
        staleGiven != null ? staleGiven : rules.staleAfter(), rules.windyWind10mMs(), timeout);
    Path file = readings != null ? readings : rp.farm().folder().resolve("readings.csv");
    Clock clock = RimewardCommand.clock(spec);
    Instant start = null;
    if (now != null) {
      start = ActionCommand.parseTime(now, "--now", rp.farm().zone());
      clock = Clock.offset(clock, Duration.between(clock.instant(), start));
    }
    var out = spec.commandLine().getOut();
    var err = spec.commandLine().getErr();
    try (NightWatch watch = new NightWatch(rp, file, Optional.ofNullable(station), policy,
        UnitFormat.of(UnitsOption.of(spec)),
        recording ? Optional.of(audit.file()) : Optional.empty(),
        Optional.ofNullable(onAlarm), out, err)) {
      return watch(watch, file, start, clock, interval);
    }
  }

  private int watch(NightWatch watch, Path file, Instant start, Clock clock, Duration interval)
      throws InterruptedException {
    var out = spec.commandLine().getOut();
    if (once) {
      int raised = watch.pass(start != null ? start : clock.instant()).raised().size();
      out.flush();
      return raised > 0 ? Main.ACTION_NEEDED : Main.OK;
    }
    out.printf(Locale.ROOT, "watching %s every %s until the morning's last stop; Ctrl-C to stop."
        + " Decision support only: check thermometers at bud height.%n", file.getFileName(), every);
    out.flush();
    CountDownLatch done = new CountDownLatch(1);
    Thread hook = new Thread(() -> {
      watch.stop();
      try {
        done.await(15, TimeUnit.SECONDS);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }, "rimeward-watch-stop");
    Runtime.getRuntime().addShutdownHook(hook);
    try {
      watch.run(clock, interval);
      out.println("watch stopped");
      out.flush();
    } finally {
      done.countDown();
      try {
        Runtime.getRuntime().removeShutdownHook(hook);
      } catch (IllegalStateException shuttingDown) {
        // the hook is running: the JVM is stopping on a signal, as asked
      }
    }
    return Main.OK;
  }

  static Duration duration(String text, String option) {
    Matcher m = DURATION.matcher(text.strip().toLowerCase(Locale.ROOT));
    if (!m.matches()) {
      throw new BadInputException(option + ": '" + text + "' is not an interval; give 30s, 5m or 1h");
    }
    long n = Long.parseLong(m.group(1));
    return switch (m.group(2)) {
      case "s" -> Duration.ofSeconds(n);
      case "h" -> Duration.ofHours(n);
      default -> Duration.ofMinutes(n);
    };
  }

  /** Every alarm word, for the help and tests. */
  static String words() {
    return String.join(", ", java.util.Arrays.stream(AlarmKind.values()).map(AlarmKind::word).toList());
  }
}
