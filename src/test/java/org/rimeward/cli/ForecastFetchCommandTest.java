package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.sun.net.httpserver.HttpExchange;
import com.sun.net.httpserver.HttpServer;
import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditStore;
import org.rimeward.audit.RecordedInput;
import org.rimeward.audit.RunRecord;

/**
 * {@code forecast fetch} against a stand-in for each service on the loopback, answering with
 * recorded responses (the demo night's invented values in each service's structure). Nothing
 * here reaches a real service.
 */
class ForecastFetchCommandTest {
  static final Path RESPONSES = Path.of("src/test/resources/forecasts");
  /** 16:30 PDT on the demo evening. */
  static final Clock CLOCK = Clock.fixed(Instant.parse("2026-04-14T23:30:00Z"), ZoneOffset.UTC);

  @TempDir Path tmp;
  Path farm;
  HttpServer server;
  String base;
  final Map<String, String> seen = new ConcurrentHashMap<>();

  @BeforeEach
  void start() throws IOException {
    farm = Files.createDirectories(tmp.resolve("farm"));
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(Path.of("demo-farm/farm.yaml"))
        .replace("  timezone: America/Los_Angeles", "  timezone: America/Los_Angeles\n  contact: frost-desk@quillhaven.example")
        .replace("forecast: forecast.csv", "forecast: forecasts/"));
    server = HttpServer.create(new InetSocketAddress(InetAddress.getLoopbackAddress(), 0), 0);
    serve("/v1/forecast", 200, RESPONSES.resolve("demo-night-open-meteo.json"));
    server.createContext("/points/", ex -> {
      record(ex);
      reply(ex, 200, ("{\"properties\": {\"gridId\": \"PDT\", \"forecastGridData\":"
          + " \"https://api.weather.gov/gridpoints/PDT/101,52\"}}").getBytes(StandardCharsets.UTF_8));
    });
    serve("/gridpoints/PDT/101,52", 200, RESPONSES.resolve("demo-night-nws-gridpoint.json"));
    serve("/weatherapi/locationforecast/2.0/complete", 200, RESPONSES.resolve("demo-night-met-norway.json"));
    server.createContext("/busy/", ex -> reply(ex, 503, "busy".getBytes(StandardCharsets.UTF_8)));
    server.createContext("/html/", ex -> reply(ex, 200, "<html>maintenance</html>".getBytes(StandardCharsets.UTF_8)));
    server.createContext("/slow/", ex -> {
      try {
        Thread.sleep(3000);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      reply(ex, 200, new byte[0]);
    });
    server.setExecutor(java.util.concurrent.Executors.newCachedThreadPool());
    server.start();
    base = "http://127.0.0.1:" + server.getAddress().getPort();
  }

  @AfterEach
  void stop() {
    server.stop(0);
  }

  void serve(String path, int status, Path body) {
    server.createContext(path, ex -> {
      record(ex);
      reply(ex, status, Files.readAllBytes(body));
    });
  }

  void record(HttpExchange ex) {
    seen.put(ex.getRequestURI().getPath(), ex.getRequestURI().getRawQuery() + "\n"
        + ex.getRequestHeaders().getFirst("User-Agent"));
  }

  static void reply(HttpExchange ex, int status, byte[] body) throws IOException {
    ex.getResponseHeaders().add("Content-Type", "application/json");
    ex.sendResponseHeaders(status, body.length == 0 ? -1 : body.length);
    try (var out = ex.getResponseBody()) {
      out.write(body);
    }
  }

  Cli.Result fetch(String source, String... extra) {
    List<String> args = new java.util.ArrayList<>(List.of("forecast", "fetch", "--farm",
        farm.toString(), "--source", source, "--base-url", base));
    args.addAll(List.of(extra));
    return Cli.run(CLOCK, args.toArray(String[]::new));
  }

