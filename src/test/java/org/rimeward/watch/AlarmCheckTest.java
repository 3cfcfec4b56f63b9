package org.rimeward.watch;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.farm.Block;
import org.rimeward.plan.AlarmReading;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.Plan;
import org.rimeward.plan.PlanRequest;
import org.rimeward.plan.Replanner;
import org.rimeward.rules.RuleBook;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;
import org.rimeward.weather.Reading;
import org.rimeward.weather.ReadingsReader;

/**
 * The alarm-temperature alarm rings at the plan's own alarm temperature for the block (rule
 * ALARM-START: the start air temperature plus the rule files' alarm margin, FAO 2005 ch. 7), so
 * the watch and the plan say the same number. The demo farm's hollow-cherry (cold-air offset
 * -1 °C) is re-planned on invented readings that follow the forecast, then given an alarm
 * temperature that is not its start plus 1 °C, which only the plan's number can explain.
 */
class AlarmCheckTest {
  private static final ZoneId ZONE = ZoneId.of("America/Los_Angeles");
  private static final Instant NOW = OffsetDateTime.parse("2026-04-14T21:00-07:00").toInstant();
  @TempDir Path tmp;
  Replanner rp;
  Plan plan;
  BlockPlan cherry;
  Block cherryBlock;

  @BeforeEach
  void replanTheDemoNight() throws Exception {
    Path farm = DemoNight.farmWithReadings(tmp, NOW.minus(Duration.ofHours(3)), NOW);
    Path readings = farm.resolve("readings.csv");
    rp = Replanner.load(new PlanRequest(farm, null, Path.of("crop-profiles"), Path.of("rules"), null),
        RuleBook::load);
    plan = rp.replan(ReadingsReader.read(readings, ZONE), Files.readAllBytes(readings), NOW,
        Optional.empty());
    cherry = plan.blocks().stream().filter(b -> b.blockId().equals("hollow-cherry")).findFirst()
        .orElseThrow();
    cherryBlock = rp.farm().blocks().stream().filter(b -> b.id().equals("hollow-cherry")).findFirst()
        .orElseThrow();
    assertThat(cherry.sprinkle()).as("hollow-cherry sprinkles tonight").isPresent();
    assertThat(cherry.sprinkle().get().start()).as("its start is still ahead").isAfter(NOW);
    assertThat(cherry.alarm()).as("the plan sets its alarm").isPresent();
    assertThat(cherryBlock.coldAirOffsetC()).isEqualTo(-1.0);
  }

  /** The plan, with hollow-cherry's alarm temperature set {@code aboveStartC} above its start. */
  private Plan withAlarmAbove(double aboveStartC) {
    AlarmReading a = cherry.alarm().orElseThrow();
    AlarmReading moved = new AlarmReading(a.startAirC(), a.startWetBulbC(),
        a.startAirC() + aboveStartC, a.alarmAt(), a.referenceAt());
    BlockPlan b = cherry;
    BlockPlan changed = new BlockPlan(b.blockId(), b.crop(), b.variety(), b.stage(), b.stageName(),
        b.t10C(), b.t90C(), b.thresholdSource(), b.targetC(), b.minAirC(), b.minBudC(),
        b.minWetBulbC(), b.coldestAt(), b.coldestLine(), b.risk(), b.killPctUnprotected(),
        b.status(), b.actions(), b.sprinkling(), Optional.of(moved), b.cautions(), b.rules(),
        b.series(), b.coldAirOffsetC());
    List<BlockPlan> blocks = plan.blocks().stream().map(x -> x == cherry ? changed : x).toList();
    return new Plan(plan.farmName(), plan.toolVersion(), plan.night(), plan.policy(), blocks,
        plan.water(), plan.cautions(), plan.trail(), plan.inputs(), plan.update());
  }

  /** A station reading that puts the air at hollow-cherry (the reading plus its offset) at {@code blockAirC}. */
  private Optional<Reading> atBlock(double blockAirC) {
    double station = blockAirC - cherryBlock.coldAirOffsetC();
    return Optional.of(new Reading(NOW, ZONE.getRules().getOffset(NOW), "", station,
        OptionalDouble.of(Math.min(station, -5.0)), OptionalDouble.of(1.0), 2.0,
        OptionalDouble.empty(), OptionalDouble.empty(), 0));
  }

  private List<Alarm> cherryAlarms(Plan p, Optional<Reading> latest, UnitSystem units) {
    return AlarmCheck.check(p, rp.farm(), latest, NOW, WatchPolicy.from(rp.thresholds(),
        Duration.ofSeconds(10)), UnitFormat.of(units)).stream()
        .filter(a -> a.blockId().equals("hollow-cherry") && a.kind() == AlarmKind.ALARM_TEMPERATURE)
        .toList();
  }

  @Test
  void theBundledPlanSetsTheAlarmOneDegreeAboveTheStart() {
    // FAO 2005 ch. 7: "set the alarm about 1 °C higher than the starting air temperature".
    AlarmReading a = cherry.alarm().orElseThrow();
    assertThat(a.alarmAirC() - a.startAirC()).isCloseTo(1.0, org.assertj.core.api.Assertions.within(1e-9));
  }

