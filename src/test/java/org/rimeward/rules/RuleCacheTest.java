package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.ObjectOutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.security.MessageDigest;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.plan.NightPlanner;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.PlanRequest;
import org.rimeward.rules.RuleBookTest.Cold;
import org.rimeward.rules.RuleBookTest.Probe;

/**
 * The compiled-rules cache may only make a start faster: whatever is in the cache folder, a run
 * must use exactly the rules in the rules folder.
 */
class RuleCacheTest {
  @TempDir Path tmp;
  Path rules;
  Path cache;

  static String drl(double belowC) {
    return """
        package t;
        import %s;
        import %s;
        rule "PROBE-COLD"
          @kind("inference")
          @explain("Air {airTempC} is below %s at {p.blockId}.")
          ruleflow-group "infer"
        when
          $p : Probe(airTempC < %s, $airTempC : airTempC)
        then
          insert(new Cold($p.blockId()));
        end
        """.formatted(Probe.class.getCanonicalName(), Cold.class.getCanonicalName(), belowC, belowC);
  }

  static final List<Probe> PROBES = List.of(new Probe("a", -1.25), new Probe("b", 1.0),
      new Probe("c", -3.0));

  @BeforeEach
  void folders() throws IOException {
    rules = Files.createDirectories(tmp.resolve("rules/t"));
    cache = tmp.resolve("cache");
    Files.writeString(rules.resolve("probe.drl"), drl(0.0));
    rules = tmp.resolve("rules");
  }

  List<Path> entries() throws IOException {
    if (!Files.isDirectory(cache)) {
      return List.of();
    }
    try (Stream<Path> s = Files.list(cache)) {
      return s.filter(p -> p.toString().endsWith(".rules.bin")).sorted().toList();
    }
  }

