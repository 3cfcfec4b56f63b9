package org.rimeward.weather;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Loaded;
import org.rimeward.io.TextFile;

/**
 * Reads a forecast file of any known format, recognised by its content (see
 * {@link ForecastFormat}), and finds the newest fetched forecast in a folder.
 */
public final class ForecastFiles {
  /** {@code <source>-<UTC time>.json}, as {@code forecast fetch} names what it writes. */
  public static final DateTimeFormatter FETCHED_TIME =
      DateTimeFormatter.ofPattern("yyyyMMdd'T'HHmmss'Z'", Locale.ROOT);
  private static final Pattern FETCHED = Pattern.compile("([a-z-]+)-(\\d{8}T\\d{6}Z)\\.json");

  private ForecastFiles() {}

  /** Reads {@code file}, whatever its known format, for the farm's point and zone. */
  public static Loaded<Forecast> readWithContent(Path file, Site site) {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(site, "site");
    TextFile text = TextFile.read(file, TextFile.MAX_TABLE_BYTES, "forecast file", "put the night's"
        + " forecast there, name it in farm.yaml (forecast: ...), or fetch one with 'rimeward"
        + " forecast fetch'");
    return new Loaded<>(parse(file, site, text), text.bytes());
  }

  /** Parses bytes already read, as {@link #readWithContent} does. */
  public static Forecast parse(Path file, Site site, byte[] bytes) {
    return parse(file, site, TextFile.decode(file.toString(), bytes));
  }

  private static Forecast parse(Path file, Site site, TextFile text) {
    String name = file.toString();
    JsonNode json = JsonInput.parseIfJson(name, text.text());
    if (json == null) {
      return ForecastReader.parse(file, text, site.zone());
    }
    if (OpenMeteoReader.matches(json)) {
      return OpenMeteoReader.read(file, json, site);
    }
    if (NwsGridpointReader.matches(json)) {
      return NwsGridpointReader.read(file, json, site);
    }
    if (MetNorwayReader.matches(json)) {
      return MetNorwayReader.read(file, json, site);
    }
    String hint = json.path("properties").has("forecastGridData")
        ? " This is the NWS points response; the forecast is at the forecastGridData URL it names"
            + " ('rimeward forecast fetch --source nws' follows it)."
        : json.path("properties").has("periods")
            ? " This is the NWS text forecast; Rimeward reads the gridpoint data (forecastGridData)."
            : "";
    throw BadInputException.at(name, "is JSON but not a forecast format Rimeward knows." + hint
        + " Known formats:\n" + ForecastFormat.known());
  }

  /**
   * The file a farm's {@code forecast:} names: the file itself, or for a folder the newest
   * forecast {@code forecast fetch} wrote there (by the UTC time in its name).
   */
  public static Path resolve(Path fileOrFolder) {
    if (!Files.isDirectory(fileOrFolder)) {
      return fileOrFolder;
    }
    return newestFetched(fileOrFolder).orElseThrow(() -> BadInputException.at(
        fileOrFolder.toString(), "no fetched forecast in this folder (files named like"
            + " open-meteo-20250415T180000Z.json); run 'rimeward forecast fetch --farm DIR"
            + " --source open-meteo|nws|met-norway' first, or name a forecast file"));
  }

  /** The newest {@code <source>-<UTC time>.json} in {@code folder}, if any. */
  public static Optional<Path> newestFetched(Path folder) {
    try (Stream<Path> list = Files.list(folder)) {
      return list.filter(Files::isRegularFile)
          .filter(p -> fetchedAt(p).isPresent())
          .max(Comparator.comparing((Path p) -> fetchedAt(p).orElseThrow())
              .thenComparing(p -> p.getFileName().toString()));
    } catch (IOException e) {
      throw new BadInputException(folder + ": cannot list the forecast folder: " + e.getMessage(), e);
    }
  }

  /** The fetch time in a fetched forecast's name. */
  public static Optional<Instant> fetchedAt(Path file) {
    Matcher m = FETCHED.matcher(file.getFileName().toString());
    if (!m.matches()) {
      return Optional.empty();
    }
    try {
      return Optional.of(LocalDateTime.parse(m.group(2), FETCHED_TIME).toInstant(ZoneOffset.UTC));
    } catch (DateTimeParseException e) {
      return Optional.empty();
    }
  }

  /** The name {@code forecast fetch} gives a response fetched from {@code source} at {@code at}. */
  public static String fetchedName(String source, Instant at) {
    return source + "-" + FETCHED_TIME.format(at.atOffset(ZoneOffset.UTC)) + ".json";
  }

  static List<String> knownIds() {
    return Stream.of(ForecastFormat.values()).map(ForecastFormat::id).toList();
  }
}
