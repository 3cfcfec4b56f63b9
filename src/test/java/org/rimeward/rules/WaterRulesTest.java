package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.BlockSets;
import org.rimeward.rules.facts.BlockStatus;
import org.rimeward.rules.facts.PartProtection;
import org.rimeward.rules.facts.Status;
import org.rimeward.rules.facts.WaterBalance;
import org.rimeward.rules.facts.WithoutWater;
import org.rimeward.units.UnitSystem;
import org.rimeward.water.Grant;
import org.rimeward.water.GrantKind;
import org.rimeward.water.IrrigationSet;
import org.rimeward.water.Terms;

/**
 * rules/water/budget.drl. Sprinkled blocks of 4 ha at 3.8 mm/h on the frost night: each wants
 * 3.8 × 4 × 10 = 152 m³/h from 22:42 to 07:40 (8 h 58 min), 1362.93 m³ in all. Invented farm;
 * the principle, never below the need, from the NC State Extension start/stop guide and FAO 2005
 * ch. 7; the 25 % margin is common practice (see the rule file).
 */
class WaterRulesTest {
  static final double HOURS = 8 + 58 / 60.0;
  static final double ONE_NIGHT_M3 = 152.0 * HOURS;

  static Scenario.BlockBuilder sprinkled(Scenario s, String id, String source) {
    return s.block(id).sprinklers(3.8, source).kill(40).hourly(Scenario.FROST_AIR, Scenario.FROST_WET);
  }

  /**
   * Two blocks on one well running at the same time, each with its crop value per ha. The night
   * needs 3.5 mm/h: plus 25 % that is above the installed 3.8, so neither can run slower.
   */
  static BundledRules.Run twoOnAWell(double maxFlowM3H, double valueB1, double valueB2) {
    Scenario s = new Scenario().source("well", maxFlowM3H, Double.NaN);
    sprinkled(s, "b1", "well").value(valueB1).rate(Scenario.fill(16, 3.5)).done();
    sprinkled(s, "b2", "well").value(valueB2).rate(Scenario.fill(16, 3.5)).done();
    return BundledRules.run(s);
  }

  static WaterBalance balance(BundledRules.Run r, String sourceId) {
    return r.all(WaterBalance.class).stream().filter(w -> w.sourceId().equals(sourceId))
        .findFirst().orElseThrow();
  }