  @Test
  void theSecondLoadReadsTheCacheAndConcludesTheSame() throws IOException {
    RuleBook first = RuleBook.loadCached(rules, cache);
    assertThat(first.origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(entries()).hasSize(1);

    RuleBook second = RuleBook.loadCached(rules, cache);
    assertThat(second.origin()).isEqualTo(RuleBook.Origin.CACHED);
    assertThat(second.contentHash()).isEqualTo(first.contentHash());
    assertThat(second.files()).isEqualTo(first.files());

    RuleBook.Outcome a = first.run(PROBES, ZoneOffset.UTC);
    RuleBook.Outcome b = second.run(PROBES, ZoneOffset.UTC);
    assertThat(b.all(Cold.class)).containsExactlyInAnyOrderElementsOf(a.all(Cold.class))
        .containsExactlyInAnyOrder(new Cold("a"), new Cold("c"));
    assertThat(b.trail()).isEqualTo(a.trail());
  }

  @Test
  void anEditedRuleFileIsCompiledAgainAndItsNewThresholdApplies() throws IOException {
    RuleBook.loadCached(rules, cache);
    assertThat(RuleBook.loadCached(rules, cache).origin()).isEqualTo(RuleBook.Origin.CACHED);

    // Same file name, a different threshold: only the content tells the two apart.
    Files.writeString(rules.resolve("t/probe.drl"), drl(-2.0));
    RuleBook edited = RuleBook.loadCached(rules, cache);
    assertThat(edited.origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(edited.run(PROBES, ZoneOffset.UTC).all(Cold.class)).containsExactly(new Cold("c"));
    assertThat(RuleBook.loadCached(rules, cache).run(PROBES, ZoneOffset.UTC).all(Cold.class))
        .containsExactly(new Cold("c"));

    // Going back to the first text finds its entry again, and its old threshold.
    Files.writeString(rules.resolve("t/probe.drl"), drl(0.0));
    RuleBook back = RuleBook.loadCached(rules, cache);
    assertThat(back.origin()).isEqualTo(RuleBook.Origin.CACHED);
    assertThat(back.run(PROBES, ZoneOffset.UTC).all(Cold.class))
        .containsExactlyInAnyOrder(new Cold("a"), new Cold("c"));
  }

  @Test
  void aNewRuleFileBesideTheOthersIsCompiledAgain() throws IOException {
    RuleBook.loadCached(rules, cache);
    Files.writeString(rules.resolve("t/extra.drl"), """
        package t;
        rule "EXTRA"
          ruleflow-group "infer"
        when
        then
        end
        """);
    RuleBook more = RuleBook.loadCached(rules, cache);
    assertThat(more.origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(more.run(PROBES, ZoneOffset.UTC).trail()).extracting(FiredRule::ruleId).contains("EXTRA");
  }

  @Test
  void aCorruptCacheFileFallsBackToCompilingAndIsReplaced() throws IOException {
    RuleBook.loadCached(rules, cache);
    Path entry = entries().get(0);
    byte[] good = Files.readAllBytes(entry);

    byte[] flipped = good.clone();
    flipped[flipped.length / 2] ^= 0x40;
    List<byte[]> damaged = List.of(
        flipped,
        java.util.Arrays.copyOf(good, good.length / 3),
        new byte[0],
        "not a cache file at all".getBytes(StandardCharsets.UTF_8),
        java.util.Arrays.copyOf(good, good.length + 7));
    for (byte[] bad : damaged) {
      Files.write(entry, bad);
      RuleBook book = RuleBook.loadCached(rules, cache);
      assertThat(book.origin()).as("damaged file of %d bytes", bad.length)
          .isEqualTo(RuleBook.Origin.COMPILED);
      assertThat(book.run(PROBES, ZoneOffset.UTC).all(Cold.class))
          .containsExactlyInAnyOrder(new Cold("a"), new Cold("c"));
      assertThat(Files.readAllBytes(entry)).as("rewritten after a miss").hasSize(good.length);
      assertThat(RuleBook.loadCached(rules, cache).origin()).isEqualTo(RuleBook.Origin.CACHED);
    }
  }

  @Test
  void anEntryWithAValidEnvelopeButNoRulePackagesIsNotUsed() throws Exception {
    RuleBook.loadCached(rules, cache);
    Path entry = entries().get(0);
    String key = entry.getFileName().toString().replace(".rules.bin", "");
    ByteArrayOutputStream body = new ByteArrayOutputStream();
    try (ObjectOutputStream out = new ObjectOutputStream(body)) {
      out.writeObject(new ArrayList<>(List.of("a string, not a package")));
    }
    Files.write(entry, envelope(key, body.toByteArray()));
    assertThat(RuleBook.loadCached(rules, cache).origin()).isEqualTo(RuleBook.Origin.COMPILED);
  }

  @Test
  void anEntryCopiedUnderAnotherKeyIsNotUsed() throws IOException {
    RuleBook.loadCached(rules, cache);
    Path original = entries().get(0);
    Files.writeString(rules.resolve("t/probe.drl"), drl(-2.0));
    RuleBook.loadCached(rules, cache);
    // Put the first text's entry where the second text's entry is looked up.
    Path second = entries().stream().filter(p -> !p.equals(original)).findFirst().orElseThrow();
    Files.copy(original, second, java.nio.file.StandardCopyOption.REPLACE_EXISTING);
    RuleBook book = RuleBook.loadCached(rules, cache);
    assertThat(book.origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(book.run(PROBES, ZoneOffset.UTC).all(Cold.class)).containsExactly(new Cold("c"));
  }

  @Test
  void aCacheFolderThatCannotBeWrittenOnlyCostsTime() throws IOException {
    Files.writeString(cache, "a file where the cache folder should be");
    RuleBook book = RuleBook.loadCached(rules, cache);
    assertThat(book.origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(book.run(PROBES, ZoneOffset.UTC).all(Cold.class)).hasSize(2);
    assertThat(RuleBook.loadCached(rules, cache).origin()).isEqualTo(RuleBook.Origin.COMPILED);
  }

  @Test
  void rulesThatDoNotCompileAreNotCached() throws IOException {
    Files.writeString(rules.resolve("t/broken.drl"), """
        package t;
        rule "BROKEN"
        when
          $p : NoSuchFact()
        then
        end
        """);
    assertThatThrownBy(() -> RuleBook.loadCached(rules, cache))
        .isInstanceOf(BadInputException.class).hasMessageContaining("broken.drl");
    assertThat(entries()).isEmpty();
  }

  @Test
  void noCacheCompilesEveryTime() {
    assertThat(RuleBook.load(rules, RuleCache.none()).origin()).isEqualTo(RuleBook.Origin.COMPILED);
    assertThat(RuleBook.load(rules, RuleCache.none()).origin()).isEqualTo(RuleBook.Origin.COMPILED);
  }

  @Test
  void oldEntriesArePrunedNewestKept() throws IOException {
    Files.createDirectories(cache);
    for (int i = 0; i < RuleCache.KEEP + 3; i++) {
      Path p = cache.resolve("old" + i + ".rules.bin");
      Files.writeString(p, "x");
      Files.setLastModifiedTime(p, FileTime.fromMillis(1_000_000L * (i + 1)));
    }
    Path unrelated = Files.writeString(cache.resolve("notes.txt"), "kept");
    RuleBook.loadCached(rules, cache);
    List<String> names = entries().stream().map(p -> p.getFileName().toString()).toList();
    assertThat(names).hasSize(RuleCache.KEEP).doesNotContain("old0.rules.bin", "old1.rules.bin",
        "old2.rules.bin", "old3.rules.bin").contains("old" + (RuleCache.KEEP + 2) + ".rules.bin");
    assertThat(unrelated).exists();
  }

  @Test
  void theCacheFolderComesFromPropertyThenEnvironmentThenXdgThenHome() {
    assertThat(RuleCache.configuredDir("/p", "/e", "/x", "/h")).isEqualTo(Path.of("/p"));
    assertThat(RuleCache.configuredDir(null, "/e", "/x", "/h")).isEqualTo(Path.of("/e"));
    assertThat(RuleCache.configuredDir(" ", "/e", "/x", "/h")).isEqualTo(Path.of("/e"));
    assertThat(RuleCache.configuredDir(null, null, "/x", "/h")).isEqualTo(Path.of("/x/rimeward/rules"));
    assertThat(RuleCache.configuredDir(null, null, "relative", "/h"))
        .as("the XDG spec says a relative XDG_CACHE_HOME is to be ignored")
        .isEqualTo(Path.of("/h/.cache/rimeward/rules"));
    assertThat(RuleCache.configuredDir(null, null, null, "/h")).isEqualTo(Path.of("/h/.cache/rimeward/rules"));
    assertThat(RuleCache.configuredDir("off", "/e", "/x", "/h")).isNull();
    assertThat(RuleCache.configuredDir(null, "OFF", "/x", "/h")).isNull();
    assertThat(RuleCache.configuredDir(null, null, null, null)).isNull();
  }

  @Test
  void theKeyCoversTheRuleTextTheCodeTheEngineAndJava() {
    assertThat(CacheKey.of("aaa")).isEqualTo(CacheKey.of("aaa")).isNotEqualTo(CacheKey.of("aab"));
    assertThat(CacheKey.codeFingerprint()).doesNotStartWith("unknown")
        .isEqualTo(CacheKey.codeFingerprint());
    assertThat(CacheKey.engineVersion()).contains("drools-core=").doesNotContain("=?");
  }

  @Test
  void aChangedClassOrARebuiltJarChangesTheCodeFingerprint() throws IOException {
    Path classes = Files.createDirectories(tmp.resolve("classes/org/rimeward/rules/facts"));
    Files.write(classes.resolve("Risk.class"), new byte[] {1, 2, 3});
    Files.write(classes.resolve("Target.class"), new byte[] {4, 5});
    String before = CacheKey.fingerprintOf(tmp.resolve("classes"));
    assertThat(CacheKey.fingerprintOf(tmp.resolve("classes"))).isEqualTo(before);
    Files.write(classes.resolve("Risk.class"), new byte[] {1, 2, 4});
    assertThat(CacheKey.fingerprintOf(tmp.resolve("classes"))).isNotEqualTo(before);

    Path jar = Files.write(tmp.resolve("rimeward.jar"), new byte[] {9, 9, 9});
    Files.setLastModifiedTime(jar, FileTime.fromMillis(1_700_000_000_000L));
    String built = CacheKey.fingerprintOf(jar);
    assertThat(CacheKey.fingerprintOf(jar)).isEqualTo(built);
    Files.setLastModifiedTime(jar, FileTime.fromMillis(1_700_000_001_000L));
    assertThat(CacheKey.fingerprintOf(jar)).as("rebuilt").isNotEqualTo(built);
    assertThat(CacheKey.fingerprintOf(tmp.resolve("missing"))).startsWith("unknown")
        .isNotEqualTo(CacheKey.fingerprintOf(tmp.resolve("missing")));
  }

  @Test
  void theBundledRulesPlanTheDemoFarmTheSameFromTheCache() {
    Path bundled = Path.of("rules");
    NightPlanner compiled = new NightPlanner(d -> RuleBook.loadCached(d, cache));
    PlanRequest demo = new PlanRequest(Path.of("demo-farm"), null, Path.of("crop-profiles"), bundled, null);
    String first = PlanJson.toText(compiled.plan(demo));
    RuleBook cached = RuleBook.loadCached(bundled, cache);
    assertThat(cached.origin()).isEqualTo(RuleBook.Origin.CACHED);
    String second = PlanJson.toText(new NightPlanner(d -> cached).plan(demo));
    assertThat(second).isEqualTo(first).contains("hollow-cherry");
  }

  private static byte[] envelope(String key, byte[] body) throws Exception {
    ByteArrayOutputStream file = new ByteArrayOutputStream();
    try (DataOutputStream out = new DataOutputStream(file)) {
      out.write("RIMEWARD-RULES\n".getBytes(StandardCharsets.US_ASCII));
      out.writeInt(1);
      out.writeUTF(key);
      out.write(MessageDigest.getInstance("SHA-256").digest(body));
      out.writeInt(body.length);
      out.write(body);
    }
    return file.toByteArray();
  }
}
