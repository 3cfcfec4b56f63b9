package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Random;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rimeward.rules.facts.BlockFact;
import org.rimeward.rules.facts.BlockStatus;
import org.rimeward.rules.facts.CoverPlan;
import org.rimeward.rules.facts.NeedsProtection;
import org.rimeward.rules.facts.NearMiss;
import org.rimeward.rules.facts.PartProtection;
import org.rimeward.rules.facts.SprinklingNotAdvised;
import org.rimeward.rules.facts.SprinklePlan;
import org.rimeward.rules.facts.Status;
import org.rimeward.rules.facts.WithoutWater;

/** rules/status/status.drl: one status per block, from what the other rules decided. */
class StatusRulesTest {
  static BundledRules.Run oneBlock(java.util.function.UnaryOperator<Scenario.BlockBuilder> setUp,
      double[] air, double[] wet) {
    Scenario s = new Scenario().source("pond", 500, 5000);
    setUp.apply(s.block("b1").kill(40)).hourly(air, wet).done();
    return BundledRules.run(s);
  }

  static BundledRules.Run coldest(double minDryBudC, java.util.function.UnaryOperator<Scenario.BlockBuilder> setUp) {
    // Depression 0: the coldest dry bud is the coldest air.
    double[] air = Scenario.coldestAt0200(minDryBudC);
    return oneBlock(b -> setUp.apply(b.depression(0)), air, Scenario.minus(air, 1.0));
  }