  @Test
  void anAlarmThreeDegreesAboveTheStartRingsAtThePlansNumber() {
    double start = cherry.alarm().orElseThrow().startAirC();
    Plan p = withAlarmAbove(3.0);
    // 2.5 °C above the start: outside start + 1 °C, inside the plan's alarm.
    List<Alarm> raised = cherryAlarms(p, atBlock(start + 2.5), UnitSystem.METRIC);
    assertThat(raised).singleElement().satisfies(a -> assertThat(a.message())
        .contains("air " + UnitFormat.of(UnitSystem.METRIC).temp(start + 2.5) + " at the block")
        .contains("the alarm temperature the plan sets, "
            + UnitFormat.of(UnitSystem.METRIC).temp(start + 3.0))
        .contains("falls to " + UnitFormat.of(UnitSystem.METRIC).temp(start)));
    // Near miss: just above the plan's alarm temperature.
    assertThat(cherryAlarms(p, atBlock(start + 3.2), UnitSystem.METRIC)).isEmpty();
  }

  @Test
  void anAlarmCloserToTheStartStaysQuietWhereStartPlusOneWouldRing() {
    double start = cherry.alarm().orElseThrow().startAirC();
    Plan p = withAlarmAbove(0.3);
    assertThat(cherryAlarms(p, atBlock(start + 0.8), UnitSystem.METRIC)).isEmpty();
    assertThat(cherryAlarms(p, atBlock(start + 0.2), UnitSystem.METRIC)).hasSize(1);
  }

  @Test
  void theMessageIsInTheUsersUnits() {
    double start = cherry.alarm().orElseThrow().startAirC();
    Plan p = withAlarmAbove(3.0);
    UnitFormat us = UnitFormat.of(UnitSystem.US);
    assertThat(cherryAlarms(p, atBlock(start + 2.5), UnitSystem.US)).singleElement()
        .satisfies(a -> assertThat(a.message()).contains(us.temp(start + 3.0)).contains("°F")
            .doesNotContain("°C"));
  }

  /** A 2 m station reading of {@code windMs} at {@code at}. */
  private static Optional<Reading> wind(Instant at, double windMs) {
    return Optional.of(new Reading(at, ZONE.getRules().getOffset(at), "", -1.0,
        OptionalDouble.of(-5.0), OptionalDouble.of(windMs), 2.0, OptionalDouble.empty(),
        OptionalDouble.empty(), 0));
  }

  @Test
  void theWindAlarmIsTheWindRulesLimitAtTenMetres() {
    // While hollow-cherry sprinkles. The wind rules' windy limit is 4.5 m/s at 10 m (10 mph);
    // FAO-56 Eq. 47 gives u2 = 0.748 u10, so 3.6 m/s at 2 m is 4.8 m/s at 10 m (alarm) and
    // 3.2 m/s at 2 m is 4.3 m/s (no alarm), both below 4.5 m/s read at 2 m.
    Instant during = cherry.sprinkle().orElseThrow().start().plus(Duration.ofMinutes(10));
    WatchPolicy p = WatchPolicy.from(rp.thresholds(), Duration.ofSeconds(10));
    List<Alarm> windy = AlarmCheck.check(plan, rp.farm(), wind(during, 3.6), during, p,
        UnitFormat.of(UnitSystem.METRIC)).stream()
        .filter(a -> a.blockId().equals("hollow-cherry") && a.kind() == AlarmKind.WIND).toList();
    assertThat(windy).singleElement().satisfies(a -> assertThat(a.message())
        .isEqualTo("wind 4.8 m/s at 10 m (3.6 m/s at 2 m), above the windy limit of 4.5 m/s while"
            + " sprinkling"));
    assertThat(AlarmCheck.check(plan, rp.farm(), wind(during, 3.2), during, p,
        UnitFormat.of(UnitSystem.METRIC))).noneMatch(a -> a.kind() == AlarmKind.WIND);
  }

  @Test
  void noReadingNoAlarmTemperature() {
    assertThat(cherryAlarms(withAlarmAbove(3.0), Optional.empty(), UnitSystem.METRIC)).isEmpty();
  }

  @Test
  void aNearMissWithNoRunPlannedStillRingsAtItsAlarmTemperature() {
    // A near miss (rules ALARM-NEAR-MISS*): the plan sprinkles nothing, but sets an alarm for a
    // night that runs colder than forecast; the cold coming early is what the manager must hear.
    BlockPlan b = cherry;
    BlockPlan nearMiss = new BlockPlan(b.blockId(), b.crop(), b.variety(), b.stage(),
        b.stageName(), b.t10C(), b.t90C(), b.thresholdSource(), b.targetC(), b.minAirC(),
        b.minBudC(), b.minWetBulbC(), b.coldestAt(), b.coldestLine(), b.risk(),
        b.killPctUnprotected(), b.status(), List.of(), Optional.empty(), b.alarm(), b.cautions(),
        b.rules(), b.series(), b.coldAirOffsetC());
    Plan p = new Plan(plan.farmName(), plan.toolVersion(), plan.night(), plan.policy(),
        plan.blocks().stream().map(x -> x == cherry ? nearMiss : x).toList(), plan.water(),
        plan.cautions(), plan.trail(), plan.inputs(), plan.update());
    double alarmC = cherry.alarm().orElseThrow().alarmAirC();
    assertThat(cherryAlarms(p, atBlock(alarmC - 0.2), UnitSystem.METRIC)).singleElement()
        .satisfies(a -> assertThat(a.message()).contains("the plan forecast a near miss"));
    // Near miss of the alarm itself: just above it.
    assertThat(cherryAlarms(p, atBlock(alarmC + 0.2), UnitSystem.METRIC)).isEmpty();
  }
}
