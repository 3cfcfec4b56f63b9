package org.rimeward.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

/**
 * Sharing a short source. The blocks and sources are invented; every expected number is worked
 * by hand in the comment beside it (1 mm over 1 ha is 10 m³). The principle under test, never
 * below the need, is from the NC State Extension start/stop guide and FAO 2005, ch. 7.
 */
class WaterAllocationTest {
  static final Instant T0 = Instant.parse("2026-04-10T08:00:00Z");
  /** The bundled rule files' terms: need plus 25 %, parts of at least 10 %. */
  static final Terms TERMS = new Terms(25, 10);

  static Demand d(String id, double startH, double stopH, double rateMmH, double needMmH,
      double areaHa, double kill, double value, IrrigationSet... sets) {
    return new Demand(id, T0.plusSeconds((long) (startH * 3600)), T0.plusSeconds((long) (stopH * 3600)),
        rateMmH, needMmH, areaHa, kill, value, List.of(sets));
  }

  @Test
  void aSourceThatCarriesEveryoneRunsEveryoneAtTheInstalledRate() {
    // a: 4.0 × 5 × 10 = 200 m³/h for 6 h; b: 200 m³/h from hour 2. Peak 400, volume 1200 + 800.
    Allocation a = WaterAllocation.allocate(500, 10000, List.of(
        d("a", 0, 6, 4.0, 2.0, 5, 0.5, 20000), d("b", 2, 6, 4.0, 2.0, 5, 0.9, 20000)), TERMS);
    assertThat(a.grants()).extracting(Grant::kind).containsOnly(GrantKind.FULL);
    assertThat(a.peakFlowM3H()).isCloseTo(400, within(1e-9));
    assertThat(a.wantedPeakFlowM3H()).isCloseTo(400, within(1e-9));
    assertThat(a.volumeM3()).isCloseTo(2000, within(1e-9));
    assertThat(a.dropped()).isEmpty();
  }

  @Test
  void theShortBoreProtectsTheCherryBlockAtAReducedRate() {
    // The cherry block: 2.5 ha at 4.0 mm/h wants 100 m³/h; the bore gives 90. The night needs
    // 1.93 mm/h, so the floor is 1.93 × 1.25 = 2.4125 mm/h (60.3 m³/h); the bore's 90 m³/h over
    // 2.5 ha runs it at 90 / 25 = 3.6 mm/h, whole.
    Allocation a = WaterAllocation.allocate(90, Double.NaN,
        List.of(d("cherry", 0, 10, 4.0, 1.93, 2.5, 1.0, 48000)), TERMS);
    Grant g = a.grant("cherry").orElseThrow();
    assertThat(g.kind()).isEqualTo(GrantKind.REDUCED_RATE);
    assertThat(g.rateMmH()).isCloseTo(3.6, within(1e-9));
    assertThat(g.areaHa()).isCloseTo(2.5, within(1e-9));
    assertThat(g.flowM3H()).isCloseTo(90, within(1e-9));
    assertThat(g.floorRateMmH()).isCloseTo(2.4125, within(1e-9));
    assertThat(a.peakFlowM3H()).isCloseTo(90, within(1e-9));
    assertThat(a.wantedPeakFlowM3H()).isCloseTo(100, within(1e-9));
    assertThat(a.served()).containsExactly("cherry");
  }

