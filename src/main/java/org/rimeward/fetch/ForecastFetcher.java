package org.rimeward.fetch;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.json.JsonMapper;
import java.io.IOException;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.net.ConnectException;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.net.http.HttpTimeoutException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Map;
import java.util.Objects;
import org.rimeward.BuildInfo;
import org.rimeward.farm.Farm;
import org.rimeward.io.AtomicFiles;
import org.rimeward.io.BadInputException;
import org.rimeward.weather.FetchRecord;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastFiles;
import org.rimeward.weather.ForecastFormat;
import org.rimeward.weather.Site;

/**
 * Fetches the night's forecast for a farm's point from a public weather service and saves the
 * response byte for byte, with a {@link FetchRecord} beside it. The response is read as a
 * forecast before anything is written, so a failed or unexpected answer leaves every earlier
 * forecast as it was.
 */
public final class ForecastFetcher {
  /** Folder under the farm folder where fetched forecasts go. */
  public static final String FOLDER = "forecasts";
  private static final String OPEN_METEO_HOURLY =
      "temperature_2m,dew_point_2m,wind_speed_10m,cloud_cover,shortwave_radiation";

  private final Clock clock;
  private final Duration timeout;
  private final Proxies proxies;
  private final HttpClient client;

  /** A saved response: where, and what was recorded about it. */
  public record Saved(Path file, FetchRecord record) {}

  /**
   * @param timeout the longest wait to connect and for each answer
   * @param env the environment whose proxy settings are followed
   */
  public ForecastFetcher(Clock clock, Duration timeout, Map<String, String> env) {
    this.clock = Objects.requireNonNull(clock, "clock");
    this.timeout = Objects.requireNonNull(timeout, "timeout");
    this.proxies = (Proxies) Proxies.fromEnvironment(env);
    this.client = HttpClient.newBuilder().connectTimeout(timeout).proxy(proxies)
        .followRedirects(HttpClient.Redirect.NORMAL).build();
  }

  /**
   * Fetches the forecast for the night of {@code night} (noon to noon where the service takes
   * hours) and saves it to {@code output}, or to {@code <farm>/forecasts/<source>-<UTC time>.json}.
   */
  public Saved fetch(Farm farm, FetchSource source, URI base, LocalDate night, Path output) {
    String userAgent = userAgent(farm, source);
    URI root = base != null ? base : source.baseUrl();
    String lat = degrees(farm.latitude());
    String lon = degrees(farm.longitude());
    Instant at = clock.instant();
    URI url;
    URI pointsUrl = null;
    byte[] body;
    switch (source) {
      case OPEN_METEO -> {
        url = resolve(root, "/v1/forecast?latitude=" + lat + "&longitude=" + lon + "&hourly="
            + OPEN_METEO_HOURLY + "&timezone=" + URLEncoder.encode(farm.zone().getId(), StandardCharsets.UTF_8)
            + "&start_hour=" + night + "T12:00&end_hour=" + night.plusDays(1) + "T12:00");
        body = get(source, url, userAgent, "application/json");
      }
      case NWS -> {
        pointsUrl = resolve(root, "/points/" + lat + "," + lon);
        byte[] points = get(source, pointsUrl, userAgent, "application/geo+json");
        url = gridUrl(source, pointsUrl, points, root);
        body = get(source, url, userAgent, "application/geo+json");
      }
      case MET_NORWAY -> {
        url = resolve(root, "/weatherapi/locationforecast/2.0/complete?lat=" + lat + "&lon=" + lon
            + "&altitude=" + Math.round(farm.elevationM()));
        body = get(source, url, userAgent, "application/json");
      }
      default -> throw new IllegalStateException(source.toString());
    }
    String name = ForecastFiles.fetchedName(source.id(), at);
    Path target = output != null ? output : farm.folder().resolve(FOLDER).resolve(name);
    check(source, url, target, body, farm);
    FetchRecord record = new FetchRecord(source.id(), Urls.withoutSecrets(url),
        pointsUrl == null ? null : Urls.withoutSecrets(pointsUrl), at, night, FetchRecord.sha256(body));
    try {
      Path dir = target.toAbsolutePath().getParent();
      Files.createDirectories(dir);
      // The record first: a response never sits in the folder without it.
      AtomicFiles.write(FetchRecord.fileFor(target), record.toJson());
      AtomicFiles.write(target, body);
    } catch (IOException e) {
      throw new BadInputException(target + ": cannot write the forecast there (" + e.getMessage()
          + "); check the folder exists and can be written, or give --output FILE", e);
    }
    return new Saved(target, record);
  }

  /** Rimeward and its version, with the farm's contact where the service asks for one. */
  static String userAgent(Farm farm, FetchSource source) {
    if (source.wantsContact() && farm.contact().isEmpty()) {
      throw BadInputException.at(farm.origin().toString(), "farm.contact is needed: " + source.label()
          + " asks every client to give a contact (an e-mail address or web page) in its"
          + " User-Agent; add a line such as 'contact: orchard-office@example.org' under farm:");
    }
    return "Rimeward/" + BuildInfo.version() + farm.contact().map(c -> " (" + c + ")").orElse("");
  }

