package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import java.time.ZoneOffset;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.rimeward.io.BadInputException;

public class RuleBookTest {
  /** A record used as a fact: the engine must read record accessors in DRL constraints. */
  public record Probe(String blockId, double airTempC) {}

  public record Cold(String blockId) {}

  static RuleBook book(String drl) {
    return RuleBook.compile(Path.of("rules"), List.of(new RuleBook.RuleFile("t/probe.drl", drl, "x")));
  }

  @Test
  void drlReadsRecordAccessorsAndTheTrailKeepsTheNumbers() {
    RuleBook b = book("""
        package t;
        import %s;
        import %s;
        rule "PROBE-COLD"
          @kind("inference")
          @explain("Air {airTempC} is below freezing at {p.blockId}.")
          ruleflow-group "infer"
        when
          $p : Probe(airTempC < 0.0, $airTempC : airTempC)
        then
          insert(new Cold($p.blockId()));
        end
        """.formatted(Probe.class.getCanonicalName(), Cold.class.getCanonicalName()));
    RuleBook.Outcome out = b.run(List.of(new Probe("a", -1.25), new Probe("b", 1.0)), ZoneOffset.UTC);
    assertThat(out.all(Cold.class)).containsExactly(new Cold("a"));
    assertThat(out.trail()).singleElement().satisfies(f -> {
      assertThat(f.ruleId()).isEqualTo("PROBE-COLD");
      assertThat(f.kind()).isEqualTo("inference");
      assertThat(f.blockId()).isEqualTo("a");
      assertThat(f.explanation()).isEqualTo("Air -1.3 °C is below freezing at a.");
    });
  }

  @Test
  void aRuleFileThatDoesNotCompileNamesFileAndLine() {
    assertThatThrownBy(() -> book("""
        package t;
        rule "BROKEN"
        when
          $p : NoSuchFact()
        then
        end
        """))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("probe.drl:")
        .hasMessageContaining("does not compile");
  }

  @Test
  void aRuleInAGroupTheRunNeverFocusesIsRefusedWithFileAndLine() {
    // A group the run never focuses would load and quietly never fire: a typo in a farm's own
    // rule file would share no water, with nothing said.
    String rule = """
        package t;
        rule "OLD-GROUP"
          @kind("decision")
          @explain("never runs")
          ruleflow-group "%s"
        when
        then
        end
        """;
    assertThatThrownBy(() -> book(rule.formatted("water-grants")))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("probe.drl:5: ruleflow-group \"water-grants\" is not a phase")
        .hasMessageContaining("water-terms, water-budget, water-short, water-grant");
    assertThat(book(rule.formatted("water-grant")).run(List.of(), ZoneOffset.UTC).trail())
        .singleElement().satisfies(f -> assertThat(f.ruleId()).isEqualTo("OLD-GROUP"));
    // The single group the water rules shared before they had one per step still runs, so a trail
    // recorded with them replays as it ran.
    assertThat(book(rule.formatted("water")).run(List.of(), ZoneOffset.UTC).trail())
        .singleElement().satisfies(f -> assertThat(f.ruleId()).isEqualTo("OLD-GROUP"));
  }
}
