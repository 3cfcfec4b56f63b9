package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SkyTest {
  @ParameterizedTest(name = "T {0} °C, Td {1} °C")
  @CsvSource({"0, -5, 0.6834, 215.7", "5, 0, 0.7187, 243.9", "10, 5, 0.7542, 274.9",
      "-2, -4, 0.6915, 211.9", "2, -8, 0.6607, 214.7"})
  void brutsaertClearSkyMatchesReferenceChecks(double t, double td, double eps, double lDown) {
    // Shared reference 4.2: COMPUTED from Brutsaert (1975) hPa form 1.24 (e/T)^(1/7), e by AERK,
    // sigma = 5.67e-8; not published numbers.
    double e = Psychrometrics.vapourPressureFromDewPointKPa(td);
    assertThat(Sky.clearSkyEmissivityBrutsaert(t, e)).isCloseTo(eps, within(5e-4));
    assertThat(Sky.downwardLongWaveWm2(t, td, 0)).isCloseTo(lDown, within(0.2));
  }

  @Test
  void unsworthMonteithCloudCorrection() {
    // Shared reference 4.2 (COMPUTED): at 0 °C, Td -5 °C, c = 0 / 0.5 / 1 -> 0.6834 / 0.8164 / 0.9493.
    double clear = Sky.clearSkyEmissivityBrutsaert(0, Psychrometrics.vapourPressureFromDewPointKPa(-5));
    assertThat(Sky.cloudyEmissivity(clear, 0)).isCloseTo(0.6834, within(5e-4));
    assertThat(Sky.cloudyEmissivity(clear, 50)).isCloseTo(0.8164, within(5e-4));
    assertThat(Sky.cloudyEmissivity(clear, 100)).isCloseTo(0.9493, within(5e-4));
  }

  @Test
  void blackBodyAtZeroCelsius() {
    // Shared reference 4.2 column sigma T^4 at 0 °C: 315.6 W/m² (COMPUTED).
    assertThat(Sky.downwardLongWaveWm2(0, 1.0)).isCloseTo(315.6, within(0.1));
  }

  @Test
  void outOfRangeInputsAreErrors() {
    assertThatThrownBy(() -> Sky.cloudyEmissivity(0.7, 120)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> Sky.clearSkyEmissivityBrutsaert(0, 0)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> Sky.downwardLongWaveWm2(0, 2, 0)).isInstanceOf(OutOfRangeException.class);
  }
}
