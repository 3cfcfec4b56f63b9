package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.rimeward.units.UnitSystem;

/**
 * {@code --units us} converts every quantity in every explanation: a threshold a rule quotes is
 * written in both systems ({~metric|us}), never as a bare metric literal. Conversions checked
 * with NIST SP 811 factors (°F = °C × 1.8 + 32, a difference × 1.8; 1 mph = 0.44704 m/s).
 */
class ExplanationUnitsTest {
  private static final Pattern EXPLAIN = Pattern.compile("@explain\\(\"((?:[^\"\\\\]|\\\\.)*)\"\\)");
  private static final Pattern LITERAL = Pattern.compile("\\{~([^|{}]*)\\|([^{}]*)}");
  private static final Pattern METRIC_LITERAL =
      Pattern.compile("\\d\\s?(°C|m/s|mm/h|m3/h|m³/h|m³|m3|ha)\\b");
  private static final Pattern FIRST = Pattern.compile("(-?\\d+(?:\\.\\d+)?) ?(°C|°F|m/s|mph)");

  static List<String> templates() throws IOException {
    try (Stream<Path> files = Files.walk(Path.of("rules"))) {
      return files.filter(p -> p.toString().endsWith(".drl")).flatMap(p -> {
        try {
          Matcher m = EXPLAIN.matcher(Files.readString(p, StandardCharsets.UTF_8));
          return m.results().map(r -> r.group(1)).toList().stream();
        } catch (IOException e) {
          throw new java.io.UncheckedIOException(e);
        }
      }).toList();
    }
  }

  @Test
  void noRuleQuotesAMetricQuantityWithoutItsUsForm() throws IOException {
    for (String t : templates()) {
      assertThat(LITERAL.matcher(t).replaceAll("")).as(t).doesNotContainPattern(METRIC_LITERAL);
    }
  }

  @Test
  void bothFormsOfEachQuotedQuantityAgree() throws IOException {
    int pairs = 0;
    for (String t : templates()) {
      Matcher m = LITERAL.matcher(t);
      while (m.find()) {
        pairs++;
        Matcher a = FIRST.matcher(m.group(1));
        Matcher b = FIRST.matcher(m.group(2));
        assertThat(a.find() && b.find()).as(m.group()).isTrue();
        double metric = Double.parseDouble(a.group(1));
        double us = Double.parseDouble(b.group(1));
        if (a.group(2).equals("°C")) {
          assertThat(b.group(2)).isEqualTo("°F");
          boolean absolute = Math.abs(metric * 1.8 + 32 - us) < 0.15;
          boolean difference = Math.abs(metric * 1.8 - us) < 0.15;
          assertThat(absolute || difference).as(m.group()).isTrue();
        } else {
          assertThat(b.group(2)).isEqualTo("mph");
          // The sources state whole mph: 2.2 m/s is 4.92 mph, 4.5 m/s 10.07 mph.
          assertThat(metric / 0.44704).as(m.group()).isCloseTo(us, within(0.1 * us));
        }
      }
    }
    // Most thresholds are facts now, shown in the reader's units; the fixed ones left are quoted.
    assertThat(pairs).isPositive();
  }

  @Test
  void aQuotedQuantityShowsInTheReadersUnits() {
    String t = "stays at or above {~0 °C|32 °F}, above {~4.5 m/s (10 mph)|10 mph}";
    ZoneId z = ZoneId.of("UTC");
    assertThat(Explanations.render(t, Map.of(), UnitSystem.METRIC, z))
        .isEqualTo("stays at or above 0 °C, above 4.5 m/s (10 mph)");
    assertThat(Explanations.render(t, Map.of(), UnitSystem.US, z)).isEqualTo("stays at or above 32 °F, above 10 mph");
  }

  @Test
  void aStakePerCubicMetreShowsPerThousandGallonsInUsUnits() {
    // 11.7 per m³ × 3.785411784 m³ per 1,000 gal = 44.3 per 1,000 gal.
    Map<String, Object> v = Map.of("stakePerM3", 11.7);
    ZoneId z = ZoneId.of("UTC");
    assertThat(Explanations.render("{stakePerM3}", v, UnitSystem.METRIC, z)).isEqualTo("11.7 per m³");
    assertThat(Explanations.render("{stakePerM3}", v, UnitSystem.US, z)).isEqualTo("44.3 per 1,000 gal");
  }

  @Test
  void gallonsAreGrouped() {
    // 3400 m³ / 0.003785411784 m³/gal = 898,185 gal; 450 m³/h = 1,981 gpm.
    assertThat(Explanations.render("{volumeM3} at {flowM3H}", Map.of("volumeM3", 3400.0, "flowM3H", 450.0),
        UnitSystem.US, ZoneId.of("UTC"))).isEqualTo("898,185 gal at 1,981 gpm");
  }
}
