package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.rimeward.rules.facts.BlockStatus;
import org.rimeward.rules.facts.Status;
import org.rimeward.rules.facts.WaterBalance;
import org.rimeward.rules.facts.WithoutWater;

/**
 * rules/water/budget.drl. Sprinkled blocks of 4 ha at 3.8 mm/h on the frost night: each draws
 * 3.8 × 4 × 10 = 152 m³/h from 22:42 to 07:40 (8 h 58 min), 1362.93 m³ in all. Invented farm.
 */
class WaterRulesTest {
  static final double ONE_NIGHT_M3 = 152.0 * (8 + 58 / 60.0);

  static Scenario.BlockBuilder sprinkled(Scenario s, String id, String source) {
    return s.block(id).sprinklers(3.8, source).kill(40).hourly(Scenario.FROST_AIR, Scenario.FROST_WET);
  }

  /** Two blocks on one well running at the same time, each with its crop value per ha. */
  static BundledRules.Run twoOnAWell(double maxFlowM3H, double valueB1, double valueB2) {
    Scenario s = new Scenario().source("well", maxFlowM3H, Double.NaN);
    sprinkled(s, "b1", "well").value(valueB1).done();
    sprinkled(s, "b2", "well").value(valueB2).done();
    return BundledRules.run(s);
  }

  static WaterBalance balance(BundledRules.Run r, String sourceId) {
    return r.all(WaterBalance.class).stream().filter(w -> w.sourceId().equals(sourceId))
        .findFirst().orElseThrow();
  }

