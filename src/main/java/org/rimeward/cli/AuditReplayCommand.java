package org.rimeward.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import java.nio.file.Path;
import java.util.List;
import org.rimeward.audit.Replay;
import org.rimeward.audit.RuleTrust;
import org.rimeward.audit.RunRecord;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.NightPlanner;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "replay",
    description = {"Plan a recorded night again from the inputs the trail kept (the farm file,"
        + " the forecast, the crop profiles and the rules, byte for byte) and compare the new plan"
        + " with the recorded one. With --current-rules or --current-profiles, today's rules or"
        + " crop profiles are used instead, to see what a change would have decided that night.",
        "Rule files are code: recorded ones run only when they match rules you already trust"
            + " (bundled with rimeward, or the farm's own rules folder), unless"
            + " --trust-recorded-rules is given.",
        "The audit database is only read: a replay is never recorded."},
    footer = {"", "Exit codes: 0 the replay ran (with or without differences); 2 bad input, or"
        + " the inputs no longer make a plan; 1 internal error or audit database unavailable; "
        + AuditCommand.CHAIN_BROKEN + " a recorded row no longer matches its hash."})
final class AuditReplayCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin AuditCommand.Location where = new AuditCommand.Location();
  @Mixin DataFolders folders = new DataFolders();

  @Parameters(paramLabel = "RUN", description = "Run id, or its first characters if unique.")
  String run;

  @Option(names = "--current-rules", description = "Use today's rules (--rules DIR, or the"
      + " default rules) instead of the recorded ones.")
  boolean currentRules;

  @Option(names = "--current-profiles", description = "Use today's crop profiles"
      + " (--crop-profiles DIR, or the default ones) instead of the recorded ones.")
  boolean currentProfiles;

  @Option(names = "--trust-recorded-rules", description = "Run the recorded rule files even where"
      + " they match no rules you already trust. Rule files are code that runs with your rights:"
      + " give this only for a trail from someone you trust.")
  boolean trustRecordedRules;

  @Override
  public Integer call() throws Exception {
    if (folders.rules != null && !currentRules) {
      throw new BadInputException("--rules: a replay uses the recorded rules unless"
          + " --current-rules is given; add --current-rules to replay with " + folders.rules);
    }
    if (folders.cropProfiles != null && !currentProfiles) {
      throw new BadInputException("--crop-profiles: a replay uses the recorded crop profiles unless"
          + " --current-profiles is given; add --current-profiles to replay with "
          + folders.cropProfiles);
    }
    return AuditCommand.guarded(spec, () -> {
      RunRecord rec = AuditShowCommand.load(where, run);
      if (!currentRules && !trustRecordedRules) {
        Path farmDir = java.nio.file.Files.isRegularFile(where.farm())
            ? where.farm().toAbsolutePath().getParent() : where.farm();
        List<String> strangers = RuleTrust.standard(List.of(farmDir.resolve("rules")))
            .untrusted(rec);
        if (!strangers.isEmpty()) {
          throw new BadInputException("run " + rec.runId() + ": the recorded rule file(s) "
              + String.join(", ", strangers) + " match no rules you already trust (the rules"
              + " bundled with rimeward, or the farm's own rules in " + farmDir.resolve("rules")
              + "). Rule files are code that runs with your rights, so they are not run. Replay"
              + " with --current-rules, or add --trust-recorded-rules if you trust whoever wrote"
              + " this trail.");
        }
      }
      Replay.Result result = new Replay(new NightPlanner()).replay(rec,
          currentRules ? folders.rules(where.farm()) : null,
          currentProfiles ? folders.cropProfiles(where.farm()) : null);
      PrintWriter out = spec.commandLine().getOut();
      out.print(result.text());
      out.flush();
      return Main.OK;
    });
  }
}
