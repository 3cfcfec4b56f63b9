package org.rimeward.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanJson;
import org.rimeward.plan.RecordedExplanations;
import org.rimeward.rules.RuleTemplates;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/** The night's page model and its HTML, from the demo night's reviewed plan (invented data). */
class NightPageTest {
  static PlanDocument demo;
  static NightPage.Model model;
  static String html;

  @BeforeAll
  static void render() throws IOException {
    demo = PlanJson.read(Files.readString(Path.of("src/test/resources/golden/demo-plan.json")));
    model = NightPage.of(demo, UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null);
    html = NightPage.html(model);
  }

  @Test
  void everyBlockAtRiskHasItsChartAndItsStartTimeAsText() {
    List<PlanDocument.Block> atRisk = demo.blocks().stream().filter(PlanDocument.Block::atRisk)
        .toList();
    assertThat(model.atRisk()).extracting(NightPage.BlockView::id)
        .containsExactlyElementsOf(atRisk.stream().map(PlanDocument.Block::block).toList());
    for (PlanDocument.Block b : atRisk) {
      String section = section(html, "block-" + b.block());
      assertThat(section).as(b.block()).containsPattern("<svg id=[\"']chart-" + b.block() + "[\"']");
      b.sprinkle().filter(s -> s.waterGranted() && s.start() != null).ifPresent(s -> {
        String start = UnitFormat.of(UnitSystem.METRIC).clock(s.start());
        assertThat(section).as(b.block()).contains("Start sprinkling " + start)
            .contains("start " + start);
      });
    }
    assertThat(model.quiet()).extracting(NightPage.BlockView::hasChart).containsOnly(false);
  }

  @Test
  void theHeaderHasTheNightAndEveryCaution() {
    assertThat(html).contains("Quillhaven Bench Farm", "Sunset", "Sunrise",
        "Coldest forecast hour", "-3.2 °C", "Decision support only");
    for (PlanDocument.Block b : demo.blocks()) {
      b.cautions().forEach(c -> assertThat(html).contains(escape(c)));
    }
  }

  @Test
  void theRulesAreFoldedAndInWords() {
    assertThat(html).contains("<details>", "<summary>Why:");
    assertThat(html).doesNotContain("<details open");
    PlanDocument.Rule first = demo.blocks().get(0).rules().get(0);
    assertThat(html).contains(escape(first.explanation()));
  }

  @Test
  void eachWaterSourceHasItsChartAgainstItsLimits() {
    for (PlanDocument.Water w : demo.water()) {
      String section = section(html, "water-" + w.source());
      assertThat(section).contains("<svg", "max flow");
      if (w.availableM3() != null) {
        assertThat(section).contains("available");
      }
    }
  }

  @Test
  void usUnitsDrawTheAxesInFahrenheit() {
    String us = NightPage.html(NightPage.of(demo, UnitFormat.of(UnitSystem.US),
        PlanDocument.Rule::explanation, Map.of(), null));
    PlanDocument.Block first = demo.blocks().get(0);
    String target = UnitFormat.of(UnitSystem.US).temp(first.targetC());
    assertThat(target).endsWith("°F");
    assertThat(section(us, "block-" + first.block())).contains(target).doesNotContain("°C</text>");
    assertThat(section(us, "water-pond")).contains("gpm", "gal").doesNotContain("m3/h");
    assertThat(section(html, "water-pond")).contains("m3/h");
  }

  /**
   * The whole page in US units, every explanation included (filled again from the bundled rule
   * files' templates, as a recorded run's page is): no metric unit anywhere, not even inside the
   * charts' SVG or a source note that quotes both systems.
   */
  @Test
  void usUnitsLeaveNoMetricUnitAnywhereOnThePage() throws IOException {
    List<String> ruleFiles;
    try (var files = Files.walk(Path.of("rules"))) {
      ruleFiles = files.filter(p -> p.toString().endsWith(".drl")).sorted().map(p -> {
        try {
          return Files.readString(p);
        } catch (IOException e) {
          throw new java.io.UncheckedIOException(e);
        }
      }).toList();
    }
    String us = NightPage.html(NightPage.of(demo, UnitFormat.of(UnitSystem.US),
        RecordedExplanations.of(RuleTemplates.read(ruleFiles), UnitSystem.US, demo.zone()),
        Map.of(), null));
    // As UsUnitsPlanTest.METRIC, less litres and km, which SVG path data ("5L") would match.
    assertThat(us).doesNotContainPattern(Pattern.compile(
        "°C|m³|\\bm3\\b|mm/h|m/s|g/m²|\\d\\s?ha\\b|hectare|per m\\b"));
    assertThat(us).contains("°F", "in/h", "gpm", "frost alarm: air 33.8 °F expected",
        "per 1,000 gal");
  }

