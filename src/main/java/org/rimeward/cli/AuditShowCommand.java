package org.rimeward.cli;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.concurrent.Callable;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.ChainHead;
import org.rimeward.audit.CrewAction;
import org.rimeward.audit.CrewReport;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunReport;
import org.rimeward.io.BadInputException;
import org.rimeward.report.RecordedPages;
import org.rimeward.units.UnitFormat;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "show",
    description = "Show one recorded run: the night, each block's status, risk and actions, the"
        + " rules that fired, the cautions, and the hash of every input.")
final class AuditShowCommand implements Callable<Integer> {
  @Spec CommandSpec spec;
  @Mixin UnitsOption unitsOption = new UnitsOption();
  @Mixin AuditCommand.Location where = new AuditCommand.Location();

  @Parameters(paramLabel = "RUN", description = "Run id, or its first characters if unique.")
  String run;

  @Option(names = "--json", description = "Print the recorded plan with the run's metadata and"
      + " input hashes, and the crew's recorded actions of the night (crew_actions), as JSON.")
  boolean json;

  enum Format { text, json, html }

  @Option(names = "--format", paramLabel = "text|json|html",
      description = "text (default), json (as --json), or html: the night's page as 'plan"
          + " --format html' makes it, with the crew's recorded actions and a footer giving the"
          + " run, its input hashes and the audit chain's head, to file and check later.")
  Format format;

  @Option(names = "--output", paramLabel = "FILE",
      description = "Write to this file (replaced whole, never half-written) instead of the screen.")
  java.nio.file.Path output;

  @Override
  public Integer call() throws Exception {
    OutputFile.check(output);
    Format f = format != null ? format : json ? Format.json : Format.text;
    if (json && format != null && format != Format.json) {
      throw new BadInputException("--json and --format " + format + ": give one of them");
    }
    return AuditCommand.guarded(spec, () -> {
      String text;
      if (f == Format.html) {
        try (AuditStore store = where.openForReading()) {
          RunRecord rec = store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '"
              + run + "' in " + where.file() + "; list them with 'rimeward audit list'"));
          text = RecordedPages.night(rec, store.listActions(rec.night(), java.util.Optional.empty()),
              store.head(), UnitFormat.of(AuditCommand.units(spec)), RimewardCommand.clock(spec).instant());
        }
      } else {
        Loaded l = loadWithActions(where, run);
        text = f == Format.json
            ? json(l)
            : RunReport.text(l.run(), AuditCommand.units(spec))
                + CrewReport.text(l.run(), l.actions(), java.util.Optional.empty());
      }
      OutputFile.write(spec.commandLine().getOut(), output, text, "run " + run + " as " + f);
      return Main.OK;
    });
  }

  /**
   * A run, the crew's actions of its night, and the trail's head when they were read, from one
   * open of the trail.
   */
  record Loaded(RunRecord run, java.util.List<CrewAction> actions, ChainHead head) {}

  static Loaded loadWithActions(AuditCommand.Location where, String run) {
    try (AuditStore store = where.openForReading()) {
      ChainHead head = store.head();
      RunRecord rec = store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '"
          + run + "' in " + where.file() + "; list them with 'rimeward audit list'"));
      return new Loaded(rec, store.listActions(rec.night(), java.util.Optional.empty()), head);
    }
  }

  /** The run's JSON document, as 'show --json' and 'export --format json' give it. */
  static String json(Loaded l) {
    return withHead(CrewReport.withActions(RunReport.json(l.run()), "crew_actions", l.actions(),
        java.time.ZoneId.of(l.run().zoneId())), l.head());
  }

  /**
   * The document with {@code chain_head}: the newest record of the trail when it was made, so
   * whoever files the export holds a head that 'audit verify --head' checks later.
   */
  static String withHead(String json, ChainHead chainHead) {
    try {
      ObjectNode doc = (ObjectNode) JSON.readTree(json);
      ObjectNode out = JSON.createObjectNode();
      out.set("run_id", doc.remove("run_id"));
      ObjectNode head = out.putObject("chain_head");
      head.put("seq", chainHead.seq());
      head.put("hash", chainHead.hash());
      out.setAll(doc);
      return org.rimeward.io.Json.pretty(out);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }

  private static final ObjectMapper JSON = org.rimeward.io.Json.mapper();

  static RunRecord load(AuditCommand.Location where, String run) {
    try (AuditStore store = where.openForReading()) {
      return store.loadRun(run).orElseThrow(() -> new BadInputException("RUN: no run '" + run
          + "' in " + where.file() + "; list them with 'rimeward audit list'"));
    }
  }
}
