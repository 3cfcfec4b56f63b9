package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.BudTemperature;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.physics.Wind;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.facts.RiskLevel;
import org.rimeward.rules.facts.Status;

class NightPlannerTest {
  static final ZoneId LA = ZoneId.of("America/Los_Angeles");
  @TempDir Path tmp;

  static final String APPLE_BLOCK = """
        - id: test-apple
          crop: apple
          stage: full-bloom
          area: 2.0 ha
          sprinklers:
            rate: 3.8 mm/h
            source: pond
      """;

  /**
   * A start and a stop worked by hand. The rows pair air and dew point from docs/reference/check-values.md's
   * psychrometric table (§5.5, WMO ventilated psychrometer at 101.325 kPa, COMPUTED there):
   * 0 °C / Td −3.04 → Tw −1.12; −2 °C / Td −6.74 → Tw −3.54; 2 °C / Td −4.96 → Tw −0.50;
   * 5 °C / Td −4.57 → Tw +1.39. Overcast and a steady breeze keep the bud's radiative depression
   * small and the same at both bracketing steps.
   */
  @Test
  void startAndStopWorkedByHand() {
    // 20:00 … 12:00 next day, PDT. Index 3 = 23:00 (0 °C), 4 = 00:00 (−2 °C), 12 = 08:00, 13 = 09:00.
    double[] air = {6, 4, 2, 0, -2, -2.5, -3, -3, -3, -3, -3, -1, 2, 5, 7, 8, 9};
    double[] dew = {-2, -2.5, -2.8, -3.04, -6.74, -7, -7, -7, -7, -7, -7, -6, -4.96, -4.57, -4.5, -4.5, -4.5};
    int n = air.length;
    // At 3 m/s (6.7 mph) reported wind and −3 °C the wind-band tables ask 0.14–0.30 in/h
    // (3.6–7.6 mm/h; UF/IFAS Circ. 287, docs/reference/sprinkling-rates.md) and the sprinkler
    // balance about 7 mm/h, so this block carries 10 mm/h and is protected.
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK.replace("rate: 3.8 mm/h", "rate: 10 mm/h"),
        Forecasts.hourly("2026-04-14", 20, "-07:00", air, dew, Forecasts.fill(n, 3.0),
            Forecasts.fill(n, 100)));
    TestFarms.replace(farm.resolve("farm.yaml"), "blocks:", """
        policy:
          target: -3.0C
          start_margin: 1.0C
        blocks:""");
    Plan plan = TestFarms.plan(farm);
    BlockPlan b = plan.blocks().get(0);
    Action.Sprinkle s = b.sprinkle().orElseThrow();

    double p = Atmosphere.stationPressureKPa(0);
    double wind2m = Wind.at2mMs(3.0, 10.0);
    double twA = Psychrometrics.wetBulbC(0, -3.04, p);
    double twB = Psychrometrics.wetBulbC(-2, -6.74, p);
    assertThat(twA).as("Tw at 0 °C, Td −3.04 (reference §5.5)").isCloseTo(-1.12, within(0.1));
    assertThat(twB).as("Tw at −2 °C, Td −6.74 (reference §5.5)").isCloseTo(-3.54, within(0.1));
    double budA = twA - BudTemperature.estimate(0, -3.04, wind2m, 100).depressionC();
    double budB = twB - BudTemperature.estimate(-2, -6.74, wind2m, 100).depressionC();
    // Threshold = target −3.0 + margin 1.0 = −2.0 °C. Linear between 23:00 and 00:00:
    // With a depression of about 0.1 °C: budA ≈ −1.22, budB ≈ −3.64, so
    // fraction = (budA − (−2.0)) / (budA − budB) ≈ 0.78 / 2.42 = 0.32 of an hour, ≈ 23:19.
    double fraction = (budA - (-2.0)) / (budA - budB);
    Instant expectedStart = ZonedDateTime.of(2026, 4, 14, 23, 0, 0, 0, LA).toInstant()
        .plusSeconds(Math.round(fraction * 3600)).truncatedTo(java.time.temporal.ChronoUnit.MINUTES);
    assertThat(fraction).isBetween(0.28, 0.37);
    assertThat(s.start()).isEqualTo(expectedStart);

