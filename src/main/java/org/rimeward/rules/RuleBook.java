package org.rimeward.rules;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.logging.Level;
import java.util.logging.Logger;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.kie.api.KieBase;
import org.kie.api.KieServices;
import org.kie.api.builder.KieBuilder;
import org.kie.api.builder.KieFileSystem;
import org.kie.api.builder.Message;
import org.kie.api.builder.ReleaseId;
import org.kie.api.runtime.KieContainer;
import org.kie.api.runtime.KieSession;
import org.drools.kiesession.rulebase.InternalKnowledgeBase;
import org.drools.kiesession.rulebase.KnowledgeBaseFactory;
import org.rimeward.io.BadInputException;
import org.rimeward.io.TextFile;

/**
 * A compiled set of rule files read from a folder ({@code rules/} by default). This is the only
 * class, with its listener, that talks to the rule engine. Rule files are read at run time, so an
 * agronomist can change a rule without rebuilding Rimeward; a file that does not compile stops
 * the run with the file, line and compiler message.
 */
public final class RuleBook {
  /**
   * The ruleflow groups, in the order they run: derived facts first, cautions last. Each phase
   * reads only what earlier phases concluded, so no rule needs a salience: thresholds, targets
   * and risk; covers; sprinkling thresholds; start; stop; the run's need and wind; whether
   * sprinkling is advised; the plan and alarms; water in four steps (the sharing terms, each
   * source's balance, a short source, each block's share); status; cautions.
   */
  public static final List<String> PHASES = List.of("infer", "covers", "thresholds", "start",
      "stop", "run", "advice", "sprinkle", "water", "water-terms", "water-budget", "water-short",
      "water-grant", "status", "cautions");
  // "water" is the one group the water rules shared, ordered by salience, before they had a
  // group per step. No bundled rule uses it now; it stays a phase so that a trail recorded with
  // those rules replays as it ran, and a farm's own copy of them still shares its water.

  private final Path folder;
  private final List<RuleFile> files;
  private final String contentHash;
  private final KieBase kieBase;
  private final Origin origin;

  /** How a rule book's compiled form was obtained. */
  public enum Origin {
    /** Compiled from the DRL text in this run. */
    COMPILED,
    /** Read from the cache folder, written by an earlier run. */
    CACHED
  }

  /** A rule file as read: its path relative to the rules folder, and its text. */
  public record RuleFile(String name, String text, String sha256) {}

  private RuleBook(Path folder, List<RuleFile> files, String contentHash, KieBase kieBase,
      Origin origin) {
    this.folder = folder;
    this.files = files;
    this.contentHash = contentHash;
    this.kieBase = kieBase;
    this.origin = origin;
  }

  /**
   * Reads every {@code .drl} file below {@code folder} and compiles it, or takes the compiled
   * form from the standard cache when one was made from exactly these files (see
   * {@link RuleCache}).
   */
  public static RuleBook load(Path folder) {
    return load(folder, RuleCache.standard());
  }

  /** As {@link #load(Path)}, with compiled rules cached in {@code cacheDir} only. */
  public static RuleBook loadCached(Path folder, Path cacheDir) {
    return load(folder, RuleCache.inFolder(cacheDir));
  }

  /**
   * Reads every {@code .drl} file below {@code folder}; uses the compiled packages in
   * {@code cache} made from the same files, else compiles them and stores the result there.
   */
  public static RuleBook load(Path folder, RuleCache cache) {
    List<RuleFile> files = readFolder(folder);
    String hash = hashOf(files);
    String key = CacheKey.of(hash);
    var hit = cache.read(key);
    if (hit.isPresent()) {
      try {
        InternalKnowledgeBase base = KnowledgeBaseFactory.newKnowledgeBase();
        base.addPackages(hit.get());
        if (sameRules(base, files)) {
          return new RuleBook(folder, List.copyOf(files), hash, base, Origin.CACHED);
        }
      } catch (RuntimeException | LinkageError e) {
        Logger.getLogger(RuleBook.class.getName()).log(Level.FINE,
            "cached rules for " + folder + " do not load; compiling instead", e);
      }
    }
    RuleBook book = compile(folder, files);
    cache.write(key, book.kieBase.getKiePackages());
    return book;
  }