  @Test
  void budgetAddsUpWhatTheBlocksDraw() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 5000), "b1", "pond").done());
    FiredRule f = r.firing("WATER-BUDGET");
    assertThat(f.sourceId()).isEqualTo("pond");
    WaterBalance w = balance(r, "pond");
    assertThat(w.peakFlowM3H()).isCloseTo(152.0, within(1e-9));
    assertThat(w.volumeM3()).isCloseTo(ONE_NIGHT_M3, within(1e-6));
    assertThat(w.shortOfWater()).isFalse();
    assertThat(f.explanation()).contains("pond", "152 m3/h", "500 m3/h", "1363 m3", "5000 m3");
    assertThat(r.fired()).doesNotContain("WATER-SHORT");
  }

  @Test
  void noBudgetForASourceNoPlanDrawsOn() {
    double[] warm = Scenario.fill(16, 5.0);
    BundledRules.Run r = BundledRules.run(new Scenario().source("pond", 500, 5000)
        .block("b1").sprinklers(3.8, "pond").hourly(warm, warm).done());
    assertThat(r.fired()).doesNotContain("WATER-BUDGET");
    assertThat(r.all(WaterBalance.class)).isEmpty();
  }

  @Test
  void aWellWithoutAVolumeLimitSaysSo() {
    BundledRules.Run r = twoOnAWell(500, 1, 1);
    assertThat(r.firing("WATER-BUDGET").explanation()).contains("304 m3/h", "no limit");
  }

  @Test
  void shortOnFlowWhenTwoBlocksAtOnceDrawMoreThanTheSourceGives() {
    // 152 + 152 = 304 m³/h at once against 303.99.
    BundledRules.Run r = twoOnAWell(303.99, 20000, 10000);
    FiredRule f = r.firing("WATER-SHORT");
    WaterBalance w = balance(r, "well");
    assertThat(w.flowShort()).isTrue();
    assertThat(w.volumeShort()).isFalse();
    assertThat(w.allocation().served()).containsExactly("b1");
    assertThat(w.allocation().dropped()).containsExactly("b2");
    assertThat(f.explanation()).contains("well", "crop value saved per m³", "serves b1", "leaves b2",
        "152 m3/h", "1363 m3");
  }

  @Test
  void notShortOnFlowAtEquality() {
    BundledRules.Run r = twoOnAWell(304, 20000, 10000);
    assertThat(r.fired()).contains("WATER-BUDGET").doesNotContain("WATER-SHORT", "WATER-WITHOUT");
    assertThat(balance(r, "well").shortOfWater()).isFalse();
  }

  @Test
  void shortOnVolumeAlone() {
    // Flow is ample (500 m³/h); the pond holds 1362.9 m³ against the 1362.93 the night needs.
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 1362.9), "b1", "pond").done());
    r.firing("WATER-SHORT");
    WaterBalance w = balance(r, "pond");
    assertThat(w.volumeShort()).isTrue();
    assertThat(w.flowShort()).isFalse();
    assertThat(r.explanation("WATER-WITHOUT", "b1")).contains("b1", "pond", "40 %");
  }

  @Test
  void notShortOnVolumeWithJustEnough() {
    BundledRules.Run r = BundledRules.run(sprinkled(new Scenario().source("pond", 500, 1363.0), "b1", "pond").done());
    assertThat(r.fired()).doesNotContain("WATER-SHORT", "WATER-WITHOUT");
  }

  @Test
  void theBlockWithLessValuePerCubicMetreGoesWithout() {
    BundledRules.Run r = twoOnAWell(200, 20000, 10000);
    assertThat(r.firedFor("b2")).containsOnlyOnce("WATER-WITHOUT").doesNotContain("WATER-WITHOUT-COVERED");
    assertThat(r.firedFor("b1")).doesNotContain("WATER-WITHOUT");
    // Stake per m³ = kill fraction × area × value per ha / water = 0.4 × 4 × 10000 / 1362.93 = 11.7.
    WithoutWater w = r.one(WithoutWater.class, "b2");
    assertThat(w.sourceId()).isEqualTo("well");
    assertThat(w.valuePerM3()).isCloseTo(0.4 * 4 * 10000 / ONE_NIGHT_M3, within(1e-9));
    assertThat(r.explanation("WATER-WITHOUT", "b2"))
        .contains("b2", "well", "11.7 crop value saved per m³", "40 %")
        .doesNotContain(" m3 crop");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.SHORT_OF_WATER);
    assertThat(r.one(BlockStatus.class, "b1").status()).isEqualTo(Status.PROTECTED);
  }

  @Test
  void nobodyGoesWithoutWhenTheSourceCarriesAll() {
    BundledRules.Run r = twoOnAWell(304, 20000, 10000);
    assertThat(r.all(WithoutWater.class)).isEmpty();
  }

  @Test
  void withoutAValueEverywhereBlocksAreRankedByHectaresSaved() {
    // b1 has a crop value, b2 none: ranked by area. Stake = kill × ha / m³: b1 0.4 × 4 / 1362.93
    // = 0.00117, b2 (kill 60 %) 0.6 × 4 / 1362.93 = 0.00176. b1 goes without despite its value.
    Scenario s = new Scenario().source("well", 200, Double.NaN);
    sprinkled(s, "b1", "well").value(20000).done();
    sprinkled(s, "b2", "well").kill(60).done();
    BundledRules.Run r = BundledRules.run(s);
    WaterBalance w = balance(r, "well");
    assertThat(w.allocation().rankedByValue()).isFalse();
    assertThat(w.allocation().dropped()).containsExactly("b1");
    assertThat(r.explanation("WATER-WITHOUT", "b1")).contains("0.00117 hectares of buds saved per m³");
  }

  @Test
  void aCoveredBlockThatGoesWithoutKeepsItsCovers() {
    // b2 has 1 °C of cover: -5.0 + 1.0 = -4.0 °C, not enough alone, so it is sprinkled over the
    // covers from 23:42 to 07:40 (1210.9 m³) and, at 10000 per ha, has the smaller stake.
    Scenario s = new Scenario().source("well", 200, Double.NaN);
    sprinkled(s, "b1", "well").value(20000).done();
    sprinkled(s, "b2", "well").value(10000).covers(1.0, 2).done();
    BundledRules.Run r = BundledRules.run(s);
    assertThat(r.firedFor("b2")).containsOnlyOnce("WATER-WITHOUT-COVERED").doesNotContain("WATER-WITHOUT");
    assertThat(r.one(WithoutWater.class, "b2").valuePerM3())
        .isCloseTo(0.4 * 4 * 10000 / (152.0 * (7 + 58 / 60.0)), within(1e-9));
    assertThat(r.explanation("WATER-WITHOUT-COVERED", "b2")).contains("b2", "well", "1.0 °C", "13.2");
    assertThat(r.one(BlockStatus.class, "b2").status()).isEqualTo(Status.SHORT_OF_WATER);
  }

  @Test
  void anUncoveredBlockThatGoesWithoutIsNotTheCoveredCase() {
    BundledRules.Run r = twoOnAWell(200, 20000, 10000);
    assertThat(r.fired()).doesNotContain("WATER-WITHOUT-COVERED");
  }
}