    // Stop: the first moment after sunrise (about 06:10) from which the wet bulb stays ≥ 0 °C.
    // Between 08:00 (Tw −0.50) and 09:00 (Tw +1.39): 0.50 / 1.89 = 0.26 h ≈ 08:16, rounded up.
    double twC = Psychrometrics.wetBulbC(2, -4.96, p);
    double twD = Psychrometrics.wetBulbC(5, -4.57, p);
    assertThat(twC).as("Tw at 2 °C, Td −4.96 (reference §5.5)").isCloseTo(-0.50, within(0.1));
    assertThat(twD).as("Tw at 5 °C, Td −4.57 (reference §5.5)").isCloseTo(1.39, within(0.1));
    long stopSeconds = Math.round(-twC / (twD - twC) * 3600);
    Instant stopExact = ZonedDateTime.of(2026, 4, 15, 8, 0, 0, 0, LA).toInstant().plusSeconds(stopSeconds);
    Instant expectedStop = stopExact.truncatedTo(java.time.temporal.ChronoUnit.MINUTES)
        .plusSeconds(stopExact.getEpochSecond() % 60 == 0 ? 0 : 60);
    assertThat(s.stop()).isEqualTo(expectedStop);
    // From the reference's rounded wet bulbs alone: 0.50 / 1.89 h = 15.9 min → 08:16; the engine's
    // own wet bulbs differ in the third digit, so allow one minute.
    Instant byHand = ZonedDateTime.of(2026, 4, 15, 8, 16, 0, 0, LA).toInstant();
    assertThat(java.time.Duration.between(byHand, s.stop()).abs()).isLessThanOrEqualTo(java.time.Duration.ofMinutes(1));

