package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The bundled rule files, compiled once for every rule test in the run (compiling takes about a
 * second), and a way to run them on a scenario that checks what every run must satisfy: each
 * explanation is fully rendered.
 */
final class BundledRules {
  private static final Pattern UNRESOLVED = Pattern.compile("\\{[^}]*}");

  private BundledRules() {}

  private static final class Holder {
    static final RuleBook BOOK = RuleBook.load(Path.of("rules"));
  }

  static RuleBook book() {
    return Holder.BOOK;
  }

  static Run run(Scenario s) {
    RuleBook.Outcome o = book().run(s.facts(), Scenario.ZONE);
    for (FiredRule f : o.trail()) {
      assertThat(f.explanation()).as("explanation of %s on %s", f.ruleId(), f.blockId())
          .doesNotContainPattern(UNRESOLVED)
          .isNotBlank();
    }
    return new Run(o);
  }

  /**
   * Which rules the rule tests have shown firing, and which they have shown not firing in a
   * scenario of their own (a near miss), as the assertions ran and held. RuleCatalogTest runs the
   * rule tests and reads it.
   */
  static final class Coverage {
    static final java.util.Set<String> FIRED = java.util.concurrent.ConcurrentHashMap.newKeySet();
    static final java.util.Set<String> NEAR_MISS = java.util.concurrent.ConcurrentHashMap.newKeySet();

    private Coverage() {}
  }

  /** Assertions on the rules that fired in a run (for one block, or in all), recorded as held. */
  static final class FiredAssert {
    private final List<String> fired;
    private final String what;

    FiredAssert(List<String> fired, String what) {
      this.fired = fired;
      this.what = what;
    }

    /** Each rule fired (at least once). */
    FiredAssert fires(String... ids) {
      assertThat(fired).as(what).contains(ids);
      Coverage.FIRED.addAll(List.of(ids));
      return this;
    }

    /** Each rule fired exactly once. */
    FiredAssert firesOnce(String... ids) {
      assertThat(fired).as(what).containsOnlyOnce(ids);
      Coverage.FIRED.addAll(List.of(ids));
      return this;
    }

    /** None of the rules fired: for each, this scenario is a near miss its test chose. */
    FiredAssert doesNotFire(String... ids) {
      assertThat(fired).as(what).doesNotContain(ids);
      Coverage.NEAR_MISS.addAll(List.of(ids));
      return this;
    }
  }

  static FiredAssert assertFired(Run r, String blockId) {
    return new FiredAssert(r.firedFor(blockId), "rules fired for " + blockId + " in " + r.fired());
  }

  static FiredAssert assertFired(Run r) {
    return new FiredAssert(r.fired(), "rules fired");
  }

  /** What one run concluded, with the questions the rule tests ask of it. */
  record Run(RuleBook.Outcome outcome) {
    /** The ids of the rules that fired for a block, in firing order. */
    List<String> firedFor(String blockId) {
      return outcome.trail().stream().filter(f -> blockId.equals(f.blockId()))
          .map(FiredRule::ruleId).toList();
    }

    /** The ids of every rule that fired, in firing order. */
    List<String> fired() {
      return outcome.trail().stream().map(FiredRule::ruleId).toList();
    }

    /** The single firing of a rule for a block; fails if it fired never or more than once. */
    FiredRule firing(String ruleId, String blockId) {
      List<FiredRule> hits = outcome.trail().stream()
          .filter(f -> f.ruleId().equals(ruleId) && blockId.equals(f.blockId())).toList();
      assertThat(hits).as("%s firings for %s in %s", ruleId, blockId, fired()).hasSize(1);
      Coverage.FIRED.add(ruleId);
      return hits.get(0);
    }

    /** The single firing of a farm-wide or source rule. */
    FiredRule firing(String ruleId) {
      List<FiredRule> hits = outcome.trail().stream().filter(f -> f.ruleId().equals(ruleId)).toList();
      assertThat(hits).as("%s firings in %s", ruleId, fired()).hasSize(1);
      Coverage.FIRED.add(ruleId);
      return hits.get(0);
    }

    String explanation(String ruleId, String blockId) {
      FiredRule f = firing(ruleId, blockId);
      Coverage.FIRED.add(ruleId);
      return f.explanation();
    }

    <T> List<T> all(Class<T> type) {
      return outcome.all(type);
    }

    /** The single fact of a type about a block; fails if there is none or more than one. */
    <T extends Record> T one(Class<T> type, String blockId) {
      List<T> hits = outcome.all(type).stream().filter(f -> blockId.equals(blockIdOf(f))).toList();
      assertThat(hits).as("%s facts for %s", type.getSimpleName(), blockId).hasSize(1);
      return hits.get(0);
    }

    <T extends Record> List<T> about(Class<T> type, String blockId) {
      return outcome.all(type).stream().filter(f -> blockId.equals(blockIdOf(f))).toList();
    }

    private static String blockIdOf(Record r) {
      try {
        return String.valueOf(r.getClass().getMethod("blockId").invoke(r));
      } catch (ReflectiveOperationException e) {
        throw new IllegalArgumentException(r.getClass().getSimpleName() + " has no blockId", e);
      }
    }
  }
}
