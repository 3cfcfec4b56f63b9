package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.CyclicBarrier;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RecordedBlock;
import org.rimeward.audit.RecordedInput;
import org.rimeward.audit.RecordedRule;
import org.rimeward.audit.RunRecord;
import org.rimeward.audit.RunSummary;
import org.rimeward.crop.ProfileEdit;
import picocli.CommandLine;

/**
 * The audit trail end to end: plan runs and profile edits recorded, explained, replayed and
 * verified, on a copy of the demo farm so the repository's own files are never written.
 */
class AuditTrailCommandTest {
  static final ObjectMapper JSON = new ObjectMapper();
  static final Instant AT = Instant.parse("2026-04-15T03:05:00Z");
  static final Clock CLOCK = Clock.fixed(AT, ZoneOffset.UTC);

  @TempDir Path tmp;
  Path farm;
  Path db;

  @BeforeEach
  void copyTheDemoFarm() throws IOException {
    farm = Files.createDirectory(tmp.resolve("farm"));
    try (Stream<Path> s = Files.list(Path.of("demo-farm"))) {
      for (Path p : s.filter(p -> !p.getFileName().toString().startsWith("audit.db")).toList()) {
        Files.copy(p, farm.resolve(p.getFileName()));
      }
    }
    db = farm.resolve("audit.db");
  }

  Cli.Result plan(String... extra) {
    List<String> args = new ArrayList<>(List.of("plan", "--farm", farm.toString()));
    args.addAll(List.of(extra));
    return Cli.run(CLOCK, args.toArray(String[]::new));
  }

  RunRecord onlyRun() {
    try (AuditStore store = AuditStore.openReadOnly(db)) {
      List<RunSummary> runs = store.listRuns(Optional.empty(), Optional.empty());
      assertThat(runs).hasSize(1);
      return store.loadRun(runs.get(0).runId()).orElseThrow();
    }
  }

  static String sha256(byte[] b) throws Exception {
    return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
  }