  @Test
  void twoBlocksOnAPumpThatCarriesOneAndAHalfShareTheSpareAtFullRate() {
    // Each 4 ha at 3.8 mm/h wants 152 m³/h; the pump gives 228 = 1.5 × 152. The need, 3.5 mm/h,
    // plus 25 % is above the installed rate, so neither can run slower: b1 (worth more) runs
    // whole, b2 gets the spare 76 m³/h at the full 3.8 mm/h over 76 / 38 = 2.0 ha.
    Allocation a = WaterAllocation.allocate(228, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 3.5, 4, 0.4, 20000), d("b2", 0, 9, 3.8, 3.5, 4, 0.4, 10000)), TERMS);
    Grant b1 = a.grant("b1").orElseThrow();
    Grant b2 = a.grant("b2").orElseThrow();
    assertThat(b1.kind()).isEqualTo(GrantKind.FULL);
    assertThat(b2.kind()).isEqualTo(GrantKind.PART_AREA);
    assertThat(b2.rateMmH()).isCloseTo(3.8, within(1e-9));
    assertThat(b2.areaHa()).isCloseTo(2.0, within(1e-9));
    assertThat(b2.flowM3H()).isCloseTo(76, within(1e-9));
    assertThat(b2.volumeM3()).isCloseTo(76 * 9, within(1e-9));
    assertThat(a.peakFlowM3H()).isCloseTo(228, within(1e-9));
    assertThat(a.part()).containsExactly("b2");
  }

  @Test
  void whenBothCanRunSlowerBothAreProtectedWhole() {
    // The same pump and blocks on a milder night: need 2.0 mm/h, floor 2.5 mm/h = 100 m³/h each.
    // Both get their floor (200 m³/h); the 28 m³/h left raises b1 to 128 m³/h = 3.2 mm/h.
    Allocation a = WaterAllocation.allocate(228, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 2.0, 4, 0.4, 20000), d("b2", 0, 9, 3.8, 2.0, 4, 0.4, 10000)), TERMS);
    assertThat(a.grant("b1").orElseThrow().rateMmH()).isCloseTo(3.2, within(1e-9));
    assertThat(a.grant("b2").orElseThrow().rateMmH()).isCloseTo(2.5, within(1e-9));
    assertThat(a.served()).containsExactly("b1", "b2");
    assertThat(a.peakFlowM3H()).isCloseTo(228, within(1e-9));
  }

  @Test
  void declaredSetsAreRunWholeOrNotAtAll() {
    // b2 has three sets: s1 1.5 ha (57 m³/h), s2 1.5 ha (57), s3 1.0 ha (38). With 76 m³/h to
    // spare the most area that fits is one 1.5 ha set: s1 + s3 would take 95.
    Allocation a = WaterAllocation.allocate(228, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 3.5, 4, 0.4, 20000),
        d("b2", 0, 9, 3.8, 3.5, 4, 0.4, 10000, new IrrigationSet("s1", 1.5, 57),
            new IrrigationSet("s2", 1.5, 57), new IrrigationSet("s3", 1.0, 38))), TERMS);
    Grant b2 = a.grant("b2").orElseThrow();
    assertThat(b2.kind()).isEqualTo(GrantKind.SETS);
    assertThat(b2.setIds()).containsExactly("s1");
    assertThat(b2.areaHa()).isCloseTo(1.5, within(1e-9));
    assertThat(b2.flowM3H()).isCloseTo(57, within(1e-9));
    assertThat(b2.rateMmH()).isCloseTo(3.8, within(1e-9));
  }

  @Test
  void aSetTooBigForTheSpareLeavesTheBlockDry() {
    // One set of 4 ha (152 m³/h) against 76 m³/h to spare: nothing fits.
    Allocation a = WaterAllocation.allocate(228, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 3.5, 4, 0.4, 20000),
        d("b2", 0, 9, 3.8, 3.5, 4, 0.4, 10000, new IrrigationSet("all", 4, 152))), TERMS);
    assertThat(a.grant("b2").orElseThrow().kind()).isEqualTo(GrantKind.NONE);
    assertThat(a.grant("b2").orElseThrow().spareFlowM3H()).isCloseTo(76, within(1e-9));
    assertThat(a.dropped()).containsExactly("b2");
  }

  @Test
  void aPartSmallerThanTheSmallestWorthProtectingIsNotRun() {
    // 152 + 15 = 167 m³/h: b2 could have 15 / 152 = 9.9 % of its area, under the 10 % floor.
    Allocation a = WaterAllocation.allocate(167, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 3.5, 4, 0.4, 20000), d("b2", 0, 9, 3.8, 3.5, 4, 0.4, 10000)), TERMS);
    assertThat(a.grant("b2").orElseThrow().kind()).isEqualTo(GrantKind.NONE);
    Allocation b = WaterAllocation.allocate(167.3, Double.NaN, List.of(
        d("b1", 0, 9, 3.8, 3.5, 4, 0.4, 20000), d("b2", 0, 9, 3.8, 3.5, 4, 0.4, 10000)), TERMS);
    assertThat(b.grant("b2").orElseThrow().kind()).isEqualTo(GrantKind.PART_AREA);
  }

  @Test
  void flowIsHonouredAtEveryMomentNotJustAtThePeakOfEachBlock() {
    // a runs 0-6 h and b 2-6 h at 4.0 mm/h over 5 ha (200 m³/h); c 3-6 h at 10 mm/h over 2 ha
    // (200 m³/h). Needs are 90 % of the installed rates, so no floor is below installed. Stakes
    // per m³: a 0.5 × 5 × 20000 / 1200 = 41.7; b 0.9 × 5 × 20000 / 800 = 112.5; c 0.9 × 2 × 50000
    // / 600 = 150. Order c, b, a. Against 450:
    // c 200 and b 200 from hour 3 leave 50 for a, which runs from hour 0: a gets 50 m³/h over
    // 50 / 200 = 25 % of its area, at 4.0 mm/h.
    Allocation a = WaterAllocation.allocate(450, Double.NaN, List.of(
        d("a", 0, 6, 4.0, 3.6, 5, 0.5, 20000), d("b", 2, 6, 4.0, 3.6, 5, 0.9, 20000),
        d("c", 3, 6, 10.0, 9.0, 2, 0.9, 50000)), TERMS);
    assertThat(a.grants()).extracting(Grant::blockId).containsExactly("c", "b", "a");
    assertThat(a.grant("a").orElseThrow().flowM3H()).isCloseTo(50, within(1e-9));
    assertThat(a.grant("a").orElseThrow().areaHa()).isCloseTo(1.25, within(1e-9));
    // Hour by hour: 50 from 0 to 2 h, 250 from 2 to 3 h, 450 from 3 to 6 h.
    assertThat(a.draws()).extracting(Allocation.Draw::flowM3H).containsExactly(50.0, 250.0, 450.0);
    assertThat(a.peakFlowM3H()).isCloseTo(450, within(1e-9));
  }

  @Test
  void volumeIsHonouredOverTheNightAndNoRunStopsEarly() {
    // A pond of 1500 m³. b (0.9 kill) first: 200 m³/h × 4 h = 800 m³ at its floor (need 3.6,
    // floor 4.0 = installed). 700 m³ left spread over a's 6 h is 116.7 m³/h: 58 % of a's area.
    Allocation a = WaterAllocation.allocate(1000, 1500, List.of(
        d("a", 0, 6, 4.0, 3.6, 5, 0.5, 20000), d("b", 2, 6, 4.0, 3.6, 5, 0.9, 20000)), TERMS);
    assertThat(a.grant("b").orElseThrow().kind()).isEqualTo(GrantKind.FULL);
    Grant ga = a.grant("a").orElseThrow();
    assertThat(ga.kind()).isEqualTo(GrantKind.PART_AREA);
    assertThat(ga.volumeM3()).isCloseTo(700, within(1e-6));
    assertThat(a.volumeM3()).isCloseTo(1500, within(1e-6));
  }

  @Test
  void aBlockStoppingAsAnotherStartsDoesNotOverlap() {
    Allocation a = WaterAllocation.allocate(200, Double.NaN, List.of(
        d("a", 0, 3, 4.0, 2, 5, 0.5, 1), d("b", 3, 6, 4.0, 2, 5, 0.5, 1)), TERMS);
    assertThat(a.wantedPeakFlowM3H()).isCloseTo(200, within(1e-9));
    assertThat(a.grants()).extracting(Grant::kind).containsOnly(GrantKind.FULL);
  }

  @Test
  void missingCropValuesRankByHectaresSaved() {
    Allocation a = WaterAllocation.allocate(250, Double.NaN, List.of(
        d("a", 0, 6, 4.0, 3.6, 5, 0.5, Double.NaN), d("b", 0, 6, 4.0, 3.6, 5, 0.9, 100)), TERMS);
    assertThat(a.rankedByValue()).isFalse();
    assertThat(a.grants().get(0).blockId()).isEqualTo("b");
    assertThat(a.served()).containsExactly("b");
  }

  /**
   * Property, over seeded random farms: no block runs below its floor or at more than its
   * installed rate, the draw never passes the source's flow at any moment, the water never passes
   * its volume, and a block left dry or in part had less spare than its floor needed.
   */
  @ParameterizedTest
  @ValueSource(longs = {1, 2, 3, 5, 8, 13, 21, 34, 55, 89})
  void neverBelowTheNeedAndNeverAboveTheSource(long seed) {
    Random r = new Random(seed);
    List<Demand> ds = new ArrayList<>();
    int n = 2 + r.nextInt(6);
    for (int i = 0; i < n; i++) {
      double start = r.nextInt(8);
      double rate = 2.5 + r.nextDouble() * 4;
      List<IrrigationSet> sets = new ArrayList<>();
      double area = 1 + r.nextDouble() * 6;
      if (r.nextBoolean()) {
        int k = 1 + r.nextInt(4);
        for (int j = 0; j < k; j++) {
          sets.add(new IrrigationSet("s" + j, area / k, rate * area / k * 10));
        }
      }
      ds.add(d("b" + i, start, start + 2 + r.nextInt(8), rate, rate * (0.3 + r.nextDouble()), area,
          r.nextDouble(), 1000 + r.nextInt(50000), sets.toArray(IrrigationSet[]::new)));
    }
    double maxFlow = 50 + r.nextDouble() * 600;
    double volume = r.nextBoolean() ? Double.NaN : 500 + r.nextDouble() * 8000;
    Allocation a = WaterAllocation.allocate(maxFlow, volume, ds, TERMS);
    for (Grant g : a.grants()) {
      Demand dd = ds.stream().filter(x -> x.blockId().equals(g.blockId())).findFirst().orElseThrow();
      if (g.granted()) {
        double floor = g.areaHa() < dd.areaHa() - 1e-9 ? dd.installedRateMmH() : dd.floorRateMmH(TERMS);
        assertThat(g.rateMmH()).as("%s rate", g.blockId()).isGreaterThanOrEqualTo(floor - 1e-9)
            .isLessThanOrEqualTo(dd.installedRateMmH() + 1e-9);
        assertThat(g.rateMmH()).isGreaterThanOrEqualTo(Math.min(dd.needRateMmH(), dd.installedRateMmH()) - 1e-9);
        assertThat(g.flowM3H()).isCloseTo(g.rateMmH() * g.areaHa() * 10, within(1e-6));
      }
    }
    for (Allocation.Draw x : a.draws()) {
      assertThat(x.flowM3H()).isLessThanOrEqualTo(maxFlow + 1e-6);
    }
    if (!Double.isNaN(volume)) {
      assertThat(a.volumeM3()).isLessThanOrEqualTo(volume + 1e-6);
    }
  }
}
