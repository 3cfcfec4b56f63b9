package org.rimeward.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanJson;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * The season's sums over recorded runs. The runs are the demo night's reviewed plan (invented
 * data) moved to other dates, so each figure can be checked against the plan it came from.
 */
class SeasonTest {
  static String demoJson;
  static PlanDocument demo;

  @BeforeAll
  static void readDemo() throws IOException {
    demoJson = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"));
    demo = PlanJson.read(demoJson);
  }

  static PlanDocument on(LocalDate night) {
    return PlanJson.read(demoJson.replace("\"date\" : \"2026-04-14\"",
        "\"date\" : \"" + night + "\""));
  }

  static Season.Run run(String id, String ranAt, PlanDocument plan) {
    return new Season.Run(id, Instant.parse(ranAt), plan, Map.of());
  }

  @Test
  void totalsAreTheSumOfTheNightsRuns() {
    LocalDate a = LocalDate.of(2026, 4, 14);
    LocalDate b = LocalDate.of(2026, 4, 20);
    Season.Totals s = Season.of("farm", List.of(run("r1", "2026-04-15T02:00:00Z", on(a)),
        run("r2", "2026-04-21T02:00:00Z", on(b))), List.of(), null, null);
    assertThat(s.nights()).extracting(Season.Night::night).containsExactly(a, b);
    PlanDocument.Block cherry = demo.block("hollow-cherry").orElseThrow();
    PlanDocument.Sprinkle sp = cherry.sprinkle().orElseThrow();
    double hours = java.time.Duration.between(sp.start(), sp.stop()).toMinutes() / 60.0;
    Season.BlockTotal t = total(s, "hollow-cherry");
    assertThat(t.nightsPlanned()).isEqualTo(2);
    assertThat(t.nightsAtRisk()).isEqualTo(2);
    assertThat(t.hoursSprinkled()).isCloseTo(2 * hours, within(1e-9));
    assertThat(t.waterM3()).isCloseTo(2 * sp.waterM3(), within(1e-9));
    PlanDocument.Water pond = demo.water().stream().filter(w -> w.source().equals("pond"))
        .findFirst().orElseThrow();
    Season.SourceTotal p = s.sources().stream().filter(x -> x.source().equals("pond"))
        .findFirst().orElseThrow();
    assertThat(p.waterM3()).isCloseTo(2 * pond.volumeM3(), within(1e-9));
    assertThat(p.peakFlowM3H()).isEqualTo(pond.peakFlowM3H());
    assertThat(s.sourceNights()).filteredOn(n -> n.source().equals("pond")).hasSize(2);
    // Two independent nights: a bud survives both with (1 - k)^2.
    double k = cherry.killPctUnprotected() / 100;
    assertThat(t.killUnprotectedPct()).isCloseTo(100 * (1 - (1 - k) * (1 - k)), within(1e-9));
  }

  @Test
  void aNightPlannedTwiceCountsOnceFromItsLatestRun() {
    LocalDate a = LocalDate.of(2026, 4, 14);
    PlanDocument later = PlanJson.read(demoJson.replace("\"volume_m3\" : 3400.0",
        "\"volume_m3\" : 1000.0"));
    Season.Totals s = Season.of("farm", List.of(run("late", "2026-04-15T03:00:00Z", later),
        run("early", "2026-04-15T01:00:00Z", on(a))), List.of(), null, null);
    assertThat(s.nights()).singleElement().extracting(Season.Night::runId).isEqualTo("late");
    assertThat(total(s, "hollow-cherry").nightsPlanned()).isEqualTo(1);
    assertThat(s.sources().stream().filter(x -> x.source().equals("pond")).findFirst()
        .orElseThrow().waterM3()).isEqualTo(1000.0);
  }

  @Test
  void aBlockWithNoRunsHasARowOfZeros() {
    Season.Totals s = Season.of("farm", List.of(run("r1", "2026-04-15T02:00:00Z", demo)),
        List.of(new Season.FarmBlock("new-planting", 1.2, 30000.0)), null, null);
    Season.BlockTotal t = total(s, "new-planting");
    assertThat(t.nightsPlanned()).isZero();
    assertThat(t.nightsAtRisk()).isZero();
    assertThat(t.hoursSprinkled()).isZero();
    assertThat(t.waterM3()).isZero();
    assertThat(t.lossAvoided()).isZero();
    assertThat(SeasonReport.csv(s, UnitFormat.of(UnitSystem.METRIC)))
        .contains("block,new-planting,,0,0,0,0.00,,0.0,,0,0.0,0.0,0");
  }

  @Test
  void nightsOutsideFromAndToAreLeftOut() {
    Season.Totals s = Season.of("farm", List.of(
        run("r1", "2026-04-15T02:00:00Z", on(LocalDate.of(2026, 4, 14))),
        run("r2", "2026-05-02T02:00:00Z", on(LocalDate.of(2026, 5, 1)))), List.of(),
        LocalDate.of(2026, 4, 20), null);
    assertThat(s.nights()).extracting(Season.Night::runId).containsExactly("r2");
  }

  @Test
  void lossAvoidedIsTheCropValueOfTheKillThePlanPrevents() {
    Season.Totals s = Season.of("farm", List.of(run("r1", "2026-04-15T02:00:00Z", demo)),
        List.of(new Season.FarmBlock("hollow-cherry", 3.2, 48000.0)), null, null);
    PlanDocument.Block cherry = demo.block("hollow-cherry").orElseThrow();
    Season.BlockTotal t = total(s, "hollow-cherry");
    // Protected whole: the plan holds buds at or above the target, taken as no kill.
    double expectedWithPlan = cherry.status().equals("protected") ? 0 : cherry.killPctUnprotected();
    assertThat(t.killWithPlanPct()).isCloseTo(expectedWithPlan, within(1e-9));
    assertThat(t.lossAvoided()).isCloseTo(48000.0 * 3.2
        * (cherry.killPctUnprotected() - expectedWithPlan) / 100, within(1e-6));
  }

  @Test
  void usUnitsNameTheirColumnsInGallons() {
    Season.Totals s = Season.of("farm", List.of(run("r1", "2026-04-15T02:00:00Z", demo)),
        List.of(), null, null);
    String csv = SeasonReport.csv(s, UnitFormat.of(UnitSystem.US));
    assertThat(csv.lines().findFirst().orElseThrow()).contains("water_gal", "peak_flow_gpm",
        "hours_sprinkled", "nights_at_risk");
    assertThat(SeasonReport.csv(s, UnitFormat.of(UnitSystem.METRIC)).lines().findFirst()
        .orElseThrow()).contains("water_m3", "peak_flow_m3_h");
  }

  private static Season.BlockTotal total(Season.Totals s, String id) {
    return s.blocks().stream().filter(b -> b.block().equals(id)).findFirst().orElseThrow();
  }
}
