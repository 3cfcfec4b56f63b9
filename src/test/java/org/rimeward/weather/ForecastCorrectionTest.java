package org.rimeward.weather;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

/**
 * The forecast correction on worked shapes (invented forecasts and readings, stated as such): a
 * constant offset carried to sunrise and fading over three hours after it; readings replacing the
 * forecast up to now; no recent reading, no correction.
 */
class ForecastCorrectionTest {
  private static final ZoneOffset PDT = ZoneOffset.ofHours(-7);
  private static final Instant T18 = Instant.parse("2026-04-15T01:00:00Z");
  private static final Instant SUNRISE = Instant.parse("2026-04-15T13:00:00Z");

  /** Hourly from 18:00 to 12:00: air falls 0.5 °C an hour from 8 °C, dew point 4 °C below. */
  private static Forecast forecast() {
    List<ForecastStep> steps = new ArrayList<>();
    for (int h = 0; h <= 18; h++) {
      double air = 8 - 0.5 * h;
      steps.add(new ForecastStep(T18.plus(Duration.ofHours(h)), PDT, air, air - 4, 1.0, 10, 0,
          OptionalDouble.empty(), h + 2));
    }
    return new Forecast(Path.of("forecast.csv"), steps);
  }

  private static List<Reading> readings(Instant from, Instant to, double offsetC) {
    List<Reading> out = new ArrayList<>();
    Forecast f = forecast();
    for (Instant t = from; !t.isAfter(to); t = t.plus(Duration.ofMinutes(10))) {
      double air = ForecastCorrection.forecastAirC(f, t) + offsetC;
      out.add(Reading.of(t, PDT, air, air - 4));
    }
    return out;
  }

  @Test
  void aConstantColdOffsetIsCarriedToSunriseAndFadesOverThreeHoursAfter() {
    Instant now = T18.plus(Duration.ofHours(5));
    ForecastCorrection.Corrected c = ForecastCorrection.apply(forecast(),
        readings(T18, now, -1.5), now, SUNRISE);
    assertThat(c.biasC()).isCloseTo(-1.5, within(1e-9));
    assertThat(c.dewBiasC()).isCloseTo(-1.5, within(1e-9));
    assertThat(c.lastAt()).contains(now);
    for (ForecastStep s : c.forecast().steps()) {
      double f = ForecastCorrection.forecastAirC(forecast(), s.time());
      double expected;
      if (!s.time().isAfter(SUNRISE)) {
        expected = -1.5;
      } else {
        double h = Duration.between(SUNRISE, s.time()).toMinutes() / 60.0;
        expected = -1.5 * Math.max(0, 1 - h / 3);
      }
      assertThat(s.airTempC() - f).as("offset at " + s.time()).isCloseTo(expected, within(1e-9));
      assertThat(s.dewPointC()).isLessThanOrEqualTo(s.airTempC());
    }
    // Worked values: 1.5 h after sunrise half the offset is left, at 3 h none.
    assertThat(ForecastCorrection.weight(SUNRISE.plus(Duration.ofMinutes(90)), SUNRISE)).isEqualTo(0.5);
    assertThat(ForecastCorrection.weight(SUNRISE.plus(Duration.ofHours(3)), SUNRISE)).isZero();
    assertThat(ForecastCorrection.weight(SUNRISE.minus(Duration.ofHours(3)), SUNRISE)).isEqualTo(1);
  }

  @Test
  void readingsReplaceTheForecastUpToNowAndTheLatestBecomesAStep() {
    Instant now = T18.plus(Duration.ofMinutes(5 * 60 + 20));
    List<Reading> r = new ArrayList<>(readings(T18, T18.plus(Duration.ofHours(4)), 0.0));
    // The last hour ran 2 °C colder than forecast, ending at 23:20.
    r.addAll(readings(T18.plus(Duration.ofMinutes(250)), now, -2.0));
    ForecastCorrection.Corrected c = ForecastCorrection.apply(forecast(), r, now, SUNRISE);
    ForecastStep at23 = c.forecast().steps().stream()
        .filter(s -> s.time().equals(T18.plus(Duration.ofHours(5)))).findFirst().orElseThrow();
    assertThat(at23.airTempC()).as("observed at 23:00").isCloseTo(5.5 - 2.0, within(1e-9));
    ForecastStep last = c.forecast().steps().stream().filter(s -> s.time().equals(now)).findFirst()
        .orElseThrow();
    assertThat(last.airTempC()).isCloseTo(ForecastCorrection.forecastAirC(forecast(), now) - 2.0,
        within(1e-9));
    assertThat(c.biasC()).isCloseTo(-2.0, within(1e-9));
  }

  @Test
  void withoutAReadingInTheLastHourTheForecastStandsAfterNow() {
    Instant now = T18.plus(Duration.ofHours(6));
    ForecastCorrection.Corrected c = ForecastCorrection.apply(forecast(),
        readings(T18, T18.plus(Duration.ofHours(4)), -3.0), now, SUNRISE);
    assertThat(c.biasC()).isNaN();
    assertThat(c.lastAt()).contains(T18.plus(Duration.ofHours(4)));
    for (ForecastStep s : c.forecast().steps()) {
      if (s.time().isAfter(now)) {
        assertThat(s.airTempC()).isEqualTo(ForecastCorrection.forecastAirC(forecast(), s.time()));
      }
    }
  }
}
