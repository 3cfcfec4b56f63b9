package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.StationFact;
import org.rimeward.units.UnitSystem;

/**
 * rules/cautions/cautions.drl, the station cautions: a thermometer whose readings correct a
 * block's plan must hang at bud height ("check thermometers at bud height", the standing caution
 * of every plan: common practice). The 0.3 m allowed either way is a Rimeward choice.
 */
class StationRulesTest {
  static BundledRules.Run withStation(StationFact st) {
    Scenario s = new Scenario();
    s.block("b1").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    return BundledRules.run(s.fact(st));
  }

  @Test
  void aMastAboveTheBudsIsCautionedWithBothHeights() {
    BundledRules.Run r = withStation(new StationFact("mast", 2.0, 0.5, "b1, b2"));
    FiredRule f = r.firing("CAUTION-STATION-HEIGHT");
    assertThat(f.isCaution()).isTrue();
    assertThat(f.blockId()).as("a station's caution is the farm's, not one block's").isNull();
    assertThat(f.explanation()).contains("Station mast", "2.0 m", "0.5 m", "b1, b2", "0.3 m",
        "not at bud height", "Hang it at bud height");
    // Shown in the grower's units: 2.0 m is 6.6 ft, 0.5 m 1.6 ft (NIST SP 811: ft = 0.3048 m).
    assertThat(Explanations.render(f.template(), f.values(), UnitSystem.US, Scenario.ZONE))
        .contains("6.6 ft", "1.6 ft", "1.0 ft");
    BundledRules.assertFired(r).doesNotFire("CAUTION-STATION-BUD-HEIGHT");
  }

  @Test
  void aThermometerLowAmongStrawberriesIsCautionedToo() {
    // Below the buds by more than the allowance: it reads colder than they are.
    BundledRules.assertFired(withStation(new StationFact("bed", 0.1, 0.5, "b1")))
        .fires("CAUTION-STATION-HEIGHT");
  }

  @Test
  void withinTheAllowanceOfTheBudsNoCaution() {
    // 0.25 m above the buds: within 0.3 m, the near miss.
    BundledRules.assertFired(withStation(new StationFact("hollow", 1.25, 1.0, "b1")))
        .doesNotFire("CAUTION-STATION-HEIGHT", "CAUTION-STATION-BUD-HEIGHT");
  }

  @Test
  void noBudHeightGivenAsksTheGrowerToCheck() {
    BundledRules.Run r = withStation(new StationFact("mast", 1.5, Double.NaN, "b1"));
    assertThat(r.firing("CAUTION-STATION-BUD-HEIGHT").explanation())
        .contains("Station mast", "1.5 m", "no bud_height for b1", "lowest buds");
    BundledRules.assertFired(r).doesNotFire("CAUTION-STATION-HEIGHT");
  }

  @Test
  void noStationNoStationCaution() {
    Scenario s = new Scenario();
    s.block("b1").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    BundledRules.assertFired(BundledRules.run(s))
        .doesNotFire("CAUTION-STATION-HEIGHT", "CAUTION-STATION-BUD-HEIGHT");
  }
}
