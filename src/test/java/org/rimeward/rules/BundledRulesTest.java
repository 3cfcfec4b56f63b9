package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.*;

class BundledRulesTest {
  static RuleBook rules;

  @BeforeAll
  static void compile() {
    rules = RuleBook.load(Path.of("rules"));
  }

  static List<String> fired(RuleBook.Outcome o, String block) {
    return o.trail().stream().filter(f -> block.equals(f.blockId())).map(FiredRule::ruleId).toList();
  }

  // 18:00 ... 09:00 next day (16 hourly steps); air falls to -4 at 05:00, warms after sunrise.
  static final double[] AIR = {6, 5, 4, 3, 2, 1, 0, -1, -2, -3, -3.5, -4, -3, 0, 2, 4};
  static final double[] WET = {3, 2.5, 2, 1.5, 0.5, -0.5, -1.5, -2, -3, -3.8, -4, -4.5, -3.5, -1, 0.5, 2};

  @Test
  void aFrostNightOnASprinkledBlockStartsAndStops() {
    Scenario s = new Scenario().source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").kill(40).hourly(AIR, WET).done();
    RuleBook.Outcome o = rules.run(s.facts(), Scenario.ZONE);
    assertThat(fired(o, "b1")).contains("TARGET-T10", "RISK-SEVERE", "NEEDS-PROTECTION",
        "START-THRESHOLD", "SPRINKLE-START", "SPRINKLE-STOP-WET-BULB-FREEZING", "SPRINKLE-PLAN",
        "RATE-ENOUGH", "STATUS-PROTECTED-BY-SPRINKLING");
    // Hand arithmetic (wet bud = wet bulb - 1.0 °C depression): threshold -2.2 + 1.0 = -1.2 °C is
    // crossed between 22:00 (-0.5) and 23:00 (-1.5) at 0.7 of the hour, 22:42.
    assertThat(o.all(org.rimeward.rules.facts.SprinkleStart.class)).singleElement()
        .satisfies(st -> assertThat(st.at()).isEqualTo(Scenario.at(0, 22, 42)));
  }
}
