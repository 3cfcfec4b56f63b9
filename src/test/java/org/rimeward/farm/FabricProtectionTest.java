package org.rimeward.farm;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class FabricProtectionTest {
  // 1 oz/yd² = 33.906 g/m² (NIST SP 811 B.8; docs/reference/check-values.md §3 conversion row, COMPUTED).
  private static final double G_PER_OZ = 33.905747;

  @ParameterizedTest(name = "{0} oz/yd² -> {1} °F ({2})")
  @CsvSource(delimiter = ';', value = {
      // UMaine Highmoor (2023): "thinner products" 2–3 °F; the lower figure.
      "0.5; 2.0; UMaine",
      // U. Delaware Weekly Crop Update, G. Johnson: single 1.2 oz/yd² cover "about 4 degrees".
      "1.2; 4.0; U. Delaware",
      // Purdue Vegetable Crops Hotline: ≈5.5 °F observed under 1.5 oz/yd²; UGA "Row Cover
      // Usage" (2020): 3–5 °F for covers up to 1.5 oz; the lower point figure, 5 °F.
      "1.5; 5.0; Purdue",
  })
  void tablePointsCarryTheirSource(double oz, double protectionF, String source) {
    FabricProtection.Protection p = FabricProtection.forWeight(oz * G_PER_OZ);
    assertThat(p.protectionC()).isCloseTo(protectionF / 1.8, within(1e-9));
    assertThat(p.source()).contains(source).contains("table point");
  }

  @Test
  void everyPointNamesAPublishedSourceAndTheTableNeverDecreases() {
    double last = 0;
    for (FabricProtection.Point p : FabricProtection.POINTS) {
      assertThat(p.source()).matches(".*(UMaine|Delaware|Purdue).*");
      assertThat(p.protectionF()).isGreaterThanOrEqualTo(last);
      last = p.protectionF();
    }
  }

  @Test
  void weightsBetweenPointsAreInterpolatedAndNamedSo() {
    // Halfway between 1.2 oz (4 °F) and 1.5 oz (5 °F) is 4.5 °F.
    FabricProtection.Protection p = FabricProtection.forWeight(1.35 * G_PER_OZ);
    assertThat(p.protectionC()).isCloseTo(4.5 / 1.8, within(1e-9));
    assertThat(p.source()).contains("interpolated").contains("U. Delaware").contains("Purdue");
    // 50 g/m² (1.475 oz): just under the 1.5 oz point.
    double at50 = FabricProtection.forWeight(50).protectionC();
    assertThat(at50).isBetween(4.0 / 1.8, 5.0 / 1.8);
  }

  @Test
  void heavierClothIsHeldAtTheHeaviestMeasuredFigure() {
    FabricProtection.Protection p = FabricProtection.forWeight(1.8 * G_PER_OZ);
    assertThat(p.protectionC()).isCloseTo(5.0 / 1.8, within(1e-9));
  }

  @Test
  void weightsOutsideTheTableAreRefusedNotExtrapolated() {
    assertThatThrownBy(() -> FabricProtection.forWeight(10))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("10.0 g/m²").hasMessageContaining("17.0 to 67.8 g/m²");
    assertThatThrownBy(() -> FabricProtection.forWeight(3 * G_PER_OZ))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("3.00 oz/yd²");
  }
}