    // Water: 10 mm/h over 2 ha is 200 m³/h (1 mm on 1 ha = 10 m³), for the whole window.
    double hours = (s.stop().getEpochSecond() - s.start().getEpochSecond()) / 3600.0;
    assertThat(s.flowM3H()).isCloseTo(200.0, within(1e-9));
    assertThat(s.waterM3()).isCloseTo(200.0 * hours, within(1e-6));
    assertThat(b.status()).isEqualTo(Status.PROTECTED);
  }

  @Test
  void aNightThatNeverFreezesNeedsNothing() {
    double[] air = {12, 11, 10, 9, 8, 7, 6, 6, 5, 5, 5, 6, 8, 10, 12, 14, 15};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK, Forecasts.hourly("2026-04-14", 20, "-07:00",
        air, Forecasts.fill(n, 2.0), Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    Plan plan = TestFarms.plan(farm);
    BlockPlan b = plan.blocks().get(0);
    assertThat(b.status()).isEqualTo(Status.NOT_NEEDED);
    assertThat(b.risk()).isEqualTo(RiskLevel.NONE);
    assertThat(b.actions()).isEmpty();
    assertThat(plan.actionNeeded()).isFalse();
    assertThat(b.rules()).extracting(FiredRule::ruleId).contains("RISK-NONE", "STATUS-NOT-NEEDED")
        .doesNotContain("NEEDS-PROTECTION", "SPRINKLE-START");
    assertThat(plan.cautions()).containsAll(StandingCautions.ALL);
  }

  @Test
  void aForecastThatStartsBelowTheThresholdStartsAtOnce() {
    // A late run: the forecast starts at 02:00 with the air already at −3 °C.
    double[] air = {-3, -3.5, -4, -4, -2, 1, 4, 6, 8, 9, 10};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK, Forecasts.hourly("2026-04-15", 2, "-07:00",
        air, Forecasts.fill(n, -7.0), Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    Plan plan = TestFarms.plan(farm);
    assertThat(plan.night().date()).hasToString("2026-04-14");
    BlockPlan b = plan.blocks().get(0);
    Action.Sprinkle s = b.sprinkle().orElseThrow();
    assertThat(s.startsAtOnce()).isTrue();
    assertThat(s.start()).isEqualTo(plan.night().forecastStart());
    assertThat(b.rules()).extracting(FiredRule::ruleId)
        .contains("SPRINKLE-START-AT-ONCE", "CAUTION-START-AT-ONCE").doesNotContain("SPRINKLE-START");
  }

  @Test
  void aDaylightSavingNightKeepsTimesRight() {
    // US clocks go forward at 02:00 on 2026-03-08: local rows 01:00 then 03:00 are one hour apart.
    StringBuilder csv = new StringBuilder("time,air_temp_c,dew_point_c,wind_mph,cloud_pct\n");
    String[] times = {"2026-03-07 17:00", "2026-03-07 18:00", "2026-03-07 19:00", "2026-03-07 20:00",
        "2026-03-07 21:00", "2026-03-07 22:00", "2026-03-07 23:00", "2026-03-08 00:00",
        "2026-03-08 01:00", "2026-03-08 03:00", "2026-03-08 04:00", "2026-03-08 05:00",
        "2026-03-08 06:00", "2026-03-08 07:00", "2026-03-08 08:00", "2026-03-08 09:00",
        "2026-03-08 10:00", "2026-03-08 11:00", "2026-03-08 12:00"};
    double[] air = {8, 6, 4, 3, 2, 1, 0, -1, -2, -3, -3.5, -4, -4, -3.5, -1, 2, 5, 7, 9};
    for (int i = 0; i < times.length; i++) {
      csv.append(times[i]).append(',').append(air[i]).append(",-6,2,0\n");
    }
    // 10 mm/h, above what the night needs, so that sprinkling is advised and planned.
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK.replace("full-bloom", "tight-cluster")
        .replace("3.8 mm/h", "10 mm/h"), csv.toString());
    Plan plan = TestFarms.plan(farm);
    assertThat(PlanJson.time(plan.night().sunset(), LA)).startsWith("2026-03-07T").endsWith("-08:00");
    assertThat(PlanJson.time(plan.night().sunrise(), LA)).startsWith("2026-03-08T").endsWith("-07:00");
    Action.Sprinkle s = plan.blocks().get(0).sprinkle().orElseThrow();
    assertThat(s.start()).isBefore(s.stop());
    assertThat(s.stop()).isAfter(plan.night().sunrise());
    // The water is over real elapsed time: the missing clock hour is not counted.
    double hours = (s.stop().getEpochSecond() - s.start().getEpochSecond()) / 3600.0;
    assertThat(s.waterM3()).isCloseTo(200.0 * hours, within(1e-6));
  }

  @Test
  void aForecastThatEndsBeforeItIsSafeToStopIsBadInput() {
    double[] air = {2, 1, 0, -1, -2, -3, -3, -3, -3, -3, -3, -3};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK, Forecasts.hourly("2026-04-14", 20, "-07:00",
        air, Forecasts.fill(n, -6.0), Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    assertThatThrownBy(() -> TestFarms.plan(farm)).isInstanceOf(BadInputException.class)
        .hasMessageContaining("forecast.csv").hasMessageContaining("ends at");
  }

  @Test
  void anExplicitNightPlansThatEveningAndAForecastForAnotherIsBadInput() {
    double[] air = {6, 4, 2, 0, -2, -2.5, -3, -3, -3, -3, -3, -1, 2, 5, 7, 8, 9};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK, Forecasts.hourly("2026-04-14", 20, "-07:00",
        air, Forecasts.fill(n, -6.0), Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    Plan plan = new NightPlanner().plan(new PlanRequest(farm, null, TestFarms.CROPS, TestFarms.RULES,
        java.time.LocalDate.of(2026, 4, 14)));
    assertThat(plan.night().date()).hasToString("2026-04-14");
    // The evening before: the forecast starts after that night's sunrise.
    assertThatThrownBy(() -> new NightPlanner().plan(new PlanRequest(farm, null, TestFarms.CROPS,
        TestFarms.RULES, java.time.LocalDate.of(2026, 4, 13))))
        .isInstanceOf(BadInputException.class).hasMessageContaining("--night");
    // The evening after: the forecast ends before that night's sunrise.
    assertThatThrownBy(() -> new NightPlanner().plan(new PlanRequest(farm, null, TestFarms.CROPS,
        TestFarms.RULES, java.time.LocalDate.of(2026, 4, 15))))
        .isInstanceOf(BadInputException.class).hasMessageContaining("ends at");
  }

  /**
   * Sprinkling that cannot stop before the forecast ends: the forecast reaches an hour past
   * sunrise (so the window check passes) but stays at −3 °C with a −7 °C dew point, so the wet
   * bulb never climbs back over the stop threshold. The plan must refuse to guess a stop time,
   * and say so with this message, not the window's "ends at ..., before ... (an hour after
   * sunrise)" one that shares its first words.
   */
  @Test
  void aStopBeyondTheForecastIsRefusedWithItsOwnMessage() {
    double[] air = {6, 4, 2, 0, -2, -3, -3, -3, -3, -3, -3, -3, -3, -3};
    int n = air.length;
    Path farm = TestFarms.oneBlock(tmp, APPLE_BLOCK, Forecasts.hourly("2026-04-14", 20, "-07:00",
        air, Forecasts.fill(n, -7.0), Forecasts.fill(n, 1.0), Forecasts.fill(n, 0)));
    assertThatThrownBy(() -> TestFarms.plan(farm))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("the forecast ends at 09:00 while the wet bulb on block")
        .hasMessageContaining("is still below the stop threshold")
        .hasMessageContaining("extend the forecast into the late morning")
        .satisfies(e -> assertThat(e.getMessage()).doesNotContain("an hour after sunrise"));
  }
}
