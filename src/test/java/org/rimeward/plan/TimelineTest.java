package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.units.UnitSystem;
import org.rimeward.water.GrantKind;

/**
 * The night at a glance, on the invented demo farm and small invented farms: what it lists is
 * checked against the plan's own actions, so a missing or extra entry fails.
 */
class TimelineTest {
  @TempDir Path tmp;

  static Plan demo(Path tmp) {
    return TestFarms.plan(TestFarms.copyDemo(tmp));
  }

  @Test
  void theTimelineIsInTimeOrderAndHasEveryActionOfThePlan() {
    Plan plan = demo(tmp);
    List<PlanDocument.TimelineEntry> t = PlanDocuments.of(plan).timeline();
    for (int i = 1; i < t.size(); i++) {
      assertThat(t.get(i).at()).as("entry %d", i).isAfterOrEqualTo(t.get(i - 1).at());
    }
    List<String> expected = new ArrayList<>();
    for (BlockPlan b : plan.blocks()) {
      b.cover().ifPresent(c -> {
        expected.add(m(c.deployStart()) + " cover-crew-out " + b.blockId());
        expected.add(m(c.deployBy()) + " covers-on-by " + b.blockId());
        expected.add(m(c.remove()) + " covers-off " + b.blockId());
      });
      b.sprinkle().filter(Action.Sprinkle::withWater).ifPresent(s -> {
        expected.add(m(s.start()) + " sprinklers-on " + b.blockId());
        expected.add(m(s.stop()) + " sprinklers-off " + b.blockId());
        // The frost alarm of a block that sprinkles, FAO 2005 ch. 7: set above the start.
        AlarmReading a = b.alarm().orElseThrow();
        expected.add(m(a.alarmAt()) + " alarm " + b.blockId());
      });
    }
    // The demo's five blocks that sprinkle with water each have their alarm, and only they: the
    // short-of-water creek-rome and the not-advised west-pear keep their sprinklers off.
    assertThat(expected.stream().filter(e -> e.contains(" alarm "))).hasSize(5);
    List<String> got = t.stream().filter(e -> e.block() != null)
        .map(e -> e.at().toInstant() + " " + e.event() + " " + e.block()).toList();
    assertThat(got).containsExactlyInAnyOrderElementsOf(expected);
    // creek-rome gets no water from the short pond: no time a crew could read as "sprinkle".
    assertThat(plan.blocks().stream().filter(b -> b.blockId().equals("creek-rome")).findFirst()
        .orElseThrow().sprinkle().orElseThrow().grant()).isEqualTo(GrantKind.NONE);
    assertThat(t).noneMatch(e -> "creek-rome".equals(e.block()));
    // Each pump goes on with its first granted run and off with its last.
    Instant pondOn = m(at(plan, "hollow-cherry", true));
    Instant pondOff = m(at(plan, "hollow-cherry", false));
    assertThat(t).filteredOn(e -> "pond".equals(e.source()) && e.block() == null)
        .extracting(e -> e.event() + " " + e.at().toInstant())
        .containsExactly("pump-on " + pondOn, "pump-off " + pondOff);
    assertThat(t).filteredOn(e -> "well".equals(e.source()) && e.block() == null)
        .extracting(PlanDocument.TimelineEntry::event).containsExactly("pump-on", "pump-off");
    // Each alarm comes before its block's sprinklers go on, and says the numbers it is set by.
    for (PlanDocument.TimelineEntry alarm : t.stream().filter(e -> e.event().equals("alarm")).toList()) {
      assertThat(t.indexOf(alarm)).isLessThan(indexOf(t, "sprinklers-on", alarm.block()));
      PlanDocument.Block b = PlanDocuments.of(plan).block(alarm.block()).orElseThrow();
      assertThat(alarm.airC()).isEqualTo(b.alarmAirC());
      assertThat(alarm.at()).isEqualTo(b.alarmAt());
    }
    assertThat(t).filteredOn(e -> "hollow-cherry".equals(e.block()) && e.event().equals("alarm"))
        .singleElement().satisfies(e -> assertThat(e.what()).isEqualTo(
            "frost alarm: air 1.0 °C expected; sprinklers on at 0.0 °C air (wet bulb -1.8 °C)"));
    assertThat(t).noneMatch(e -> "west-pear".equals(e.block()));
    // At one minute a pump goes on before the sprinklers it feeds and off after them.
    int pumpOn = indexOf(t, "pump-on", "pond");
    assertThat(t.get(pumpOn + 1).event()).isEqualTo("sprinklers-on");
    assertThat(t.get(pumpOn + 1).block()).isEqualTo("hollow-cherry");
  }