  /** A re-plan from the station's readings says so in the header and marks now on the charts. */
  @Test
  void aReplanShowsItsReadingsAndNow() throws IOException {
    String json = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"))
        .replaceFirst("\"farm\" :", "\"now\" : \"2026-04-15T00:30-07:00\", \"readings\" : {"
            + "\"file\" : \"station-readings.csv\", \"last_at\" : \"2026-04-15T00:25-07:00\","
            + " \"bias_c\" : -0.80, \"station\" : \"north\", \"stale\" : false},\n  \"farm\" :");
    PlanDocument replan = PlanJson.read(json);
    String page = NightPage.html(NightPage.of(replan, UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null));
    assertThat(page).contains("Re-planned at Wed 00:30 from the station&#39;s readings"
        + " (station-readings.csv, station north; last reading 00:25; air -0.8 °C against the"
        + " forecast over the last hour)");
    assertThat(section(page, "block-hollow-cherry")).contains("now 00:30 (readings to here)");
    assertThat(html).doesNotContain("readings to here");
  }

  /** With several stations, each one's offset and silence is in the header. */
  @Test
  void aReplanByTwoStationsShowsEach() throws IOException {
    String json = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"))
        .replaceFirst("\"farm\" :", "\"now\" : \"2026-04-15T00:30-07:00\", \"readings\" : {"
            + "\"file\" : \"r.csv\", \"last_at\" : \"2026-04-15T00:25-07:00\", \"bias_c\" : 0.0,"
            + " \"station\" : \"mast\", \"stale\" : true, \"stations\" : ["
            + "{\"id\" : \"mast\", \"blocks\" : [\"upper-golden\"], \"last_at\" :"
            + " \"2026-04-15T00:25-07:00\", \"bias_c\" : 0.0, \"stale\" : false},"
            + "{\"id\" : \"hollow\", \"blocks\" : [\"hollow-cherry\"], \"last_at\" :"
            + " \"2026-04-14T23:10-07:00\", \"bias_c\" : -2.0, \"stale\" : true}]},\n  \"farm\" :");
    String page = NightPage.html(NightPage.of(PlanJson.read(json), UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null));
    assertThat(page).contains("Re-planned at Wed 00:30 from the stations&#39; readings (r.csv;"
        + " station mast last 00:25, air 0.0 °C against the forecast; station hollow last 23:10,"
        + " air -2.0 °C against the forecast, NO reading in the last hour)");
  }

  /** The night at a glance is in the header, in the plan's order, alarms included. */
  @Test
  void theTimelineIsInTheHeaderInTimeOrder() {
    String header = html.substring(html.indexOf("<header>"), html.indexOf("</header>"));
    String timeline = section(header, "timeline");
    List<String> rows = Pattern.compile("<tr data-event=\"([a-z-]+)\"><td class=\"num\">([^<]*)</td><td>([^<]*)</td>")
        .matcher(timeline).results().map(m -> m.group(2) + " " + m.group(3) + " " + m.group(1)).toList();
    assertThat(rows).containsExactlyElementsOf(demo.timeline().stream()
        .map(e -> UnitFormat.of(UnitSystem.METRIC).clock(e.at()) + " "
            + (e.block() != null ? e.block() : e.source()) + " " + e.event()).toList());
    assertThat(rows).contains("21:31 hollow-cherry alarm", "22:42 pond pump-on",
        "22:42 hollow-cherry sprinklers-on", "08:54 pond pump-off");
    assertThat(timeline).contains("frost alarm: air 1.0 °C expected; sprinklers on at 0.0 °C air");
    assertThat(timeline).doesNotContain("creek-rome", "west-pear");
    assertThat(header.indexOf("Tonight, in time order")).isLessThan(header.indexOf("Decision support only"));
  }

