package org.rimeward.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;

class WaterAllocationTest {
  static final Instant T0 = Instant.parse("2026-04-10T08:00:00Z");

  static Demand d(String id, int startH, int stopH, double flow, double kill, double area, double value) {
    Instant s = T0.plusSeconds(startH * 3600L);
    Instant e = T0.plusSeconds(stopH * 3600L);
    return new Demand(id, s, e, flow, flow * (stopH - startH), kill, area, value);
  }

  @Test
  void aSourceThatCarriesEveryoneServesEveryone() {
    Allocation a = WaterAllocation.allocate(500, 10000,
        List.of(d("a", 0, 6, 200, 0.5, 5, 20000), d("b", 2, 6, 200, 0.9, 5, 20000)));
    // Hand arithmetic: peak 200 + 200 = 400 m3/h from hour 2; volume 6*200 + 4*200 = 2000 m3.
    assertThat(a.peakFlowM3H()).isCloseTo(400, within(1e-9));
    assertThat(a.volumeM3()).isCloseTo(2000, within(1e-9));
    assertThat(a.dropped()).isEmpty();
  }

  @Test
  void flowShortServesTheHighestLossPerCubicMetreFirst() {
    // a: 0.5*5*20000/1200 = 41.7 per m3; b: 0.9*5*20000/800 = 112.5 per m3; c: 0.9*2*50000/600 = 150.
    Allocation a = WaterAllocation.allocate(450, Double.NaN, List.of(
        d("a", 0, 6, 200, 0.5, 5, 20000), d("b", 2, 6, 200, 0.9, 5, 20000), d("c", 3, 6, 200, 0.9, 2, 50000)));
    assertThat(a.rankedByValue()).isTrue();
    assertThat(a.ranking()).extracting(Allocation.Ranked::blockId).containsExactly("c", "b", "a");
    assertThat(a.served()).containsExactly("b", "c");
    assertThat(a.dropped()).containsExactly("a");
    assertThat(a.servedPeakFlowM3H()).isCloseTo(400, within(1e-9));
  }

  @Test
  void volumeShortDropsWhatNoLongerFits() {
    Allocation a = WaterAllocation.allocate(1000, 1500,
        List.of(d("a", 0, 6, 200, 0.5, 5, 20000), d("b", 2, 6, 200, 0.9, 5, 20000)));
    assertThat(a.served()).containsExactly("b");
    assertThat(a.servedVolumeM3()).isCloseTo(800, within(1e-9));
  }

  @Test
  void aBlockStoppingAsAnotherStartsDoesNotOverlap() {
    Allocation a = WaterAllocation.allocate(200, Double.NaN,
        List.of(d("a", 0, 3, 200, 0.5, 5, 1), d("b", 3, 6, 200, 0.5, 5, 1)));
    assertThat(a.peakFlowM3H()).isCloseTo(200, within(1e-9));
    assertThat(a.dropped()).isEmpty();
  }

  @Test
  void missingCropValuesRankByHectaresSaved() {
    Allocation a = WaterAllocation.allocate(250, Double.NaN,
        List.of(d("a", 0, 6, 200, 0.5, 5, Double.NaN), d("b", 0, 6, 200, 0.9, 5, 100)));
    assertThat(a.rankedByValue()).isFalse();
    assertThat(a.served()).containsExactly("b");
  }
}
