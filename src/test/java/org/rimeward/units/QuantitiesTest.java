package org.rimeward.units;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class QuantitiesTest {
  // Conversion factors: NIST SP 811 (2008), Appendix B (foot, acre, gallon, inch, mile, knot).
  @ParameterizedTest
  @CsvSource({
      "-2.2C, TEMPERATURE, -2.2",
      "28F, TEMPERATURE, -2.2222",
      "28 °F, TEMPERATURE, -2.2222",
      "271.15 K, TEMPERATURE, -2.0",
      "1F, TEMPERATURE_DELTA, 0.5556",
      "1.0C, TEMPERATURE_DELTA, 1.0",
      "7 mph, SPEED, 3.1293",
      "3 m/s, SPEED, 3.0",
      "36 km/h, SPEED, 10.0",
      "0.15 in/h, RATE, 3.81",
      "3.8 mm/h, RATE, 3.8",
      "800 ft, LENGTH, 243.84",
      "11 ac, AREA, 4.4515",
      "600 gpm, FLOW, 136.27",
      "2.4 acre-ft, VOLUME, 2960.36",
      "1.5 oz/yd2, AREAL_MASS, 50.86",
      "1013.25 hPa, PRESSURE, 101.325",
      "9 ML, VOLUME, 9000",
      "−2.5C, TEMPERATURE, -2.5",
  })
  void convertsToTheCanonicalUnit(String text, Dimension dim, double expected) {
    assertThat(Quantities.parse(text, dim, "x")).isCloseTo(expected, within(0.01));
  }

  @Test
  void bareTemperatureFollowsTheUnitSystem() {
    assertThat(Quantities.parse("-2", Dimension.TEMPERATURE, "--temp", UnitSystem.METRIC)).isEqualTo(-2.0);
    assertThat(Quantities.parse("32", Dimension.TEMPERATURE, "--temp", UnitSystem.US))
        .isCloseTo(0.0, within(1e-9));
  }

  @Test
  void bareNumberIsAnErrorThatShowsTheForms() {
    assertThatThrownBy(() -> Quantities.parse("3", Dimension.SPEED, "wind"))
        .isInstanceOf(QuantityException.class)
        .hasMessageContaining("wind").hasMessageContaining("m/s").hasMessageContaining("mph");
  }

  @Test
  void unknownUnitIsNamed() {
    assertThatThrownBy(() -> Quantities.parse("3 furlongs", Dimension.LENGTH, "elevation"))
        .hasMessageContaining("furlongs").hasMessageContaining("800 ft");
  }

  @Test
  void displaysInTheChosenSystem() {
    assertThat(Quantities.format(-2.2222222, Dimension.TEMPERATURE, UnitSystem.US, 0)).isEqualTo("28 °F");
    assertThat(Quantities.format(3.81, Dimension.RATE, UnitSystem.US, 2)).isEqualTo("0.15 in/h");
    // 72 m3/h = 317 US gal/min (NIST SP 811: 1 gal = 3.785411784 L).
    assertThat(Quantities.format(72, Dimension.FLOW, UnitSystem.US, 0)).isEqualTo("317 gpm");
    assertThat(Quantities.format(3785.411784, Dimension.VOLUME, UnitSystem.US, 0)).isEqualTo("1,000,000 gal");
  }

  @Test
  void lowerCaseMlIsNotMegalitres() {
    // "ml" reads as millilitres to most people, a million times less than ML (megalitres).
    assertThatThrownBy(() -> Quantities.parse("9 ml", Dimension.VOLUME, "volume"))
        .isInstanceOf(QuantityException.class).hasMessageContaining("unit 'ml'")
        .hasMessageContaining("9 ML");
  }

  @Test
  void decimalCommaSaysUseADecimalPoint() {
    assertThatThrownBy(() -> Quantities.parse("-2,5C", Dimension.TEMPERATURE, "--air"))
        .isInstanceOf(QuantityException.class)
        .hasMessage("--air: '-2,5C' has a comma in the number; use a decimal point and no thousands"
            + " separator, e.g. -2.5C instead of -2,5C");
  }

  @Test
  void temperaturesBelowAbsoluteZeroAreRefusedInEveryUnit() {
    // Absolute zero: 0 K = -273.15 °C = -459.67 °F (NIST SP 811 B.9, exact by definition).
    assertThat(Quantities.parse("0 K", Dimension.TEMPERATURE, "t")).isEqualTo(-273.15);
    for (String below : new String[] {"-5K", "-274C", "-460F"}) {
      assertThatThrownBy(() -> Quantities.parse(below, Dimension.TEMPERATURE, "t"))
          .as(below).hasMessageContaining("below absolute zero");
    }
  }

  @Test
  void usSymbolsComeFromTheOneUnitTable() {
    assertThat(Quantities.symbol(Dimension.VOLUME, UnitSystem.US)).isEqualTo("gal");
    assertThat(Quantities.symbol(Dimension.FLOW, UnitSystem.US)).isEqualTo("gpm");
    assertThat(Quantities.symbol(Dimension.PRESSURE, UnitSystem.US)).isEqualTo("kPa");
    assertThat(Quantities.format(-2.0, Dimension.TEMPERATURE, UnitSystem.US, 1)).isEqualTo("28.4 °F");
  }

  @Test
  void aTextQuotingBothSystemsKeepsTheReadersFigureAlone() {
    // As the crop profiles and the fabric table write their sources' figures.
    String source = "single stage tolerance -1.1 °C (30.0 °F), T90 = tolerance − 1.67 °C (3.0 °F);"
        + " fabric 50.9 g/m² (1.50 oz/yd²): 5.0 °F (2.78 °C); 1,250 m³ (330,215 gal)";
    assertThat(UnitFormat.of(UnitSystem.US).quoted(source)).isEqualTo("single stage tolerance"
        + " 30.0 °F, T90 = tolerance − 3.0 °F; fabric 1.50 oz/yd²: 5.0 °F; 330,215 gal");
    assertThat(UnitFormat.of(UnitSystem.METRIC).quoted(source)).isEqualTo(source);
    // A figure in one system only, or a bracket that is not its twin, is left alone.
    assertThat(UnitFormat.of(UnitSystem.US).quoted("WSU EB0913 (Red Delicious), 2 °F hardier"))
        .isEqualTo("WSU EB0913 (Red Delicious), 2 °F hardier");
  }
}
