package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.rimeward.physics.Psychrometrics;
import org.rimeward.rules.facts.Alarm;

/**
 * rules/sprinkling/alarm.drl: the air temperature at which sprinkling starts, read at the forecast
 * dew point, and the alarm 1.0 °C above it: FAO 2005 (Snyder & de Melo-Abreu, ch. 7) advises
 * setting the alarm "about 1 °C higher than the starting air temperature" of its Table 7.5. The
 * fixture's start margin is the farm's 1 °C (threshold -1.2 °C on the wet bud), depression 1 °C.
 */
class AlarmRulesTest {
  /** Dew point 3 °C below the air every hour; the wet bulb from the psychrometer equation. */
  static BundledRules.Run night(double[] air, double coverC) {
    double[] dew = java.util.Arrays.stream(air).map(a -> a - 3.0).toArray();
    double[] wet = new double[air.length];
    for (int i = 0; i < air.length; i++) {
      wet[i] = Psychrometrics.wetBulbC(air[i], dew[i], Scenario.PRESSURE_KPA);
    }
    return BundledRules.run(new Scenario().source("pond", 500, 5000).block("b1")
        .sprinklers(3.8, "pond").covers(coverC, 2).kill(40).dew(dew).hourly(air, wet).done());
  }

  @Test
  void aStartingBlockCarriesItsStartAndAlarmReadings() {
    BundledRules.Run r = night(Scenario.FROST_AIR, 0);
    BundledRules.assertFired(r, "b1").firesOnce("ALARM-START").doesNotFire("ALARM-NEAR-MISS");
    Alarm a = r.one(Alarm.class, "b1");
    // The wet bud (wet bulb less 1 °C) at the -1.2 °C threshold: a wet bulb of -0.2 °C.
    assertThat(a.startWetBulbC()).isCloseTo(-0.2, within(1e-6));
    // The air that gives that wet bulb at the start's dew point gives it back (within the
    // bisection's 0.001 °C), and lies above the dew point.
    double dewAtStart = a.startAirC() - 3.0;
    assertThat(Psychrometrics.wetBulbC(a.startAirC(), dewAtStart, Scenario.PRESSURE_KPA))
        .isCloseTo(-0.2, within(0.01));
    assertThat(a.alarmAirC()).isCloseTo(a.startAirC() + 1.0, within(1e-9));
    assertThat(a.referenceAt()).isEqualTo(r.one(org.rimeward.rules.facts.SprinkleStart.class, "b1").at());
    // The forecast air falls through the alarm before the start.
    assertThat(a.alarmAt()).isNotNull().isBefore(a.referenceAt());
    assertThat(r.explanation("ALARM-START", "b1")).contains("1.0 °C", "FAO 2005");
  }

  @Test
  void aNearMissWithSprinklersCarriesTheSameReadings() {
    // Coldest air -1.1 °C at 02:00: dry bud -2.1 °C, 0.1 °C above the -2.2 °C target.
    BundledRules.Run r = night(Scenario.coldestAt0200(-1.1), 0);
    BundledRules.assertFired(r, "b1").firesOnce("ALARM-NEAR-MISS")
        .doesNotFire("ALARM-START", "SPRINKLE-START", "SPRINKLE-PLAN");
    Alarm a = r.one(Alarm.class, "b1");
    assertThat(a.referenceAt()).isEqualTo(Scenario.at(1, 2, 0));
    assertThat(a.thresholdC()).isCloseTo(-1.2, within(1e-9));
    assertThat(a.alarmAirC()).isCloseTo(a.startAirC() + 1.0, within(1e-9));
    assertThat(a.alarmAt()).isNotNull();
    assertThat(r.explanation("ALARM-NEAR-MISS", "b1")).contains("near miss", "02:00", "FAO 2005");
  }

  @Test
  void noAlarmBeyondTheWatchBand() {
    BundledRules.Run r = night(Scenario.coldestAt0200(1.0), 0);
    BundledRules.assertFired(r, "b1").doesNotFire("ALARM-NEAR-MISS", "ALARM-START",
        "ALARM-NEAR-MISS-UNDER-COVERS");
    assertThat(r.all(Alarm.class)).isEmpty();
  }

  @Test
  void aCoveredNearMissWithSprinklersReadsBelowTheCovers() {
    BundledRules.Run r = night(Scenario.coldestAt0200(-1.1), 1.0);
    BundledRules.assertFired(r, "b1").firesOnce("ALARM-NEAR-MISS-UNDER-COVERS")
        .doesNotFire("ALARM-NEAR-MISS").fires("COVER-NEAR-MISS");
    // -2.2 + 1.0 - 1.0 credited = -2.2 °C on the wet bud.
    assertThat(r.one(Alarm.class, "b1").thresholdC()).isCloseTo(-2.2, within(1e-9));
  }

  @Test
  void noCoveredNearMissAlarmWithoutSprinklers() {
    double[] air = Scenario.coldestAt0200(-1.1);
    BundledRules.Run r = BundledRules.run(new Scenario().block("b1").covers(1.0, 2)
        .hourly(air, Scenario.minus(air, 1.0)).done());
    BundledRules.assertFired(r, "b1").fires("COVER-NEAR-MISS")
        .doesNotFire("ALARM-NEAR-MISS-UNDER-COVERS", "ALARM-NEAR-MISS");
  }
}
