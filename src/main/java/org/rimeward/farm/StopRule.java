package org.rimeward.farm;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;

/** When over-plant sprinkling may stop, as written in {@code policy.stop_rule}. */
public enum StopRule {
  /**
   * Stop once the wet-bulb temperature is above 0 °C (32 °F): UF/IFAS Circular 348 (Harrison,
   * Gerber &amp; Choate), "When the wet bulb temperature is 32 °F or higher, the irrigation system
   * can be stopped without danger to any part of the plant".
   */
  WET_BULB_ABOVE_FREEZING("wet-bulb-above-freezing"),
  /**
   * Stop once the wet-bulb temperature is above the block's target (critical) temperature: the
   * generalised UF/IFAS rule (Jackson, Parsons &amp; Martsolf) and FAO 2005 (Snyder &amp;
   * de Melo-Abreu) Table 7.5 principle.
   */
  WET_BULB_ABOVE_TARGET("wet-bulb-above-target");

  private final String yamlName;

  StopRule(String yamlName) {
    this.yamlName = yamlName;
  }

  /** The spelling used in farm.yaml. */
  public String yamlName() {
    return yamlName;
  }

  /** The rule written as {@code text} (case and surrounding blanks ignored), if it is one. */
  public static Optional<StopRule> fromYaml(String text) {
    String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
    return Arrays.stream(values()).filter(r -> r.yamlName.equals(t)).findFirst();
  }

  /** The allowed spellings, for error messages. */
  public static String allowed() {
    return Arrays.stream(values()).map(StopRule::yamlName).collect(Collectors.joining(", "));
  }
}
