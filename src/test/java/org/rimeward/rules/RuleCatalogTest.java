package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The bundled rule files as a catalogue: each rule has a stable id, a kind and an explanation,
 * runs in one of the phases, names only variables it binds, and has its own tests.
 */
class RuleCatalogTest {
  static final Pattern ID = Pattern.compile("^[A-Z][A-Z0-9-]+$");
  static final Pattern RULE = Pattern.compile("(?m)^rule\\s+\"([^\"]+)\"(.*?)^end\\s*$", Pattern.DOTALL);
  static final Pattern GROUP = Pattern.compile("ruleflow-group\\s+\"([^\"]+)\"");
  static final Pattern EXPLAIN = Pattern.compile("@explain\\(\"((?:[^\"\\\\]|\\\\.)*)\"\\)");
  static final Pattern PLACEHOLDER = Pattern.compile("\\{([A-Za-z][A-Za-z0-9_]*)");

  /** Rule id to its text (header and body), from every .drl file below rules/. */
  static Map<String, List<String>> drlRules() throws IOException {
    Map<String, List<String>> out = new LinkedHashMap<>();
    try (Stream<Path> walk = Files.walk(Path.of("rules"))) {
      for (Path p : walk.filter(f -> f.toString().endsWith(".drl")).sorted().toList()) {
        Matcher m = RULE.matcher(Files.readString(p, StandardCharsets.UTF_8));
        while (m.find()) {
          out.computeIfAbsent(m.group(1), k -> new ArrayList<>()).add(m.group(2));
        }
      }
    }
    return out;
  }

  @Test
  void everyCompiledRuleHasAKindAnExplanationAndAStableId() {
    List<RuleBook.RuleInfo> rules = BundledRules.book().rules();
    assertThat(rules).hasSizeGreaterThan(30);
    for (RuleBook.RuleInfo r : rules) {
      assertThat(r.id()).as("rule id in package %s", r.packageName()).matches(ID);
      assertThat(r.metaData().get("kind")).as("@kind of %s", r.id()).isIn("inference", "decision", "caution");
      assertThat(String.valueOf(r.metaData().get("explain"))).as("@explain of %s", r.id())
          .isNotBlank().isNotEqualTo("null");
    }
  }

  @Test
  void idsAreUniqueAcrossPackages() {
    List<String> ids = BundledRules.book().rules().stream().map(RuleBook.RuleInfo::id).toList();
    assertThat(ids).doesNotHaveDuplicates();
  }

  @Test
  void theRuleFilesDeclareExactlyTheCompiledRulesEachOnce() throws IOException {
    Map<String, List<String>> drl = drlRules();
    drl.forEach((id, texts) -> assertThat(texts).as("declarations of %s", id).hasSize(1));
    Set<String> compiled = BundledRules.book().rules().stream().map(RuleBook.RuleInfo::id)
        .collect(Collectors.toSet());
    assertThat(compiled).containsExactlyInAnyOrderElementsOf(drl.keySet());
  }

  @Test
  void everyRuleRunsInOneOfThePhases() throws IOException {
    drlRules().forEach((id, texts) -> {
      Matcher g = GROUP.matcher(texts.get(0));
      assertThat(g.find()).as("ruleflow-group of %s", id).isTrue();
      assertThat(g.group(1)).as("ruleflow-group of %s", id).isIn(RuleBook.PHASES);
    });
  }

  /**
   * House style: rules are ordered by ruleflow groups, never by salience (a salience hides the
   * order inside a group, where a reader of one rule cannot see it). Every .drl file below rules/,
   * comments aside.
   */
  @Test
  void noRuleFileOrdersBySalience() throws IOException {
    List<Path> files;
    try (Stream<Path> walk = Files.walk(Path.of("rules"))) {
      files = walk.filter(f -> f.toString().endsWith(".drl")).sorted().toList();
    }
    assertThat(files).as("rule files").hasSizeGreaterThan(10);
    for (Path p : files) {
      String code = Files.readString(p, StandardCharsets.UTF_8).replaceAll("//[^\n]*", "");
      assertThat(code).as("%s", p).doesNotContainPattern("(?i)\\bsalience\\b");
    }
  }

  @Test
  void cautionsRunInTheCautionsPhaseAndOnlyThere() {
    for (RuleBook.RuleInfo r : BundledRules.book().rules()) {
      assertThat(r.packageName().equals("cautions")).as("package of %s", r.id())
          .isEqualTo("caution".equals(r.metaData().get("kind")));
    }
  }

  @Test
  void everyPlaceholderNamesAVariableTheRuleBinds() throws IOException {
    drlRules().forEach((id, texts) -> {
      String text = texts.get(0);
      Matcher e = EXPLAIN.matcher(text);
      assertThat(e.find()).as("@explain of %s", id).isTrue();
      Matcher p = PLACEHOLDER.matcher(e.group(1));
      while (p.find()) {
        assertThat(text).as("%s names {%s}", id, p.group(1))
            .containsPattern("\\$" + Pattern.quote(p.group(1)) + "\\s*:");
      }
    });
  }

  /**
   * House style: each rule tested alone, firing and in a near miss. The rule tests are run here
   * and record what their assertions showed ({@link BundledRules.Coverage}): a rule counts as
   * tested firing when an assertion that it fired ran and held, and as tested in a near miss when
   * an assertion that it did not fire ran and held on a scenario of a test's own.
   */
  @Test
  void everyRuleIsShownFiringAndShownNotFiringByTheRuleTests() throws IOException {
    var request = org.junit.platform.launcher.core.LauncherDiscoveryRequestBuilder.request()
        .selectors(org.junit.platform.engine.discovery.DiscoverySelectors.selectPackage("org.rimeward.rules"))
        .filters(org.junit.platform.engine.discovery.ClassNameFilter.includeClassNamePatterns(".*RulesTest"))
        .build();
    var summary = new org.junit.platform.launcher.listeners.SummaryGeneratingListener();
    org.junit.platform.launcher.core.LauncherFactory.create().execute(request, summary);
    assertThat(summary.getSummary().getTestsSucceededCount()).as("rule tests run").isGreaterThan(100);
    assertThat(summary.getSummary().getTotalFailureCount()).as("rule test failures").isZero();
    List<String> neverShownFiring = new ArrayList<>(drlRules().keySet());
    neverShownFiring.removeAll(BundledRules.Coverage.FIRED);
    List<String> neverShownMissing = new ArrayList<>(drlRules().keySet());
    neverShownMissing.removeAll(BundledRules.Coverage.NEAR_MISS);
    assertThat(neverShownFiring).as("rules no rule test shows firing").isEmpty();
    assertThat(neverShownMissing).as("rules no rule test shows not firing in a near miss").isEmpty();
  }
}
