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