  @Test
  void budgetAddsUpWhatTheBlocksWant() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 5000), "b1", "pond").done());
    FiredRule f = r.firing("WATER-BUDGET");
    assertThat(f.sourceId()).isEqualTo("pond");
    WaterBalance w = balance(r, "pond");
    assertThat(w.wantedPeakFlowM3H()).isCloseTo(152.0, within(1e-9));
    assertThat(w.peakFlowM3H()).isCloseTo(152.0, within(1e-9));
    assertThat(w.wantedVolumeM3()).isCloseTo(ONE_NIGHT_M3, within(1e-6));
    assertThat(w.shortOfWater()).isFalse();
    assertThat(f.explanation()).contains("pond", "152 m3/h", "500 m3/h", "1363 m3", "5000 m3");
    BundledRules.assertFired(r).doesNotFire("WATER-SHORT");
  }

  @Test
  void sharingTermsAreStatedOnceWhenAPlanDrawsWater() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 5000), "b1", "pond").done());
    FiredRule f = r.firing("WATER-SHARING-TERMS");
    assertThat(f.blockId()).isNull();
    assertThat(f.explanation()).contains("25 %", "10 %", "NC State", "FAO 2005");
    assertThat(r.all(Terms.class)).containsExactly(new Terms(25, 10));
  }

  @Test
  void noBudgetAndNoTermsForASourceNoPlanDrawsOn() {
    double[] warm = Scenario.fill(16, 5.0);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").hourly(warm, warm).done());
    BundledRules.assertFired(r).doesNotFire("WATER-BUDGET", "WATER-SHARING-TERMS");
    assertThat(r.all(WaterBalance.class)).isEmpty();
  }

  @Test
  void aWellWithoutAVolumeLimitSaysSo() {
    BundledRules.Run r = twoOnAWell(500, 1, 1);
    assertThat(r.firing("WATER-BUDGET").explanation()).contains("304 m3/h", "no limit");
  }

  @Test
  void theShortBoreProtectsTheCherryBlock() {
    // 2.5 ha at 4.0 mm/h wants 100 m³/h from a bore of 90 m³/h; the night needs 1.93 mm/h, so
    // the block may run down to 1.93 × 1.25 = 2.41 mm/h. It runs at 90 / 25 = 3.60 mm/h, whole.
    Scenario s = new Scenario().source("bore", 90, Double.NaN);
    s.block("cherry").sprinklers(4.0, "bore").area(2.5).kill(100).value(48000)
        .rate(Scenario.fill(16, 1.93)).hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    BundledRules.Run r = BundledRules.run(s);
    Grant g = balance(r, "bore").grant("cherry");
    assertThat(g.kind()).isEqualTo(GrantKind.REDUCED_RATE);
    assertThat(g.rateMmH()).isCloseTo(3.6, within(1e-9));
    assertThat(g.areaHa()).isCloseTo(2.5, within(1e-9));
    assertThat(r.explanation("WATER-REDUCED-RATE", "cherry"))
        .contains("3.60 mm/h", "4.00 mm/h", "90 m3/h", "100 m3/h", "1.93 mm/h", "25 %", "2.41 mm/h");
    assertThat(r.firing("WATER-SHORT").explanation())
        .contains("100 m3/h", "90 m3/h", "Protected whole: cherry", "in part: none", "without water: none")
        .doesNotContain("serves none");
    assertThat(r.one(BlockStatus.class, "cherry").status()).isEqualTo(Status.PROTECTED);
    assertThat(r.all(WithoutWater.class)).isEmpty();
  }

  @Test
  void aBoreThatCarriesTheBlockReducesNothing() {
    Scenario s = new Scenario().source("bore", 100, Double.NaN);
    s.block("cherry").sprinklers(4.0, "bore").area(2.5).kill(100).value(48000)
        .rate(Scenario.fill(16, 1.93)).hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    BundledRules.Run r = BundledRules.run(s);
    BundledRules.assertFired(r).doesNotFire("WATER-SHORT", "WATER-REDUCED-RATE");
    assertThat(balance(r, "bore").grant("cherry").kind()).isEqualTo(GrantKind.FULL);
  }

  @Test
  void twoBlocksOnAPumpForOneAndAHalfShareTheSpareAtFullRate() {
    // 228 m³/h = 1.5 × 152. b1 (20000 per ha) runs whole; b2 gets the 76 m³/h left at the full
    // 3.8 mm/h over 76 / 38 = 2.0 ha, never a thinner spread over all 4 ha.
    BundledRules.Run r = twoOnAWell(228, 20000, 10000);
    WaterBalance w = balance(r, "well");
    assertThat(w.peakFlowM3H()).isCloseTo(228, within(1e-9));
    assertThat(w.wantedPeakFlowM3H()).isCloseTo(304, within(1e-9));
    PartProtection p = r.one(PartProtection.class, "b2");
    assertThat(p.grant().kind()).isEqualTo(GrantKind.PART_AREA);
    assertThat(p.grant().rateMmH()).isCloseTo(3.8, within(1e-9));
    assertThat(p.grant().areaHa()).isCloseTo(2.0, within(1e-9));
    assertThat(r.explanation("WATER-PART-AREA", "b2"))
        .contains("76 m3/h", "2.0 ha of its 4.0 ha", "3.80 mm/h", "152 m3/h", "sets:");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.PARTLY_PROTECTED);
    BundledRules.assertFired(r, "b2").fires("STATUS-PARTLY-PROTECTED").doesNotFire("WATER-WITHOUT");
    assertThat(r.one(BlockStatus.class, "b1").status()).isEqualTo(Status.PROTECTED);
    BundledRules.assertFired(r, "b1").doesNotFire("WATER-PART-AREA", "STATUS-PARTLY-PROTECTED");
    assertThat(r.firing("WATER-SHORT").explanation()).contains("Protected whole: b1", "in part: b2",
        "without water: none", "228 m3/h");
  }

  @Test
  void declaredSetsAreRunWhole() {
    // b2's sets: north 1.5 ha (57 m³/h), south 2.5 ha (95 m³/h). 76 m³/h to spare runs north.
    Scenario s = new Scenario().source("well", 228, Double.NaN);
    sprinkled(s, "b1", "well").value(20000).rate(Scenario.fill(16, 3.5)).done();
    sprinkled(s, "b2", "well").value(10000).rate(Scenario.fill(16, 3.5)).done();
    s.facts.add(new BlockSets("b2", List.of(new IrrigationSet("north", 1.5, 57),
        new IrrigationSet("south", 2.5, 95))));
    BundledRules.Run r = BundledRules.run(s);
    Grant g = r.one(PartProtection.class, "b2").grant();
    assertThat(g.kind()).isEqualTo(GrantKind.SETS);
    assertThat(g.setIds()).containsExactly("north");
    assertThat(r.explanation("WATER-PART-SETS", "b2")).contains("sets north", "1.5 ha of 4.0 ha", "57 m3/h");
    BundledRules.assertFired(r).doesNotFire("WATER-PART-AREA");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.PARTLY_PROTECTED);
  }

  @Test
  void notShortOnFlowAtEquality() {
    BundledRules.Run r = twoOnAWell(304, 20000, 10000);
    BundledRules.assertFired(r).fires("WATER-BUDGET").doesNotFire("WATER-SHORT", "WATER-WITHOUT",
        "WATER-PART-AREA", "WATER-PART-SETS", "WATER-REDUCED-RATE");
    assertThat(balance(r, "well").shortOfWater()).isFalse();
  }

  @Test
  void shortOnVolumeAloneRunsTheBlockJustBelowItsRate() {
    // Flow is ample (500 m³/h); the pond holds 1362.9 m³ against the 1362.93 the night wants, so
    // the block runs at 1362.9 / 8.967 h / 40 = 3.7999 mm/h, far above its floor of 2.5 mm/h.
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 1362.9), "b1", "pond").done());
    r.firing("WATER-SHORT");
    WaterBalance w = balance(r, "pond");
    assertThat(w.volumeShort()).isTrue();
    assertThat(w.flowShort()).isFalse();
    assertThat(w.grant("b1").kind()).isEqualTo(GrantKind.REDUCED_RATE);
    assertThat(w.volumeM3()).isCloseTo(1362.9, within(1e-6));
    BundledRules.assertFired(r, "b1").fires("WATER-REDUCED-RATE").doesNotFire("WATER-WITHOUT");
  }

  @Test
  void notShortOnVolumeWithJustEnough() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 1363.0), "b1", "pond").done());
    BundledRules.assertFired(r).doesNotFire("WATER-SHORT", "WATER-WITHOUT");
  }

  @Test
  void aBlockWhoseSmallestPartDoesNotFitGoesWithout() {
    // 152 + 15 = 167 m³/h: b2 could have 15 / 152 = 9.9 % of its area, under the 10 % floor.
    BundledRules.Run r = twoOnAWell(167, 20000, 10000);
    BundledRules.assertFired(r, "b2").firesOnce("WATER-WITHOUT").doesNotFire("WATER-WITHOUT-COVERED");
    BundledRules.assertFired(r, "b1").doesNotFire("WATER-WITHOUT");
    // Stake per m³ of the least protecting water (here the installed rate): 0.4 × 4 × 10000 / 1362.93.
    WithoutWater w = r.one(WithoutWater.class, "b2");
    assertThat(w.sourceId()).isEqualTo("well");
    assertThat(w.valuePerM3()).isCloseTo(0.4 * 4 * 10000 / ONE_NIGHT_M3, within(1e-9));
    assertThat(r.explanation("WATER-WITHOUT", "b2"))
        .contains("b2", "well", "crop value saved 11.7 per m³", "15 m3/h", "40 %", "Keep its sprinklers off")
        .doesNotContain(" m3 crop");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.SHORT_OF_WATER);
    assertThat(r.one(BlockStatus.class, "b1").status()).isEqualTo(Status.PROTECTED);
  }

  @Test
  void aTenthOfTheBlockIsWorthSprinkling() {
    BundledRules.Run r = twoOnAWell(167.3, 20000, 10000);
    BundledRules.assertFired(r, "b2").fires("WATER-PART-AREA").doesNotFire("WATER-WITHOUT");
  }

  @Test
  void withoutAValueEverywhereBlocksAreRankedByHectaresSaved() {
    // b1 has a crop value, b2 none: ranked by area. Stake = kill × ha / m³: b1 0.4 × 4 / 1362.93
    // = 0.00117, b2 (kill 60 %) 0.6 × 4 / 1362.93 = 0.00176. b1 goes without despite its value.
    Scenario s = new Scenario().source("well", 160, Double.NaN);
    sprinkled(s, "b1", "well").value(20000).rate(Scenario.fill(16, 3.5)).done();
    sprinkled(s, "b2", "well").kill(60).rate(Scenario.fill(16, 3.5)).done();
    BundledRules.Run r = BundledRules.run(s);
    WaterBalance w = balance(r, "well");
    assertThat(w.allocation().rankedByValue()).isFalse();
    assertThat(w.allocation().dropped()).containsExactly("b1");
    assertThat(r.explanation("WATER-WITHOUT", "b1")).contains("(0.00117 ha of buds saved per m³,");
    // In US units the stake is an area per volume: acres per 1,000 gal, both from NIST SP 811
    // (1 acre = 4046.8564224 m², 1 gal = 3.785411784 L): 0.4 × 4 / 1362.93 ha per m³ is
    // 0.0109... ac per 1,000 gal, shown to three significant figures.
    double acresPer1000Gal = 0.4 * 4 / 1362.93 * (10_000 / 4046.8564224) * 3.785411784;
    assertThat(acresPer1000Gal).isCloseTo(0.01098, within(0.00001));
    FiredRule f = r.firing("WATER-WITHOUT", "b1");
    assertThat(Explanations.render(f.template(), f.values(), UnitSystem.US, java.time.ZoneOffset.UTC))
        .contains("(0.011 ac of buds saved per 1,000 gal,").doesNotContain("hectare", " ha ", "m³");
  }

  @Test
  void aCoveredBlockThatGoesWithoutKeepsItsCovers() {
    // b2 has 1 °C of cover: -5.0 + 1.0 = -4.0 °C, not enough alone, so it would be sprinkled over
    // the covers from 23:42 to 07:40 (1210.9 m³) and, at 10000 per ha, has the smaller stake.
    Scenario s = new Scenario().source("well", 160, Double.NaN);
    sprinkled(s, "b1", "well").value(20000).rate(Scenario.fill(16, 3.5)).done();
    sprinkled(s, "b2", "well").value(10000).rate(Scenario.fill(16, 3.5)).covers(1.0, 2).done();
    BundledRules.Run r = BundledRules.run(s);
    BundledRules.assertFired(r, "b2").firesOnce("WATER-WITHOUT-COVERED").doesNotFire("WATER-WITHOUT");
    assertThat(r.one(WithoutWater.class, "b2").valuePerM3())
        .isCloseTo(0.4 * 4 * 10000 / (152.0 * (7 + 58 / 60.0)), within(1e-9));
    assertThat(r.explanation("WATER-WITHOUT-COVERED", "b2")).contains("b2", "well", "1.0 °C", "13.2",
        "Keep its sprinklers off");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.SHORT_OF_WATER);
  }

  @Test
  void anUncoveredBlockThatGoesWithoutIsNotTheCoveredCase() {
    BundledRules.Run r = twoOnAWell(167, 20000, 10000);
    BundledRules.assertFired(r).doesNotFire("WATER-WITHOUT-COVERED");
  }
}