  @Test
  void openMeteoIsAskedForTheFarmsPointNoonToNoonAndItsBytesAreSavedAndPlanned() throws Exception {
    Cli.Result r = fetch("open-meteo");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    Path saved = farm.resolve("forecasts/open-meteo-20260414T233000Z.json");
    assertThat(r.out().strip()).isEqualTo(saved.toString());
    assertThat(Files.readAllBytes(saved)).isEqualTo(Files.readAllBytes(RESPONSES.resolve("demo-night-open-meteo.json")));
    String request = seen.get("/v1/forecast");
    assertThat(request).contains("latitude=46.28&longitude=-119.45")
        .contains("temperature_2m").contains("dew_point_2m").contains("wind_speed_10m").contains("cloud_cover")
        .contains("timezone=America%2FLos_Angeles")
        .contains("start_hour=2026-04-14T12:00&end_hour=2026-04-15T12:00")
        .contains("\nRimeward/").contains("(frost-desk@quillhaven.example)");

    // farm.yaml says forecast: forecasts/, so plan takes the newest fetched file; the trail keeps
    // its exact bytes and where they came from.
    Cli.Result plan = Cli.run(CLOCK, "plan", "--farm", farm.toString());
    assertThat(plan.exitCode()).as(plan.toString()).isZero();
    assertThat(plan.out()).contains("Inputs: forecast forecasts/open-meteo-20260414T233000Z.json"
        + " (open-meteo, fetched 2026-04-14 23:30 UTC)");
    try (AuditStore store = AuditStore.openReadOnly(farm.resolve("audit.db"))) {
      RunRecord run = store.loadRun(store.listRuns(Optional.empty(), Optional.empty()).get(0).runId()).orElseThrow();
      RecordedInput in = run.inputs().stream().filter(i -> i.name().equals(saved.getFileName().toString()))
          .findFirst().orElseThrow();
      assertThat(in.content()).isEqualTo(Files.readAllBytes(saved));
      JsonNode fetched = new ObjectMapper().readTree(run.planJson()).path("inputs").path("forecast").path("fetched");
      assertThat(fetched.path("source").asText()).isEqualTo("open-meteo");
      assertThat(fetched.path("url").asText()).startsWith(base + "/v1/forecast?latitude=46.28");
      assertThat(fetched.path("fetched_at").asText()).isEqualTo("2026-04-14T23:30:00Z");
      assertThat(fetched.path("unchanged").asBoolean()).isTrue();
    }
    assertThat(plan.err()).isEmpty();
    // The next evening, an old fetched file still plans its own night, with a caution.
    Cli.Result stale = Cli.run(Clock.offset(CLOCK, java.time.Duration.ofHours(20)), "plan", "--farm",
        farm.toString(), "--no-audit");
    assertThat(stale.exitCode()).isZero();
    assertThat(stale.out()).contains("night of 2026-04-14");
    assertThat(stale.err()).contains("fetched 20 h ago, for the night of 2026-04-14");
  }

  @Test
  void nwsAsksThePointsThenTheGridpointDataItNames() throws Exception {
    Cli.Result r = fetch("nws", "--output", tmp.resolve("nws.json").toString());
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(seen).containsKey("/points/46.28,-119.45").containsKey("/gridpoints/PDT/101,52");
    assertThat(seen.get("/gridpoints/PDT/101,52")).contains("Rimeward/").contains("frost-desk@quillhaven.example");
    assertThat(Files.readAllBytes(tmp.resolve("nws.json")))
        .isEqualTo(Files.readAllBytes(RESPONSES.resolve("demo-night-nws-gridpoint.json")));
    assertThat(Files.readString(tmp.resolve("nws.fetch.json"))).contains("\"points_url\" : \"" + base + "/points/46.28,-119.45\"");
    Cli.Result plan = Cli.run(CLOCK, "plan", "--farm", farm.toString(), "--forecast",
        tmp.resolve("nws.json").toString(), "--no-audit", "--format", "json");
    assertThat(plan.exitCode()).as(plan.toString()).isZero();
    assertThat(plan.out()).contains("\"format\" : \"nws\"").contains("skyCover (up to 6 h)");
  }

