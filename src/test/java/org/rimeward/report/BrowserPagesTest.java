package org.rimeward.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.awt.image.BufferedImage;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.plan.PlanDocument;
import org.rimeward.plan.PlanJson;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * The pages in a real browser: Debian's headless Chromium loads the demo night's page and a
 * season page (invented data), with no network and a fresh profile. Checked: no console error
 * (a blocked fetch would be one, under the page's content security policy), every block at risk
 * has its chart with its start time as text in the rendered page, and a screenshot of a sensible
 * size. CI installs chromium (.ci/run); where it cannot be had, the test says so and skips.
 */
class BrowserPagesTest {
  static String chromium;
  @TempDir static Path tmp;

  @BeforeAll
  static void findChromium() {
    for (String c : List.of("chromium", "chromium-browser")) {
      for (String dir : System.getenv().getOrDefault("PATH", "/usr/bin").split(":")) {
        if (Files.isExecutable(Path.of(dir, c))) {
          chromium = Path.of(dir, c).toString();
          return;
        }
      }
    }
  }

  @Test
  void theDemoNightRendersWithEveryChartAndNoError() throws Exception {
    assumeTrue(chromium != null, "Chromium is not installed here (apt-get install chromium;"
        + " .ci/run installs it): the browser test of the pages is skipped");
    PlanDocument demo = PlanJson.read(Files.readString(
        Path.of("src/test/resources/golden/demo-plan.json")));
    Path page = tmp.resolve("night.html");
    Files.writeString(page, NightPage.html(NightPage.of(demo, UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null)));
    String dom = run(page, "--dump-dom");
    for (PlanDocument.Block b : demo.blocks()) {
      if (!b.atRisk()) {
        continue;
      }
      String section = NightPageTest.section(dom, "block-" + b.block());
      assertThat(section).as(b.block()).containsPattern("<svg[^>]*id=\"chart-" + b.block() + "\"");
      b.sprinkle().filter(s -> s.waterGranted() && s.start() != null).ifPresent(s -> {
        String start = UnitFormat.of(UnitSystem.METRIC).clock(s.start());
        assertThat(section).as(b.block()).contains(">start " + start + "<");
      });
    }
    // The night at a glance sits in the header, alarms in it, in the browser's rendering too.
    String header = dom.substring(dom.indexOf("<header>"), dom.indexOf("</header>"));
    assertThat(header).contains("id=\"timeline\"", "data-event=\"alarm\"",
        "frost alarm: air 1.0 °C expected");
    screenshot(page, 1200, 3000);
  }

  /** A re-plan's page, with readings drawn as points on the charts, renders without an error. */
  @Test
  void aReplanWithReadingsRendersItsPoints() throws Exception {
    assumeTrue(chromium != null, "Chromium is not installed here: skipped");
    String json = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"))
        .replaceFirst("\"farm\" :", "\"now\" : \"2026-04-14T22:00-07:00\", \"readings\" : {"
            + "\"file\" : \"station-readings.csv\", \"last_at\" : \"2026-04-14T22:00-07:00\","
            + " \"stale\" : false, \"points\" : [{\"at\" : \"2026-04-14T20:00-07:00\", \"air_c\" : 3.0},"
            + " {\"at\" : \"2026-04-14T22:00-07:00\", \"air_c\" : 1.0}]},\n  \"farm\" :");
    Path page = tmp.resolve("replan.html");
    Files.writeString(page, NightPage.html(NightPage.of(PlanJson.read(json),
        UnitFormat.of(UnitSystem.US), PlanDocument.Rule::explanation, Map.of(), null)));
    String dom = run(page, "--dump-dom");
    assertThat(NightPageTest.section(dom, "block-hollow-cherry"))
        .contains("readings (station + block offset)", "now 22:00 (readings to here)");
  }

  @Test
  void aSeasonPageRendersWithItsCalendarAndNoError() throws Exception {
    assumeTrue(chromium != null, "Chromium is not installed here (apt-get install chromium;"
        + " .ci/run installs it): the browser test of the pages is skipped");
    String json = Files.readString(Path.of("src/test/resources/golden/demo-plan.json"));
    List<Season.Run> runs = new ArrayList<>();
    for (int d : List.of(14, 16, 21)) {
      LocalDate night = LocalDate.of(2026, 4, d);
      runs.add(new Season.Run("run-" + d, Instant.parse("2026-04-" + (d + 1) + "T02:00:00Z"),
          PlanJson.read(json.replace("\"date\" : \"2026-04-14\"", "\"date\" : \"" + night + "\"")),
          Map.of("hollow-cherry", 9.5)));
    }
    Path page = tmp.resolve("season.html");
    Files.writeString(page, SeasonReport.html(Season.of("Quillhaven Bench Farm", runs,
        List.of(), null, null), UnitFormat.of(UnitSystem.METRIC)));
    String dom = run(page, "--dump-dom");
    // Three nights, 9.5 h recorded on each: the season shows the sum, marked as recorded.
    assertThat(dom).contains("id=\"calendar\"", "data-date=\"2026-04-14\"",
        "data-date=\"2026-04-21\"", "28.5 (recorded)");
    screenshot(page, 1000, 1400);
  }

  /** The check can fail: a page like ours that tries to fetch an image is caught in the log. */
  @Test
  void aPageThatTriesToFetchIsCaught() throws Exception {
    assumeTrue(chromium != null, "Chromium is not installed here: skipped");
    String ours = NightPage.html(NightPage.of(PlanJson.read(Files.readString(
        Path.of("src/test/resources/golden/demo-plan.json"))), UnitFormat.of(UnitSystem.METRIC),
        PlanDocument.Rule::explanation, Map.of(), null));
    Path page = tmp.resolve("fetching.html");
    Files.writeString(page, ours.replace("<main>",
        "<main><img src=\"http://127.0.0.1:9/logo.png\" alt=\"\">"));
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> run(page, "--dump-dom"))
        .isInstanceOf(AssertionError.class);
  }

  private static void screenshot(Path page, int width, int height) throws Exception {
    Path png = tmp.resolve(page.getFileName() + ".png");
    run(page, "--screenshot=" + png, "--window-size=" + width + "," + height,
        "--hide-scrollbars");
    BufferedImage img = ImageIO.read(png.toFile());
    assertThat(img.getWidth()).isEqualTo(width);
    assertThat(img.getHeight()).isEqualTo(height);
    // Not blank: a rendered page has ink on it.
    int dark = 0;
    for (int y = 0; y < height; y += 7) {
      for (int x = 0; x < width; x += 7) {
        if ((img.getRGB(x, y) & 0xff) < 100) {
          dark++;
        }
      }
    }
    assertThat(dark).isGreaterThan(200);
  }

  /** Runs headless Chromium on the page; fails on any console message of level error. */
  private static String run(Path page, String... what) throws Exception {
    Path profile = Files.createTempDirectory(tmp, "profile");
    List<String> cmd = new ArrayList<>(List.of(chromium, "--headless", "--no-sandbox",
        "--disable-gpu", "--user-data-dir=" + profile, "--enable-logging=stderr", "--v=0",
        "--no-first-run", "--disable-extensions", "--disable-background-networking",
        "--virtual-time-budget=5000"));
    cmd.addAll(List.of(what));
    cmd.add(page.toUri().toString());
    Path out = tmp.resolve("out-" + System.nanoTime());
    Path err = tmp.resolve("err-" + System.nanoTime());
    Process p = new ProcessBuilder(cmd).redirectOutput(out.toFile()).redirectError(err.toFile())
        .start();
    if (!p.waitFor(120, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      throw new AssertionError("chromium did not finish within 120 s: " + cmd);
    }
    String log = Files.readString(err, StandardCharsets.UTF_8);
    List<String> console = log.lines().filter(l -> l.contains("CONSOLE")).toList();
    assertThat(console).as("console messages").noneMatch(l -> l.contains(":ERROR:")
        || l.toLowerCase(java.util.Locale.ROOT).contains("error"));
    assertThat(log).doesNotContain("Refused to load", "Content Security Policy");
    assertThat(p.exitValue()).as(log).isZero();
    return Files.readString(out, StandardCharsets.UTF_8);
  }

  static {
    // ImageIO in a test JVM without a display.
    System.setProperty("java.awt.headless", "true");
  }

}
