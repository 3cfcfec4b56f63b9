package org.rimeward.weather;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.HexFormat;
import java.util.Objects;
import java.util.Optional;

/**
 * What {@code forecast fetch} knew about a response it saved: the service, the URL asked (without
 * secrets), when, for which night, and the SHA-256 of the bytes. It is kept beside the response
 * as {@code <name>.fetch.json}, so the response itself stays byte for byte what the service sent.
 *
 * @param url the URL of the response saved; for NWS the gridpoint URL the points answer named
 * @param pointsUrl NWS only: the points URL asked first; null otherwise
 */
public record FetchRecord(String source, String url, String pointsUrl, Instant fetchedAt,
    LocalDate night, String sha256) {
  private static final ObjectMapper JSON = JsonMapper.builder().build();

  public FetchRecord {
    Objects.requireNonNull(source, "source");
    Objects.requireNonNull(url, "url");
    Objects.requireNonNull(fetchedAt, "fetchedAt");
    Objects.requireNonNull(night, "night");
    Objects.requireNonNull(sha256, "sha256");
  }

  /** Where the record of {@code response} is kept. */
  public static Path fileFor(Path response) {
    String name = response.getFileName().toString();
    String base = name.endsWith(".json") ? name.substring(0, name.length() - 5) : name;
    return response.resolveSibling(base + ".fetch.json");
  }

  public static String sha256(byte[] bytes) {
    try {
      return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }

  public byte[] toJson() {
    ObjectNode o = JSON.createObjectNode();
    o.put("source", source);
    o.put("url", url);
    if (pointsUrl != null) {
      o.put("points_url", pointsUrl);
    }
    o.put("fetched_at", fetchedAt.toString());
    o.put("night", night.toString());
    o.put("sha256", sha256);
    try {
      return (JSON.writerWithDefaultPrettyPrinter().writeValueAsString(o) + "\n").getBytes(StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
  }

  /**
   * The record kept beside {@code response}, if there is one that can be read. A record that is
   * damaged is ignored rather than trusted: the response alone still plans.
   */
  public static Optional<FetchRecord> besides(Path response) {
    Path f = fileFor(response);
    if (!Files.isRegularFile(f)) {
      return Optional.empty();
    }
    try {
      JsonNode o = JSON.readTree(Files.readAllBytes(f));
      String points = o.path("points_url").isTextual() ? o.path("points_url").asText() : null;
      return Optional.of(new FetchRecord(o.path("source").asText(), o.path("url").asText(), points,
          Instant.parse(o.path("fetched_at").asText()), LocalDate.parse(o.path("night").asText()),
          o.path("sha256").asText()));
    } catch (IOException | DateTimeParseException | NullPointerException e) {
      return Optional.empty();
    }
  }
}