  @Test
  void aPlanRunIsRecordedWholeAndAuditWhyAndListShowIt() throws Exception {
    Cli.Result r = plan();
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(r.out()).startsWith("Frost plan for Quillhaven Bench Farm");
    Cli.Result printed = plan("--format", "json", "--no-audit");
    assertThat(printed.exitCode()).as(printed.toString()).isZero();
    JsonNode plan = JSON.readTree(printed.out());

    RunRecord run = onlyRun();
    assertThat(run.ranAt()).isEqualTo(AT);
    assertThat(run.runId()).startsWith("2026-04-15T030500.000Z-");
    assertThat(run.night()).hasToString("2026-04-14");
    assertThat(JSON.readTree(run.planJson())).isEqualTo(plan);

    // Inputs: the bytes of the files the run read, each once.
    assertThat(input(run, "farm.yaml").content()).isEqualTo(Files.readAllBytes(farm.resolve("farm.yaml")));
    byte[] forecast = Files.readAllBytes(farm.resolve("forecast.csv"));
    assertThat(input(run, "forecast.csv").content()).isEqualTo(forecast);
    assertThat(input(run, "apple.yaml").content())
        .isEqualTo(Files.readAllBytes(Path.of("crop-profiles/apple.yaml")));
    assertThat(input(run, "sprinkling/start.drl").content())
        .isEqualTo(Files.readAllBytes(Path.of("rules/sprinkling/start.drl")));
    long ruleFiles;
    try (Stream<Path> s = Files.walk(Path.of("rules"))) {
      ruleFiles = s.filter(p -> p.toString().endsWith(".drl")).count();
    }
    assertThat(run.inputs().stream().filter(i -> i.kind() == org.rimeward.audit.InputKind.RULE))
        .hasSize((int) ruleFiles);

    // Every block's rules, in firing order, with explanation and values as the plan printed them.
    int needing = 0;
    for (JsonNode b : plan.get("blocks")) {
      RecordedBlock rb = run.block(b.get("block").asText()).orElseThrow();
      assertThat(rb.status()).isEqualTo(b.get("status").asText());
      assertThat(rb.protectionNeeded()).isEqualTo(!b.get("actions").isEmpty());
      needing += b.get("actions").isEmpty() ? 0 : 1;
      assertThat(rb.rules()).hasSize(b.get("rules").size());
      for (int i = 0; i < rb.rules().size(); i++) {
        RecordedRule rr = rb.rules().get(i);
        JsonNode pr = b.get("rules").get(i);
        assertThat(rr.seq()).isEqualTo(pr.get("seq").asInt());
        assertThat(rr.ruleId()).isEqualTo(pr.get("id").asText());
        assertThat(rr.explanation()).isEqualTo(pr.get("explanation").asText());
        assertThat(JSON.readTree(rr.factsJson())).isEqualTo(pr.get("values"));
      }
    }
    assertThat(needing).isPositive();

    Cli.Result list = Cli.run("audit", "list", "--farm", farm.toString());
    assertThat(list.exitCode()).as(list.toString()).isZero();
    assertThat(list.out()).contains(run.runId()).contains("2026-04-15 03:05:00")
        .contains(needing + " of " + plan.get("blocks").size() + " blocks");

    // creek-rome goes short of water: its chain includes the farm-wide water rules about its pond.
    JsonNode block = null;
    for (JsonNode b : plan.get("blocks")) {
      if (b.get("block").asText().equals("creek-rome")) {
        block = b;
      }
    }
    Cli.Result why = Cli.run("audit", "why", "creek-rome", "--farm", farm.toString(), "--json");
    assertThat(why.exitCode()).as(why.toString()).isZero();
    JsonNode w = JSON.readTree(why.out());
    assertThat(w.get("run").asText()).isEqualTo(run.runId());
    assertThat(w.get("night").asText()).isEqualTo("2026-04-14");
    assertThat(w.get("status").asText()).isEqualTo(block.get("status").asText());
    assertThat(w.get("risk").asText()).isEqualTo(block.get("risk").asText());
    List<String> blockExplanations = new ArrayList<>();
    block.get("rules").forEach(x -> blockExplanations.add(x.get("explanation").asText()));
    List<String> chain = new ArrayList<>();
    List<Integer> seqs = new ArrayList<>();
    List<String> farmWide = new ArrayList<>();
    for (JsonNode x : w.get("rules")) {
      seqs.add(x.get("seq").asInt());
      if (x.get("scope").asText().equals("block")) {
        chain.add(x.get("explanation").asText());
      } else {
        farmWide.add(x.get("id").asText());
      }
    }
    assertThat(chain).containsExactlyElementsOf(blockExplanations);
    assertThat(seqs).isSorted();
    assertThat(farmWide).contains("WATER-SHORT");
    assertThat(w.get("profile").get("t10_c")).isEqualTo(block.get("t10_c"));
    assertThat(w.get("profile").get("threshold_source")).isEqualTo(block.get("threshold_source"));
    assertThat(w.get("profile").get("file").asText()).isEqualTo("apple.yaml");
    String[] lines = new String(forecast, StandardCharsets.UTF_8).split("\n");
    int coldest = block.get("coldest_forecast_line").asInt();
    boolean quoted = false;
    for (JsonNode l : w.get("inputs").get("forecast_lines")) {
      if (l.get("line").asInt() == coldest) {
        assertThat(l.get("text").asText()).isEqualTo(lines[coldest - 1].strip());
        quoted = true;
      }
    }
    assertThat(quoted).as("the coldest forecast line is quoted").isTrue();
    assertThat(w.get("inputs").get("files").toString()).contains(sha256(forecast));

    Cli.Result text = Cli.run("audit", "why", "creek-rome", "--farm", farm.toString(),
        "--night", "2026-04-14");
    assertThat(text.exitCode()).as(text.toString()).isZero();
    for (String e : blockExplanations) {
      assertThat(text.out()).contains(e);
    }
    assertThat(text.out()).contains("Why creek-rome is " + block.get("status").asText())
        .contains("line " + coldest + ": " + lines[coldest - 1].strip())
        .contains(sha256(forecast) + "  forecast.csv");

    Cli.Result noSuchNight = Cli.run("audit", "why", "creek-rome", "--farm", farm.toString(),
        "--night", "2026-04-20");
    assertThat(noSuchNight.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(noSuchNight.err()).contains("no recorded run planned block 'creek-rome' for the night of 2026-04-20");
    Cli.Result noSuchBlock = Cli.run("audit", "why", "nowhere", "--farm", farm.toString(),
        "--run", run.runId().substring(0, 24));
    assertThat(noSuchBlock.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(noSuchBlock.err()).contains("planned no block 'nowhere'").contains("creek-rome");
  }

  static RecordedInput input(RunRecord run, String name) {
    return run.inputs().stream().filter(i -> i.name().equals(name)).findFirst().orElseThrow();
  }

  @Test
  void noAuditRecordsNothing() {
    Cli.Result r = plan("--no-audit");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(db).doesNotExist();
    Cli.Result both = plan("--no-audit", "--audit", tmp.resolve("x.db").toString());
    assertThat(both.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(both.err()).contains("--audit and --no-audit");
  }

  @Test
  void replayShowsNoDifferenceUnchangedAndTheChangeWithTodaysRulesOrProfiles() throws Exception {
    assertThat(plan().exitCode()).isZero();
    RunRecord run = onlyRun();
    byte[] dbBefore = Files.readAllBytes(db);

    Cli.Result same = Cli.run("audit", "replay", run.runId(), "--farm", farm.toString());
    assertThat(same.exitCode()).as(same.toString()).isZero();
    assertThat(same.out()).contains("no difference").doesNotContain("Inputs that differ");

    // Today's rules: the start threshold one degree warmer than the margin says.
    Path rules = tmp.resolve("rules");
    copyTree(Path.of("rules"), rules);
    Path start = rules.resolve("sprinkling/start.drl");
    String drl = Files.readString(start);
    String edited = drl.replace("from $t.targetC() + $startMarginC\n",
        "from $t.targetC() + $startMarginC + 1.0\n");
    assertThat(edited).isNotEqualTo(drl);
    Files.writeString(start, edited);
    Cli.Result withRules = Cli.run("audit", "replay", run.runId(), "--farm", farm.toString(),
        "--current-rules", "--rules", rules.toString());
    assertThat(withRules.exitCode()).as(withRules.toString()).isZero();
    assertThat(withRules.out()).contains("rules: today's")
        .contains("rule sprinkling/start.drl: changed")
        .contains("Blocks whose decision differs")
        .containsPattern("/blocks/hollow-cherry/actions/0/start: \"2026-04-14T21:11-07:00\" → \"")
        .doesNotContain("no difference");

    Cli.Result rulesAlone = Cli.run("audit", "replay", run.runId(), "--farm", farm.toString(),
        "--rules", rules.toString());
    assertThat(rulesAlone.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(rulesAlone.err()).contains("add --current-rules");

    // Today's profiles: a colder T10 for rome-beauty at tight cluster, edited and recorded.
    Path profiles = tmp.resolve("crop-profiles");
    copyTree(Path.of("crop-profiles"), profiles);
    Cli.Result set = Cli.run(CLOCK, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.0C", "--note", "bud cuts on the creek block",
        "--by", "tester", "--crop-profiles", profiles.toString(), "--audit", db.toString());
    assertThat(set.exitCode()).as(set.toString()).isZero();
    dbBefore = Files.readAllBytes(db);
    Cli.Result withProfiles = Cli.run("audit", "replay", run.runId(), "--audit", db.toString(),
        "--current-profiles", "--crop-profiles", profiles.toString());
    assertThat(withProfiles.exitCode()).as(withProfiles.toString()).isZero();
    assertThat(withProfiles.out()).contains("crop profiles: today's")
        .contains("crop-profile apple.yaml: changed")
        .contains("/blocks/creek-rome/t10_c: -3.89 → -3.0");
    assertThat(Files.readAllBytes(db)).as("a replay writes nothing to the trail").isEqualTo(dbBefore);
  }

  static void copyTree(Path from, Path to) throws IOException {
    try (Stream<Path> s = Files.walk(from)) {
      for (Path p : s.toList()) {
        Path t = to.resolve(from.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(t);
        } else {
          Files.copy(p, t);
        }
      }
    }
  }

  @Test
  void anUnwritableTrailStillPrintsThePlanAndSaysItWasNotRecorded() throws IOException {
    // A path under a regular file cannot be created by anyone, root included.
    Path blocker = Files.writeString(tmp.resolve("not-a-folder"), "x");
    Path bad = blocker.resolve("audit.db");
    Cli.Result r = plan("--audit", bad.toString());
    assertThat(r.exitCode()).as(r.toString()).isEqualTo(Main.INTERNAL_ERROR);
    assertThat(r.out()).startsWith("Frost plan for Quillhaven Bench Farm").contains("creek-rome");
    assertThat(r.err().strip().lines()).hasSize(1);
    assertThat(r.err()).contains("the plan above was NOT recorded in the audit trail")
        .contains(bad.toString()).contains("cannot be opened").contains("--audit")
        .doesNotContain("internal error");
    assertThat(Files.readString(blocker)).isEqualTo("x");

    String before = Files.readString(Path.of("crop-profiles/apple.yaml"));
    Path profiles = tmp.resolve("crop-profiles");
    copyTree(Path.of("crop-profiles"), profiles);
    Cli.Result edit = Cli.run(CLOCK, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.0C", "--note", "n", "--crop-profiles", profiles.toString(),
        "--audit", bad.toString());
    assertThat(edit.exitCode()).isEqualTo(Main.INTERNAL_ERROR);
    assertThat(edit.err()).contains("the profile was not changed").contains(bad.toString());
    assertThat(Files.readString(profiles.resolve("apple.yaml"))).isEqualTo(before);
  }

  @Test
  void anEditWrittenButNotRecordedSaysSoAndExitsOne() throws Exception {
    try (AuditStore store = AuditStore.open(db)) {
      store.schemaVersion();
    }
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    CommandLine cl = new CommandLine(new RimewardCommand(CLOCK));
    CommandLine set = cl.getSubcommands().get("profile").getSubcommands().get("set");
    set.setOut(new PrintWriter(out, true));
    set.setErr(new PrintWriter(err, true));
    ProfileEdit e = new ProfileEdit(AT, "tester", "apple.yaml", "apple", "rome-beauty",
        "tight-cluster", "t10", -3.889, -3.0, "bud cuts");
    ProfileCommand.AuditTarget target = new ProfileCommand.AuditTarget();
    target.options.auditFile.audit = db;
    // A trail opened read-only refuses the append as an unwritable file does.
    try (AuditStore readOnly = AuditStore.openReadOnly(db)) {
      int code = ProfileCommand.recorded(List.of(e), target, readOnly, set.getCommandSpec());
      assertThat(code).isEqualTo(Main.INTERNAL_ERROR);
    }
    assertThat(err.toString()).contains("the edit IS written to apple.yaml but was NOT recorded")
        .contains("keeps the new value");
    try (AuditStore store = AuditStore.openReadOnly(db)) {
      assertThat(store.listProfileEdits()).isEmpty();
    }
  }

  @Test
  void twoPlanRunsAtOnceBothLandInOneChain() throws Exception {
    ExecutorService pool = Executors.newFixedThreadPool(2);
    CyclicBarrier together = new CyclicBarrier(2);
    try {
      List<Future<Cli.Result>> results = new ArrayList<>();
      for (int i = 0; i < 2; i++) {
        Callable<Cli.Result> job = () -> {
          together.await();
          return plan();
        };
        results.add(pool.submit(job));
      }
      for (Future<Cli.Result> f : results) {
        Cli.Result r = f.get(5, TimeUnit.MINUTES);
        assertThat(r.exitCode()).as(r.toString()).isZero();
      }
    } finally {
      pool.shutdownNow();
    }
    try (AuditStore store = AuditStore.openReadOnly(db)) {
      List<RunSummary> runs = store.listRuns(Optional.empty(), Optional.empty());
      assertThat(runs).hasSize(2);
      assertThat(runs.get(0).runId()).isNotEqualTo(runs.get(1).runId());
      assertThat(store.verify().intact()).isTrue();
      for (RunSummary s : runs) {
        assertThat(store.loadRun(s.runId()).orElseThrow().blocks()).hasSize(9);
      }
    }
  }

  @Test
  void oneChangedByteBreaksTheChainAndVerifyNamesTheRecord() throws Exception {
    assertThat(plan().exitCode()).isZero();
    RunRecord run = onlyRun();
    Cli.Result ok = Cli.run("audit", "verify", "--audit", db.toString());
    assertThat(ok.exitCode()).as(ok.toString()).isZero();
    long seq;
    try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
        Statement st = c.createStatement()) {
      List<String> triggers = new ArrayList<>();
      try (ResultSet rs = st.executeQuery("SELECT name FROM sqlite_master WHERE type = 'trigger'")) {
        while (rs.next()) {
          triggers.add(rs.getString(1));
        }
      }
      for (String t : triggers) {
        st.execute("DROP TRIGGER " + t);
      }
      try (ResultSet rs = st.executeQuery("SELECT seq, content FROM run_inputs WHERE name = 'forecast.csv'")) {
        seq = rs.getLong(1);
        byte[] content = rs.getBytes(2);
        content[content.length / 2] ^= 0x01;
        try (PreparedStatement ps = c.prepareStatement("UPDATE run_inputs SET content = ? WHERE seq = ?")) {
          ps.setBytes(1, content);
          ps.setLong(2, seq);
          assertThat(ps.executeUpdate()).isEqualTo(1);
        }
      }
    }
    Cli.Result broken = Cli.run("audit", "verify", "--audit", db.toString());
    assertThat(broken.exitCode()).isEqualTo(AuditCommand.CHAIN_BROKEN);
    assertThat(broken.out()).contains("chain broken").contains("record " + seq)
        .contains("run " + run.runId() + " input forecast.csv");
    Cli.Result why = Cli.run("audit", "why", "creek-rome", "--audit", db.toString());
    assertThat(why.exitCode()).isEqualTo(AuditCommand.CHAIN_BROKEN);
  }

  @Test
  void profileEditsAreRecordedWithBeforeAfterAndNote() throws Exception {
    Path profiles = tmp.resolve("crop-profiles");
    copyTree(Path.of("crop-profiles"), profiles);
    Cli.Result nv = Cli.run(CLOCK, "profile", "new-variety", "apple/honeycrisp", "--offset", "0.5C",
        "--note", "nursery sheet 2026", "--by", "tester", "--crop-profiles", profiles.toString(),
        "--farm", farm.toString());
    assertThat(nv.exitCode()).as(nv.toString()).isZero();
    Cli.Result set = Cli.run(CLOCK, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.0C", "--t90", "-6.5C", "--note", "bud cuts on the creek block",
        "--by", "tester", "--crop-profiles", profiles.toString(), "--farm", farm.toString());
    assertThat(set.exitCode()).as(set.toString()).isZero();
    assertThat(set.out()).contains("recorded in " + db);
    try (AuditStore store = AuditStore.openReadOnly(db)) {
      List<ProfileEdit> edits = store.listProfileEdits();
      assertThat(edits).hasSize(3);
      ProfileEdit variety = edits.get(0);
      assertThat(variety.field()).isEqualTo("variety");
      assertThat(variety.variety()).isEqualTo("honeycrisp");
      assertThat(variety.afterC()).isCloseTo(0.5, within(1e-9));
      assertThat(variety.note()).isEqualTo("nursery sheet 2026");
      ProfileEdit t10 = edits.get(1);
      assertThat(t10.at()).isEqualTo(AT);
      assertThat(t10.by()).isEqualTo("tester");
      assertThat(t10.stage()).isEqualTo("tight-cluster");
      assertThat(t10.field()).isEqualTo("t10");
      // Before: the table value the plan used for creek-rome (see its t10_c), after: as set.
      assertThat(t10.beforeC()).isCloseTo(-3.889, within(0.001));
      assertThat(t10.afterC()).isCloseTo(-3.0, within(1e-9));
      assertThat(t10.note()).isEqualTo("bud cuts on the creek block");
      assertThat(edits.get(2).field()).isEqualTo("t90");
      assertThat(edits.get(2).afterC()).isCloseTo(-6.5, within(1e-9));
      assertThat(store.verify().intact()).isTrue();
    }
    Cli.Result none = Cli.run(CLOCK, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.1C", "--note", "n", "--crop-profiles", profiles.toString(),
        "--audit", tmp.resolve("other.db").toString(), "--no-audit");
    assertThat(none.exitCode()).isEqualTo(Main.BAD_INPUT);
    Cli.Result off = Cli.run(CLOCK, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.1C", "--note", "n", "--crop-profiles", profiles.toString(),
        "--farm", tmp.resolve("elsewhere").toString(), "--no-audit");
    assertThat(off.exitCode()).as(off.toString()).isZero();
    assertThat(off.out()).contains("not recorded in the audit trail (--no-audit)");
    assertThat(tmp.resolve("elsewhere")).doesNotExist();
  }
}