  /** A block granted no water: no start time, no start marker on its chart, sprinklers off. */
  @Test
  void aBlockGrantedNoWaterShowsNoStartAnywhereOnItsSection() {
    for (String id : List.of("creek-rome", "west-pear")) {
      // What the crew reads: the decision, the actions and the chart; the rules folded under
      // "Why" keep the reasoning, a start temperature included, as it was worked out.
      String section = section(html, "block-" + id);
      section = section.substring(0, section.indexOf("<details>"));
      assertThat(section).as(id).doesNotContain("Start sprinkling", ">start ", "sprinkling</text>", "alarm")
          .contains("sprinklers off");
    }
    assertThat(section(html, "block-west-pear")).contains("sprinkling not advised");
    assertThat(section(html, "block-creek-rome")).contains("no water from pond");
  }

  /**
   * A re-plan's readings are points on every block chart: the station's air plus the block's
   * cold-air offset, from the first forecast step on (a reading before it is not drawn).
   */
  @Test
  void aReplanDrawsItsReadingsAsPointsOnEachChart() throws IOException {
    String json = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"))
        .replaceFirst("\"farm\" :", "\"now\" : \"2026-04-14T22:00-07:00\", \"readings\" : {"
            + "\"file\" : \"station-readings.csv\", \"last_at\" : \"2026-04-14T22:00-07:00\","
            + " \"stale\" : false, \"points\" : [{\"at\" : \"2026-04-14T12:00-07:00\", \"air_c\" : 14.0},"
            + " {\"at\" : \"2026-04-14T20:00-07:00\", \"air_c\" : 3.0},"
            + " {\"at\" : \"2026-04-14T21:00-07:00\", \"air_c\" : 2.0},"
            + " {\"at\" : \"2026-04-14T22:00-07:00\", \"air_c\" : 1.0}]},\n  \"farm\" :");
    PlanDocument replan = PlanJson.read(json);
    assertThat(replan.readings().points()).hasSize(4);
    String page = NightPage.html(NightPage.of(replan, UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null));
    for (PlanDocument.Block b : demo.blocks().stream().filter(PlanDocument.Block::atRisk).toList()) {
      String chart = section(page, "block-" + b.block());
      // Okabe-Ito bluish green: three points and the legend's mark.
      assertThat(count(chart, "fill:rgb(0,158,115);stroke:none")).as(b.block()).isEqualTo(4);
      assertThat(chart).contains("readings (station + block offset)");
    }
    assertThat(html).doesNotContain("readings (station");
    // hollow-cherry lies 1.0 °C below the station (demo farm.yaml): its points are 2.0, 1.0, 0.0 °C.
    assertThat(demo.block("hollow-cherry").orElseThrow().coldAirOffsetC()).isEqualTo(-1.0);
  }

  private static int count(String text, String what) {
    int n = 0;
    for (int i = text.indexOf(what); i >= 0; i = text.indexOf(what, i + 1)) {
      n++;
    }
    return n;
  }

  @Test
  void thePageFetchesNothing() {
    assertNoExternalFetch(html);
  }

  /**
   * No element or style that would load anything: no script, link, image, frame or font by
   * address, no CSS url() or import; the page forbids loading by its content security policy.
   */
  static void assertNoExternalFetch(String page) {
    assertThat(page).contains("Content-Security-Policy", "default-src 'none'");
    String lower = page.toLowerCase(java.util.Locale.ROOT);
    assertThat(lower).doesNotContain("<script", "<link", "<iframe", "<object", "<embed",
        "@import", "<img", "srcset");
    // url() only to an element of the page itself (the charts' clip paths).
    assertThat(lower).doesNotContainPattern("url\\(\\s*['\"]?[^#'\"\\s]");
    Matcher m = Pattern.compile("\\b(?:src|href|xlink:href|action|poster|data)\\s*=\\s*[\"']([^\"']*)")
        .matcher(lower);
    while (m.find()) {
      assertThat(m.group(1)).as("a reference to " + m.group(1)).startsWith("#");
    }
  }

  static String section(String page, String id) {
    int start = page.indexOf("id=\"" + id + "\"");
    assertThat(start).as(id).isNotNegative();
    int end = page.indexOf("</section>", start);
    return page.substring(start, end);
  }

  static String escape(String s) {
    return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")
        .replace("\"", "&quot;").replace("'", "&#39;").replace("=", "&#61;").replace("`", "&#96;");
  }
}