  @Test
  void metNorwayIsAskedWithTheFarmsAltitude() {
    Cli.Result r = fetch("met-norway");
    assertThat(r.exitCode()).as(r.toString()).isZero();
    assertThat(seen.get("/weatherapi/locationforecast/2.0/complete")).startsWith("lat=46.28&lon=-119.45&altitude=240");
  }

  @Test
  void aServiceThatAsksForAContactIsNotAskedWithoutOne() throws IOException {
    Files.writeString(farm.resolve("farm.yaml"), Files.readString(farm.resolve("farm.yaml"))
        .replace("  contact: frost-desk@quillhaven.example\n", ""));
    Cli.Result r = fetch("nws");
    assertThat(r.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(r.err()).contains("farm.yaml").contains("farm.contact is needed").contains("NWS");
    assertThat(seen).isEmpty();
    assertThat(fetch("open-meteo").exitCode()).isZero();
  }

  @Test
  void failuresLeaveEarlierForecastsUntouchedAndSayWhatToTry() throws Exception {
    assertThat(fetch("open-meteo").exitCode()).isZero();
    Path forecasts = farm.resolve("forecasts");
    List<String> before = list(forecasts);
    byte[] earlier = Files.readAllBytes(forecasts.resolve("open-meteo-20260414T233000Z.json"));
    Clock later = Clock.offset(CLOCK, java.time.Duration.ofHours(1));
    String farmArg = farm.toString();

    Cli.Result busy = Cli.run(later, "forecast", "fetch", "--farm", farmArg, "--source", "open-meteo",
        "--base-url", base + "/busy");
    assertThat(busy.exitCode()).isEqualTo(ForecastFetchCommand.FETCH_FAILED);
    assertThat(busy.err()).contains("Open-Meteo: HTTP 503").contains("nothing was written").contains("try again");

    Cli.Result html = Cli.run(later, "forecast", "fetch", "--farm", farmArg, "--source", "open-meteo",
        "--base-url", base + "/html");
    assertThat(html.exitCode()).isEqualTo(ForecastFetchCommand.FETCH_FAILED);
    assertThat(html.err()).contains("HTTP 200").contains("not the forecast expected");

    Cli.Result slow = Cli.run(later, "forecast", "fetch", "--farm", farmArg, "--source", "open-meteo",
        "--base-url", base + "/slow", "--timeout", "1");
    assertThat(slow.exitCode()).isEqualTo(ForecastFetchCommand.FETCH_FAILED);
    assertThat(slow.err()).contains("no answer within 1 s").contains("--timeout");

    int closed;
    try (ServerSocket s = new ServerSocket(0, 1, InetAddress.getLoopbackAddress())) {
      closed = s.getLocalPort();
    }
    Cli.Result refused = Cli.run(later, "forecast", "fetch", "--farm", farmArg, "--source", "nws",
        "--base-url", "http://127.0.0.1:" + closed);
    assertThat(refused.exitCode()).isEqualTo(ForecastFetchCommand.FETCH_FAILED);
    assertThat(refused.err()).contains("NWS").contains("cannot connect to 127.0.0.1:" + closed);

    assertThat(list(forecasts)).isEqualTo(before);
    assertThat(Files.readAllBytes(forecasts.resolve("open-meteo-20260414T233000Z.json"))).isEqualTo(earlier);
  }

  @Test
  void badOptionsAreBadInput() {
    assertThat(fetch("weather-channel").err()).contains("--source").contains("open-meteo, nws, met-norway");
    Cli.Result url = Cli.run(CLOCK, "forecast", "fetch", "--farm", farm.toString(), "--source",
        "open-meteo", "--base-url", "ftp://example.org");
    assertThat(url.exitCode()).isEqualTo(Main.BAD_INPUT);
    assertThat(url.err()).contains("--base-url");
  }

  private static List<String> list(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }
}