  /**
   * A last check that cached packages belong to these files: every rule file's package is
   * there. The key already covers the text; this catches a mix-up in how an entry was made.
   */
  private static boolean sameRules(KieBase base, List<RuleFile> files) {
    for (RuleFile f : files) {
      Matcher m = PACKAGE.matcher(f.text());
      String pkg = m.find() ? m.group(1) : "defaultpkg";
      if (base.getKiePackage(pkg) == null) {
        return false;
      }
    }
    return true;
  }

  /** The Drools compiler's option: packages with more rules than this are built in parallel. */
  static final String PARALLEL_BUILD_THRESHOLD = "drools.parallelRulesBuildThreshold";

  static {
    // Compile in the calling thread. With more than ten rules in a package the compiler would
    // otherwise build them on a fork-join pool, where an OutOfMemoryError is swallowed into
    // "compilation failed or interrupted", or, thrown again from the pool's handler, leaves the
    // JVM hanging: on a small heap the grower must read "out of memory, try -Xmx", not an
    // internal error or a silent hang. The compiler reads the option only from system
    // properties or a kmodule.xml, which would need Drools' XML module; one set on the command
    // line is kept.
    if (System.getProperty(PARALLEL_BUILD_THRESHOLD) == null) {
      System.setProperty(PARALLEL_BUILD_THRESHOLD, Integer.toString(Integer.MAX_VALUE));
    }
  }

  private static final Pattern PACKAGE =
      Pattern.compile("(?m)^\\s*package\\s+([\\w.]+)\\s*;?");

  private static List<RuleFile> readFolder(Path folder) {
    if (!Files.isDirectory(folder)) {
      throw new BadInputException("rules folder " + folder + " does not exist; pass --rules DIR"
          + " with the folder that holds the .drl files");
    }
    List<RuleFile> files = readFiles(folder);
    if (files.isEmpty()) {
      throw new BadInputException("rules folder " + folder + " holds no .drl files");
    }
    return files;
  }

  /** Compiles rule files given as text, for tests and for replaying recorded rules. */
  public static RuleBook compile(Path folder, List<RuleFile> files) {
    for (RuleFile f : files) {
      checkGroups(folder, f);
    }
    KieServices ks = KieServices.Factory.get();
    KieFileSystem kfs = ks.newKieFileSystem();
    String hash = hashOf(files);
    ReleaseId release = ks.newReleaseId("org.rimeward.rules", "rules", "0.0.0-" + hash.substring(0, 16));
    kfs.generateAndWritePomXML(release);
    for (RuleFile f : files) {
      kfs.write("src/main/resources/" + f.name(), f.text());
    }
    KieBuilder builder = ks.newKieBuilder(kfs).buildAll();
    List<Message> errors = builder.getResults().getMessages(Message.Level.ERROR);
    if (!errors.isEmpty()) {
      Message first = errors.get(0);
      String path = first.getPath() == null ? "?" : first.getPath().replaceFirst("^src/main/resources/", "");
      String where = folder.resolve(path) + (first.getLine() > 0 ? ":" + first.getLine() : "");
      throw new BadInputException(where + ": rule file does not compile: "
          + first.getText().strip().replaceAll("\\s+", " ")
          + (errors.size() > 1 ? " (and " + (errors.size() - 1) + " more errors)" : "")
          + "; fix the rule file or pass --rules with a folder that compiles");
    }
    KieContainer container = ks.newKieContainer(release);
    return new RuleBook(folder, List.copyOf(files), hash, container.getKieBase(), Origin.COMPILED);
  }

  private static final Pattern GROUP =
      Pattern.compile("(?m)^\\s*(ruleflow-group|agenda-group)\\s+\"([^\"]*)\"");

