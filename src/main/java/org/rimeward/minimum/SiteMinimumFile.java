package org.rimeward.minimum;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.Locale;
import org.rimeward.io.AtomicFiles;
import org.rimeward.io.BadInputException;

/** {@code <farm>/site-minimum.yaml}: the fitted model with where it came from. */
public final class SiteMinimumFile {
  public static final String NAME = "site-minimum.yaml";
  private static final ObjectMapper YAML = new ObjectMapper(new YAMLFactory());

  private SiteMinimumFile() {}

  /** SHA-256 of a file's bytes, lower-case hex: how the model names the history it came from. */
  public static String sha256Hex(byte[] bytes) {
    try {
      return java.util.HexFormat.of().formatHex(
          java.security.MessageDigest.getInstance("SHA-256").digest(bytes));
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java runtime has SHA-256", e);
    }
  }

  public static Path in(Path farmFolder) {
    return farmFolder.resolve(NAME);
  }

  /** Writes the model atomically: a reader sees the old file or the new one, never half. */
  public static void write(Path file, SiteMinimumModel m) throws IOException {
    double[][] v = m.xtxInv();
    StringBuilder s = new StringBuilder();
    s.append("# The site's own minimum-temperature model, written by 'rimeward minimum fit'.\n")
        .append("# FAO 2005 (Snyder & de Melo-Abreu, Frost Protection, ch. 6, after Allen 1957):\n")
        .append("#   min_air_c = a * T0 + b * Td0 + c, with T0 and Td0 read two hours after sunset,\n")
        .append("# valid on clear calm (radiation) nights only. Decision support only: thermometers\n")
        .append("# at bud height decide. Fit again when the station or the history changes.\n")
        .append("method: fao-2005-site-minimum\n")
        .append(f("a: %s\n", m.a())).append(f("b: %s\n", m.b())).append(f("c: %s\n", m.c()))
        .append("nights: ").append(m.nights()).append('\n')
        .append(f("residual_sd_c: %s\n", m.residualSdC()))
        .append(f("r_squared: %s\n", m.rSquared()))
        .append("history:\n")
        .append("  file: ").append(quote(m.historyName())).append('\n')
        .append("  sha256: ").append(m.historySha256()).append('\n')
        .append("  station: ").append(quote(m.station())).append('\n')
        .append("  from: ").append(m.from()).append('\n')
        .append("  to: ").append(m.to()).append('\n')
        .append("criteria: ").append(quote(m.criteria())).append('\n')
        .append(f("t0_range_c: [%s, %s]\n", m.rangeT0C()[0], m.rangeT0C()[1]))
        .append(f("td0_range_c: [%s, %s]\n", m.rangeTd0C()[0], m.rangeTd0C()[1]))
        .append("# (X^T X)^-1 of the fit, order 1, T0, Td0: for the prediction interval.\n")
        .append("xtx_inv:\n");
    for (double[] row : v) {
      s.append(f("  - [%s, %s, %s]\n", row[0], row[1], row[2]));
    }
    AtomicFiles.writeString(file, s.toString());
  }

  private static String f(String format, double... values) {
    Object[] text = new Object[values.length];
    for (int i = 0; i < values.length; i++) {
      text[i] = Double.toString(values[i]);
    }
    return String.format(Locale.ROOT, format, text);
  }

  private static String quote(String s) {
    return "\"" + s.replace("\\", "\\\\").replace("\"", "\\\"") + "\"";
  }

  /** Reads the model; a missing or damaged file is bad input naming what to do. */
  public static SiteMinimumModel read(Path file) {
    JsonNode n;
    try {
      n = YAML.readTree(Files.readAllBytes(file));
    } catch (NoSuchFileException e) {
      throw BadInputException.at(file.toString(), "no site-minimum model; fit one first with"
          + " 'rimeward minimum fit --farm DIR --history FILE'");
    } catch (IOException e) {
      throw BadInputException.at(file.toString(), "not readable as YAML (" + e.getMessage()
          + "); fit the model again with 'rimeward minimum fit'");
    }
    try {
      JsonNode h = need(n, "history", file);
      double[][] v = new double[3][3];
      JsonNode rows = need(n, "xtx_inv", file);
      for (int i = 0; i < 3; i++) {
        for (int j = 0; j < 3; j++) {
          v[i][j] = number(rows.path(i).path(j), "xtx_inv", file);
        }
      }
      return new SiteMinimumModel(number(n.path("a"), "a", file), number(n.path("b"), "b", file),
          number(n.path("c"), "c", file), (int) number(n.path("nights"), "nights", file),
          number(n.path("residual_sd_c"), "residual_sd_c", file),
          number(n.path("r_squared"), "r_squared", file), v,
          LocalDate.parse(need(h, "from", file).asText()), LocalDate.parse(need(h, "to", file).asText()),
          need(h, "sha256", file).asText(), h.path("file").asText(""), h.path("station").asText(""),
          n.path("criteria").asText(""), pair(n, "t0_range_c", file), pair(n, "td0_range_c", file));
    } catch (DateTimeParseException | IllegalArgumentException e) {
      throw BadInputException.at(file.toString(), e.getMessage() + "; fit the model again with"
          + " 'rimeward minimum fit'");
    }
  }

  private static JsonNode need(JsonNode n, String key, Path file) {
    JsonNode v = n == null ? null : n.get(key);
    if (v == null || v.isNull()) {
      throw BadInputException.at(file.toString(), "'" + key + "' is missing; fit the model again"
          + " with 'rimeward minimum fit'");
    }
    return v;
  }

  private static double number(JsonNode v, String key, Path file) {
    if (!v.isNumber()) {
      throw BadInputException.at(file.toString(), "'" + key + "' must be a number, was '"
          + v.asText() + "'; fit the model again with 'rimeward minimum fit'");
    }
    return v.asDouble();
  }

  private static double[] pair(JsonNode n, String key, Path file) {
    JsonNode v = need(n, key, file);
    return new double[] {number(v.path(0), key, file), number(v.path(1), key, file)};
  }
}