  static BundledRules.Run requiredAt0300(double peakMmH) {
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 9, peakMmH);
    return oneBlock(b -> b.sprinklers(3.8, "pond").rate(rate), Scenario.FROST_AIR, Scenario.FROST_WET);
  }

  static Status status(BundledRules.Run r) {
    return r.one(BlockStatus.class, "b1").status();
  }

  @Test
  void notNeededJustBeyondTheWatchBand() {
    // Target -2.2 °C plus the 1.5 °C watch band is -0.7 °C; -0.65 °C is beyond it.
    BundledRules.Run r = coldest(-0.65, b -> b);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-NOT-NEEDED").doesNotFire("STATUS-WATCH");
    assertThat(status(r)).isEqualTo(Status.NOT_NEEDED);
    assertThat(r.explanation("STATUS-NOT-NEEDED", "b1")).contains("b1", "no protection needed");
  }

  @Test
  void neededAtTheTarget() {
    BundledRules.Run r = coldest(-2.2, b -> b);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-NOT-NEEDED", "STATUS-WATCH");
  }

  @Test
  void watchJustAboveTheTarget() {
    BundledRules.Run r = coldest(-2.15, b -> b);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-WATCH").doesNotFire("STATUS-NOT-NEEDED");
    assertThat(status(r)).isEqualTo(Status.WATCH);
    assertThat(r.explanation("STATUS-WATCH", "b1")).contains("b1", "0.1 °C", "watch");
  }

  @Test
  void watchInsideTheBandNotBeyond() {
    assertThat(status(coldest(-0.75, b -> b))).isEqualTo(Status.WATCH);
    BundledRules.assertFired(coldest(-0.65, b -> b), "b1").doesNotFire("STATUS-WATCH");
  }

  @Test
  void protectedByCoversThatAreEnough() {
    // -4.0 + 2.6 = -1.4 °C under covers, above -2.2 °C by more than the 0.5 °C cover margin.
    BundledRules.Run r = coldest(-4.0, b -> b.covers(2.6, 2));
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-PROTECTED-BY-COVERS");
    assertThat(status(r)).isEqualTo(Status.PROTECTED);
  }

  @Test
  void notProtectedByCoversThatAreNotEnough() {
    // -4.25 + 2.0 = -2.25 °C: covers alone fail, and the block has nothing else.
    BundledRules.Run r = coldest(-4.25, b -> b.covers(2.0, 2));
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-PROTECTED-BY-COVERS").fires("STATUS-UNPROTECTED");
  }

  @Test
  void protectedBySprinklingWhenTheRateIsExactlyWhatTheNightNeeds() {
    BundledRules.Run r = requiredAt0300(3.8);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-PROTECTED-BY-SPRINKLING");
    assertThat(status(r)).isEqualTo(Status.PROTECTED);
    assertThat(r.explanation("STATUS-PROTECTED-BY-SPRINKLING", "b1")).contains("22:42", "07:40");
  }

  @Test
  void notProtectedBySprinklingWhenTheRateIsJustShort() {
    BundledRules.Run r = requiredAt0300(3.81);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-PROTECTED-BY-SPRINKLING");
  }

  @Test
  void notAdvisedWhenTheRateIsJustShort() {
    BundledRules.Run r = requiredAt0300(3.81);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-NOT-ADVISED")
        .doesNotFire("STATUS-SHORT-OF-WATER", "STATUS-UNPROTECTED");
    assertThat(status(r)).isEqualTo(Status.NOT_ADVISED);
    assertThat(r.explanation("STATUS-NOT-ADVISED", "b1")).contains("not advised", "40 %");
  }

  @Test
  void notNotAdvisedAtEquality() {
    BundledRules.Run r = requiredAt0300(3.8);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-NOT-ADVISED");
  }

  /**
   * 3.8 mm/h on 4 ha draws 152 m³/h; the least part the water rules grant is a tenth of the
   * block at that rate, 15.2 m³/h, so a source of 15 m³/h leaves it out.
   */
  static BundledRules.Run onSource(double maxFlowM3H) {
    Scenario s = new Scenario().source("pond", maxFlowM3H, 50000);
    s.block("b1").kill(40).sprinklers(3.8, "pond").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done();
    return BundledRules.run(s);
  }

  @Test
  void shortOfWaterWhenTheSourceCannotCarryTheBlock() {
    BundledRules.Run r = onSource(15);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-SHORT-OF-WATER");
    assertThat(status(r)).isEqualTo(Status.SHORT_OF_WATER);
  }

  @Test
  void notShortOfWaterWhenTheSourceJustCarriesIt() {
    BundledRules.Run r = onSource(152);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-SHORT-OF-WATER").fires("STATUS-PROTECTED-BY-SPRINKLING");
  }

  @Test
  void unprotectedWithNothingOnTheBlock() {
    BundledRules.Run r = oneBlock(b -> b, Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").firesOnce("STATUS-UNPROTECTED");
    assertThat(status(r)).isEqualTo(Status.UNPROTECTED);
    assertThat(r.explanation("STATUS-UNPROTECTED", "b1")).contains("b1", "40 %");
  }

  @Test
  void notAdvisedNotUnprotectedWhenWindRulesSprinklingOut() {
    // 4.51 m/s at 10 m at 03:00 (air -3 °C): above 10 mph, no sprinkling alone (Virginia Tech
    // guidance). The block has sprinklers, so it is not left quiet as "unprotected".
    double[] wind = Scenario.with(Scenario.fill(16, 1.0), 9, 4.51);
    BundledRules.Run r = oneBlock(b -> b.sprinklers(3.8, "pond").wind(wind), Scenario.FROST_AIR, Scenario.FROST_WET);
    assertThat(status(r)).isEqualTo(Status.NOT_ADVISED);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-UNPROTECTED");
  }

  @Test
  void notUnprotectedWithSprinklers() {
    BundledRules.Run r = oneBlock(b -> b.sprinklers(3.8, "pond"), Scenario.FROST_AIR, Scenario.FROST_WET);
    BundledRules.assertFired(r, "b1").doesNotFire("STATUS-UNPROTECTED");
  }

  @Test
  void sixBlocksOneStatusEach() {
    double[] rate = Scenario.with(Scenario.fill(16, 2.0), 9, 4.0);
    double[] cold = Scenario.coldestAt0200(-4.0);
    Scenario s = new Scenario().source("pond", 1000, 50000)
        .block("warm").depression(0).hourly(Scenario.coldestAt0200(0.0), Scenario.coldestAt0200(-1.0)).done()
        .block("covered").depression(0).covers(2.6, 2).hourly(cold, Scenario.minus(cold, 1.0)).done()
        .block("sprinkled").sprinklers(3.8, "pond").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done()
        .block("thin").sprinklers(3.8, "pond").rate(rate).hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done()
        .block("bare").hourly(Scenario.FROST_AIR, Scenario.FROST_WET).done()
        .block("close").depression(0).hourly(Scenario.coldestAt0200(-2.0), Scenario.coldestAt0200(-3.0)).done();
    BundledRules.Run r = BundledRules.run(s);
    assertThat(r.one(BlockStatus.class, "warm").status()).isEqualTo(Status.NOT_NEEDED);
    assertThat(r.one(BlockStatus.class, "covered").status()).isEqualTo(Status.PROTECTED);
    assertThat(r.one(BlockStatus.class, "sprinkled").status()).isEqualTo(Status.PROTECTED);
    assertThat(r.one(BlockStatus.class, "thin").status()).isEqualTo(Status.NOT_ADVISED);
    assertThat(r.one(BlockStatus.class, "bare").status()).isEqualTo(Status.UNPROTECTED);
    assertThat(r.one(BlockStatus.class, "close").status()).isEqualTo(Status.WATCH);
    assertThat(r.all(BlockStatus.class)).hasSize(6);
  }

  static List<Long> seeds() {
    return IntStream.rangeClosed(1, 25).mapToObj(i -> 7919L * i).toList();
  }

  /**
   * Property: whatever the mix of blocks, every block gets exactly one status, and the status
   * agrees with the facts behind it. Seeded random farms of four blocks on two sources.
   */
  @ParameterizedTest
  @MethodSource("seeds")
  void everyBlockGetsExactlyOneConsistentStatus(long seed) {
    Random rnd = new Random(seed);
    Scenario s = new Scenario().source("pond", 100 + rnd.nextDouble() * 400, 500 + rnd.nextDouble() * 5000)
        .source("well", 100 + rnd.nextDouble() * 400, Double.NaN);
    for (int i = 0; i < 4; i++) {
      double shift = -2 + rnd.nextDouble() * 6;
      double[] air = java.util.Arrays.stream(Scenario.FROST_AIR).map(a -> a + shift).toArray();
      double[] wet = java.util.Arrays.stream(Scenario.FROST_WET).map(a -> a + shift).toArray();
      Scenario.BlockBuilder b = s.block("b" + i).kill(rnd.nextInt(101)).area(0.5 + rnd.nextDouble() * 8)
          .depression(rnd.nextDouble() * 2)
          .wind(Scenario.with(Scenario.fill(16, 1.0), 9, rnd.nextDouble() * 6))
          .rate(Scenario.with(Scenario.fill(16, 2.0), 10, 1 + rnd.nextDouble() * 4));
      if (rnd.nextBoolean()) {
        b.sprinklers(2 + rnd.nextDouble() * 3, rnd.nextBoolean() ? "pond" : "well");
      }
      if (rnd.nextBoolean()) {
        b.covers(0.5 + rnd.nextDouble() * 3, 1 + rnd.nextDouble() * 2);
      }
      if (rnd.nextBoolean()) {
        b.value(1000 + rnd.nextDouble() * 30000);
      }
      b.hourly(air, wet).done();
    }
    BundledRules.Run r = BundledRules.run(s);
    for (BlockFact b : r.all(BlockFact.class)) {
      String id = b.blockId();
      List<BlockStatus> st = r.about(BlockStatus.class, id);
      assertThat(st).as("seed %d block %s: %s", seed, id, r.firedFor(id)).hasSize(1);
      Status status = st.get(0).status();
      boolean needs = !r.about(NeedsProtection.class, id).isEmpty();
      boolean coversEnough = r.about(CoverPlan.class, id).stream().anyMatch(CoverPlan::sufficient);
      boolean plan = !r.about(SprinklePlan.class, id).isEmpty();
      boolean nearMiss = !r.about(NearMiss.class, id).isEmpty();
      boolean notAdvised = !r.about(SprinklingNotAdvised.class, id).isEmpty();
      boolean without = !r.about(WithoutWater.class, id).isEmpty();
      boolean part = !r.about(PartProtection.class, id).isEmpty();
      Status expected = !needs ? (nearMiss ? Status.WATCH : Status.NOT_NEEDED)
          : coversEnough ? Status.PROTECTED
          : notAdvised ? Status.NOT_ADVISED
          : !plan ? Status.UNPROTECTED
          : without ? Status.SHORT_OF_WATER
          : part ? Status.PARTLY_PROTECTED : Status.PROTECTED;
      assertThat(status).as("seed %d block %s", seed, id).isEqualTo(expected);
    }
  }
}