  /**
   * A rule in a group the run never focuses would never fire, and nothing would say so: a farm's
   * own copy of older rule files (a group since renamed) would quietly decide less. Refused here.
   */
  private static void checkGroups(Path folder, RuleFile f) {
    Matcher m = GROUP.matcher(f.text());
    while (m.find()) {
      if (!m.group(1).equals("ruleflow-group") || !PHASES.contains(m.group(2))) {
        int line = (int) f.text().substring(0, m.start(2)).chars().filter(c -> c == '\n').count() + 1;
        throw new BadInputException(folder.resolve(f.name()) + ":" + line + ": " + m.group(1) + " \""
            + m.group(2) + "\" is not a phase Rimeward runs, so its rules would never fire; use"
            + " ruleflow-group with one of " + String.join(", ", PHASES));
      }
    }
  }

  private static List<RuleFile> readFiles(Path folder) {
    try (Stream<Path> walk = Files.walk(folder)) {
      List<Path> paths = walk.filter(p -> p.toString().endsWith(".drl")).sorted().toList();
      List<RuleFile> out = new ArrayList<>();
      for (Path p : paths) {
        String text = TextFile.read(p, TextFile.MAX_DOCUMENT_BYTES, "rule file",
            "rename the folder (only rule files end in .drl) or move it out of the rules folder")
            .text();
        String name = folder.relativize(p).toString().replace('\\', '/');
        out.add(new RuleFile(name, text, sha256(text)));
      }
      return out;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  public Path folder() {
    return folder;
  }

  public List<RuleFile> files() {
    return files;
  }

  /** Whether the rules were compiled in this run or read back compiled. */
  public Origin origin() {
    return origin;
  }

  /** SHA-256 over the rule files' names and texts, in name order. */
  public String contentHash() {
    return contentHash;
  }

  /** A compiled rule: its package, its id (the rule name) and its {@code @} metadata. */
  record RuleInfo(String packageName, String id, java.util.Map<String, Object> metaData) {}

  /** Every compiled rule, by package and id, for checks on the rule files themselves. */
  List<RuleInfo> rules() {
    List<RuleInfo> out = new ArrayList<>();
    for (org.kie.api.definition.KiePackage p : kieBase.getKiePackages()) {
      for (org.kie.api.definition.rule.Rule r : p.getRules()) {
        out.add(new RuleInfo(p.getName(), r.getName(), java.util.Map.copyOf(r.getMetaData())));
      }
    }
    out.sort(java.util.Comparator.comparing(RuleInfo::packageName).thenComparing(RuleInfo::id));
    return List.copyOf(out);
  }

  /** Inserts the facts, runs the phases in order and returns what the rules concluded and why. */
  public Outcome run(List<?> facts, ZoneId zone) {
    KieSession session = kieBase.newKieSession();
    TrailListener trail = new TrailListener(zone);
    session.addEventListener(trail);
    try {
      for (Object f : facts) {
        session.insert(f);
      }
      for (int i = PHASES.size() - 1; i >= 0; i--) {
        session.getAgenda().getAgendaGroup(PHASES.get(i)).setFocus();
      }
      session.fireAllRules();
      List<Object> all = new ArrayList<>(session.getObjects());
      return new Outcome(all, trail.fired());
    } finally {
      session.dispose();
    }
  }

  /** Everything in working memory after the run (inputs and conclusions), and the trail. */
  public record Outcome(List<Object> facts, List<FiredRule> trail) {
    public <T> List<T> all(Class<T> type) {
      return facts.stream().filter(type::isInstance).map(type::cast).toList();
    }
  }

  private static String hashOf(List<RuleFile> files) {
    StringBuilder sb = new StringBuilder();
    files.stream().sorted(java.util.Comparator.comparing(RuleFile::name))
        .forEach(f -> sb.append(f.name()).append('\0').append(f.text()).append('\0'));
    return sha256(sb.toString());
  }

  static String sha256(String text) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
          .digest(text.getBytes(StandardCharsets.UTF_8)));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }
}
