package org.rimeward.physics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class AtmosphereTest {
  @Test
  void fao56Example2StationPressureAndGammaAt1800m() {
    // FAO-56 (Allen et al. 1998) Example 2: z = 1800 m -> P = 81.8 kPa, gamma = 0.054 kPa/°C.
    double p = Atmosphere.stationPressureKPa(1800);
    assertThat(p).as("FAO-56 Ex. 2 pressure").isCloseTo(81.8, within(0.05));
    assertThat(Atmosphere.psychrometricConstantKPaPerC(p)).as("FAO-56 Ex. 2 gamma")
        .isCloseTo(0.054, within(0.0005));
  }

  @ParameterizedTest(name = "z = {0} m")
  @CsvSource({
      // Elevation table: P and gamma from FAO-56 Eq. 7 and 8 (COMPUTED in docs/reference/check-values.md §5.1,
      // consistent with FAO-56 Table 2.2, whose gamma column is rounded to 0.001).
      "0, 101.30, 0.067", "500, 95.53, 0.064", "1000, 90.02, 0.060", "2000, 79.79, 0.053",
      "3000, 70.51, 0.047"})
  void fao56PressureAndGammaByElevation(double z, double pKPa, double gamma) {
    double p = Atmosphere.stationPressureKPa(z);
    assertThat(p).isCloseTo(pKPa, within(0.01));
    assertThat(Atmosphere.psychrometricConstantKPaPerC(p)).isCloseTo(gamma, within(0.0006));
  }

  @Test
  void gammaMatchesGeocatCompDocumentedValues() {
    // geocat-comp documentation (psychrometric_constant): 0.0398844, 0.0531792, 0.066474 kPa/°C.
    assertThat(Atmosphere.psychrometricConstantKPaPerC(60)).isCloseTo(0.0398844, within(1e-5));
    assertThat(Atmosphere.psychrometricConstantKPaPerC(80)).isCloseTo(0.0531792, within(1e-5));
    assertThat(Atmosphere.psychrometricConstantKPaPerC(100)).isCloseTo(0.066474, within(1e-5));
  }

  @Test
  void elevationOutsideValidityIsAnErrorNotClamped() {
    assertThatThrownBy(() -> Atmosphere.stationPressureKPa(9000))
        .isInstanceOf(OutOfRangeException.class).hasMessageContaining("elevation");
    assertThatThrownBy(() -> Atmosphere.psychrometricConstantKPaPerC(30))
        .isInstanceOf(OutOfRangeException.class);
  }

  @Test
  void windAt2mFao56Eq47() {
    // FAO-56 Example 14 (from memory): 3.2 m/s at 10 m -> 2.4 m/s at 2 m (Eq. 47 gives 2.393).
    assertThat(Wind.at2mMs(3.2, 10)).as("FAO-56 Ex. 14").isCloseTo(2.4, within(0.01));
    // Eq. 47 is built to return the speed unchanged at 2 m (4.87/ln(130.18) = 1.0002).
    assertThat(Wind.at2mMs(3.0, 2)).isCloseTo(3.0, within(0.002));
    assertThatThrownBy(() -> Wind.at2mMs(3, 0.05)).isInstanceOf(OutOfRangeException.class);
    assertThatThrownBy(() -> Wind.at2mMs(-1, 10)).isInstanceOf(OutOfRangeException.class);
  }
}