  /** Decimal degrees to at most four decimals (about 11 m), as the services ask. */
  static String degrees(double d) {
    return BigDecimal.valueOf(d).setScale(4, RoundingMode.HALF_UP).stripTrailingZeros().toPlainString();
  }

  private static URI resolve(URI root, String pathAndQuery) {
    String r = root.toString();
    return URI.create((r.endsWith("/") ? r.substring(0, r.length() - 1) : r) + pathAndQuery);
  }

  private byte[] get(FetchSource source, URI url, String userAgent, String accept) {
    HttpRequest request = HttpRequest.newBuilder(url).timeout(timeout).GET()
        .header("User-Agent", userAgent).header("Accept", accept).build();
    HttpResponse<byte[]> response;
    String shown = Urls.withoutSecrets(url);
    String proxy = proxies.describe(url);
    String via = proxy == null ? "no proxy" : "proxy " + proxy;
    try {
      response = client.send(request, HttpResponse.BodyHandlers.ofByteArray());
    } catch (HttpTimeoutException e) {
      throw new FetchFailedException(source.label() + ": no answer within " + timeout.toSeconds()
          + " s from " + shown + " (" + via + "); nothing was written. Check the connection and"
          + " try again, or allow longer with --timeout.", e);
    } catch (ConnectException e) {
      throw new FetchFailedException(source.label() + ": cannot connect to " + url.getHost()
          + (url.getPort() > 0 ? ":" + url.getPort() : "") + " (" + via + "); nothing was written."
          + " Check the network, HTTPS_PROXY, or --base-url.", e);
    } catch (IOException e) {
      throw new FetchFailedException(source.label() + ": the request to " + shown + " failed ("
          + e.getClass().getSimpleName() + (e.getMessage() != null ? ": " + e.getMessage() : "")
          + ", " + via + "); nothing was written. Try again in a few minutes.", e);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new FetchFailedException(source.label() + ": interrupted; nothing was written.", e);
    }
    int status = response.statusCode();
    if (status != 200) {
      throw new FetchFailedException(source.label() + ": HTTP " + status + " from " + shown
          + "; nothing was written. " + advice(source, status));
    }
    return response.body();
  }

  private static String advice(FetchSource source, int status) {
    if (status == 429) {
      return "The service's rate limit was reached: wait before fetching again (see its terms in"
          + " the README), and fetch once an evening.";
    }
    if (status == 403 && source.wantsContact()) {
      return "The service refused the request; it refuses clients whose User-Agent gives no"
          + " usable contact: check farm.contact in farm.yaml.";
    }
    if (status == 404 || status == 400) {
      return "Check the farm's latitude and longitude (" + source.label() + " may not cover the"
          + " point) and --base-url if given.";
    }
    if (status >= 500) {
      return "The service has a problem on its side: try again in a few minutes.";
    }
    return "Try again later; if it persists, check --base-url and the service's status page.";
  }

  private static URI gridUrl(FetchSource source, URI pointsUrl, byte[] points, URI root) {
    String grid;
    try {
      JsonNode p = JsonMapper.builder().build().readTree(points);
      grid = p.path("properties").path("forecastGridData").asText("");
    } catch (IOException e) {
      grid = "";
    }
    if (grid.isEmpty()) {
      throw new FetchFailedException(source.label() + ": the answer from "
          + Urls.withoutSecrets(pointsUrl) + " names no forecastGridData; nothing was written. The"
          + " point may be outside the NWS area (the United States and its territories); try"
          + " --source open-meteo.");
    }
    URI gridUri = URI.create(grid);
    // A stand-in or mirror given with --base-url answers with the public host in its links.
    String publicRoot = source.baseUrl().toString();
    if (!root.equals(source.baseUrl()) && grid.startsWith(publicRoot)) {
      gridUri = resolve(root, grid.substring(publicRoot.length()));
    }
    return gridUri;
  }

  private static void check(FetchSource source, URI url, Path target, byte[] body, Farm farm) {
    ForecastFormat expected = switch (source) {
      case OPEN_METEO -> ForecastFormat.OPEN_METEO;
      case NWS -> ForecastFormat.NWS_GRIDPOINT;
      case MET_NORWAY -> ForecastFormat.MET_NORWAY;
    };
    Forecast f;
    try {
      f = ForecastFiles.parse(target, new Site(farm.latitude(), farm.longitude(), farm.zone()), body);
    } catch (BadInputException e) {
      throw new FetchFailedException(source.label() + ": HTTP 200 from " + Urls.withoutSecrets(url)
          + " but not the forecast expected (" + e.getMessage() + "); nothing was written. Try"
          + " again later; if it persists, the service may have changed its format.", e);
    }
    if (f.format() != expected) {
      throw new FetchFailedException(source.label() + ": HTTP 200 from " + Urls.withoutSecrets(url)
          + " but the answer reads as " + f.format().id() + ", not " + expected.id() + "; nothing"
          + " was written. Check --base-url.");
    }
  }
}