  @Test
  void theTimelineComesFirstInTextAndAsTimelineInJson() throws IOException {
    Plan plan = demo(tmp);
    String text = PlanText.render(plan, UnitSystem.METRIC, false);
    assertThat(text.indexOf("Tonight, in time order")).isPositive().isLessThan(text.indexOf("  block  "));
    assertThat(text).contains("17:44  field-berries    cover crew starts putting covers on",
        "19:44  field-berries    covers must be on by now", "22:42  pond             pump on, up to",
        "08:32  field-berries    covers off");
    JsonNode json = org.rimeward.io.Json.mapper().readTree(PlanJson.toText(plan));
    JsonNode timeline = json.get("timeline");
    assertThat(timeline).hasSize(PlanDocuments.of(plan).timeline().size());
    JsonNode first = timeline.get(0);
    assertThat(first.get("at").asText()).isEqualTo("2026-04-14T17:44-07:00");
    assertThat(first.get("what").asText()).isEqualTo("cover crew starts putting covers on");
    assertThat(first.get("event").asText()).isEqualTo("cover-crew-out");
    assertThat(first.get("block").asText()).isEqualTo("field-berries");
    for (JsonNode e : timeline) {
      assertThat(e.get("at").asText()).matches("\\d{4}-\\d\\d-\\d\\dT\\d\\d:\\d\\d[-+]\\d\\d:\\d\\d");
      assertThat(e.has("block") || e.has("source")).isTrue();
    }
  }

  @Test
  void aForecastThatStartsAt0200FlagsWhatWasDueAndNamesTheHoursItMisses() throws IOException {
    Path farm = TestFarms.copyDemo(tmp);
    List<String> lines = Files.readAllLines(farm.resolve("forecast.csv"));
    List<String> late = new ArrayList<>(List.of(lines.get(0)));
    lines.stream().filter(l -> l.compareTo("2026-04-15T02:00") >= 0 && l.startsWith("2026")).forEach(late::add);
    Files.write(farm.resolve("forecast.csv"), late);
    Plan plan = TestFarms.plan(farm);
    assertThat(plan.night().date()).hasToString("2026-04-14");
    List<PlanDocument.TimelineEntry> t = PlanDocuments.of(plan).timeline();
    PlanDocument.TimelineEntry gap = t.stream().filter(e -> e.event().equals("not-covered"))
        .findFirst().orElseThrow();
    assertThat(gap.at().toInstant()).isEqualTo(m(plan.night().sunset()));
    assertThat(gap.what()).contains("02:00", "19:44", "not covered");
    assertThat(t).filteredOn(e -> e.event().equals("covers-on-by")).singleElement()
        .satisfies(e -> assertThat(e.past()).isTrue())
        .satisfies(e -> assertThat(e.what()).isEqualTo("covers were due on by 19:44"));
    // Planned from where it starts: nothing but what was due lies before 02:00.
    Instant start = plan.night().forecastStart();
    assertThat(t).filteredOn(e -> e.at().toInstant().isBefore(start)).allMatch(PlanDocument.TimelineEntry::past);
    String text = PlanText.render(plan, UnitSystem.METRIC, false);
    assertThat(text).contains("PAST 19:44", "covers were due on by 19:44",
        "the hours from sunset 19:44 to then are not covered");
  }

  @Test
  void aQuietNightPrintsAQuietPlan() {
    double[] warm = Forecasts.fill(20, 8.0);
    Path farm = TestFarms.oneBlock(tmp, NightPlannerTest.APPLE_BLOCK + """
          - id: second-apple
            crop: apple
            stage: full-bloom
            area: 1.0 ha
        """, Forecasts.hourly("2026-04-14", 18, "-07:00", warm, Forecasts.fill(20, 2.0),
            Forecasts.fill(20, 1.0), Forecasts.fill(20, 0)));
    Plan plan = TestFarms.plan(farm);
    assertThat(PlanDocuments.of(plan).timeline()).isEmpty();
    String text = PlanText.render(plan, UnitSystem.METRIC, false);
    assertThat(text).contains("Nothing to do tonight").doesNotContain("Tonight, in time order", "Water\n");
    assertThat(text.lines().filter(l -> l.contains("nothing needed"))).hasSize(2);
    assertThat(text.lines().filter(l -> l.startsWith("  - "))).containsExactly("  - " + StandingCautions.ONE_LINE);
  }

  /** A moment to the minute, as the plan document keeps it. */
  private static Instant m(Instant t) {
    return t.truncatedTo(java.time.temporal.ChronoUnit.MINUTES);
  }

  private static Instant at(Plan plan, String block, boolean start) {
    Action.Sprinkle s = plan.blocks().stream().filter(b -> b.blockId().equals(block)).findFirst()
        .orElseThrow().sprinkle().orElseThrow();
    return start ? s.start() : s.stop();
  }

  /** The first entry of {@code event} for a water source or, failing that, a block. */
  private static int indexOf(List<PlanDocument.TimelineEntry> t, String event, String who) {
    for (int i = 0; i < t.size(); i++) {
      if (t.get(i).event().equals(event) && (who.equals(t.get(i).source()) && t.get(i).block() == null
          || who.equals(t.get(i).block()))) {
        return i;
      }
    }
    throw new AssertionError(event + " " + who + " not in " + t);
  }
}
