package org.rimeward.cli;

import java.net.URI;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.time.Duration;
import java.time.LocalDate;
import java.util.concurrent.Callable;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.fetch.FetchFailedException;
import org.rimeward.fetch.FetchSource;
import org.rimeward.fetch.ForecastFetcher;
import org.rimeward.io.BadInputException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "fetch",
    description = {"Fetches tonight's forecast for the farm's point (farm.yaml's latitude and"
        + " longitude, to 4 decimals) from a public weather service and saves the response byte"
        + " for byte, with a record of the service, the URL and the time beside it. Prints the"
        + " path of the saved file. 'plan' reads it when farm.yaml says 'forecast: forecasts/'"
        + " (the newest fetched file) or with --forecast FILE.",
        "Open-Meteo is asked for the hours from noon to noon; NWS for its gridpoint data via"
        + " points/{lat},{lon}; MET Norway for its locationforecast. NWS and MET Norway ask"
        + " every client for a contact: set farm.contact in farm.yaml."},
    footer = {"", "Exit codes: 0 saved; 2 bad input (farm file, options, a folder that cannot be"
        + " written); " + ForecastFetchCommand.FETCH_FAILED + " the service could not be reached"
        + " or did not answer with a forecast (nothing was written; earlier forecasts are"
        + " untouched); 1 internal error.",
        "", "Proxy: HTTPS_PROXY (and HTTP_PROXY, NO_PROXY) are followed.",
        "", Cautions.HELP_FOOTER})
final class ForecastFetchCommand implements Callable<Integer> {
  static final int FETCH_FAILED = 5;

  @Spec CommandSpec spec;

  @Option(names = "--farm", paramLabel = "DIR", defaultValue = ".",
      description = "Farm folder holding farm.yaml (default: the current folder).")
  Path farm;

  @Option(names = "--source", paramLabel = "open-meteo|nws|met-norway", required = true,
      description = "The weather service to ask.")
  String source;

  @Option(names = "--output", paramLabel = "FILE",
      description = "Where to save the response (default: <farm>/forecasts/<source>-<UTC time>.json).")
  Path output;

  @Option(names = "--base-url", paramLabel = "URL",
      description = "Ask another host instead of the service's public one (a mirror, or a local"
          + " stand-in for tests).")
  String baseUrl;

  @Option(names = "--night", paramLabel = "YYYY-MM-DD",
      description = "Evening to fetch for (default: today in the farm's time zone; before 06:00,"
          + " the night already begun).")
  LocalDate night;

  @Option(names = "--timeout", paramLabel = "SECONDS", defaultValue = "30",
      description = "Longest wait to connect and for each answer (default: ${DEFAULT-VALUE}).")
  int timeoutSeconds;

  @Override
  public Integer call() {
    FetchSource src;
    try {
      src = FetchSource.of(source);
    } catch (IllegalArgumentException e) {
      throw new BadInputException("--source: '" + source + "' is not a service Rimeward fetches"
          + " from; use one of " + FetchSource.ids());
    }
    if (timeoutSeconds < 1 || timeoutSeconds > 600) {
      throw new BadInputException("--timeout: " + timeoutSeconds + " is outside 1 to 600 seconds");
    }
    URI base = null;
    if (baseUrl != null) {
      try {
        base = new URI(baseUrl);
      } catch (URISyntaxException e) {
        base = null;
      }
      if (base == null || !("http".equals(base.getScheme()) || "https".equals(base.getScheme()))
          || base.getHost() == null) {
        throw new BadInputException("--base-url: '" + baseUrl + "' is not an http or https URL,"
            + " e.g. https://api.open-meteo.com");
      }
    }
    Farm f = FarmLoader.load(farm);
    var clock = RimewardCommand.clock(spec);
    LocalDate evening = night != null ? night : defaultNight(f, clock.instant());
    ForecastFetcher fetcher = new ForecastFetcher(clock, Duration.ofSeconds(timeoutSeconds), System.getenv());
    try {
      ForecastFetcher.Saved saved = fetcher.fetch(f, src, base, evening, output);
      spec.commandLine().getOut().println(saved.file());
      spec.commandLine().getOut().flush();
      return Main.OK;
    } catch (FetchFailedException e) {
      spec.commandLine().getErr().println("rimeward: " + e.getMessage());
      spec.commandLine().getErr().flush();
      return FETCH_FAILED;
    }
  }

  /** Today's evening in the farm's zone; before 06:00, the night already under way. */
  static LocalDate defaultNight(Farm farm, java.time.Instant now) {
    var local = now.atZone(farm.zone());
    return local.getHour() < 6 ? local.toLocalDate().minusDays(1) : local.toLocalDate();
  }
}
