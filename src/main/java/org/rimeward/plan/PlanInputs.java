package org.rimeward.plan;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Comparator;
import java.util.HexFormat;
import java.util.List;
import java.util.Objects;

/**
 * Every input that shaped a plan, with its full content, for the audit trail and replays; and
 * where the forecast, the crop profiles and the rules came from, as the plan tells the manager.
 */
public record PlanInputs(List<Input> files, ForecastUsed forecast, Folder cropProfiles, Folder rules) {
  public PlanInputs {
    files = List.copyOf(files);
    Objects.requireNonNull(forecast, "forecast");
    Objects.requireNonNull(cropProfiles, "cropProfiles");
    Objects.requireNonNull(rules, "rules");
  }

  /** The same inputs, with the forecast's notes as the planner completed them. */
  public PlanInputs withForecastNotes(List<String> notes) {
    return new PlanInputs(files, new ForecastUsed(forecast.file(), forecast.format(), notes,
        forecast.fetched()), cropProfiles, rules);
  }

  /** The same sources, with these files (one more input, such as the night's readings). */
  public PlanInputs withFiles(List<Input> more) {
    return new PlanInputs(more, forecast, cropProfiles, rules);
  }

  /** What an input is. */
  public enum Kind {
    FARM,
    FORECAST,
    CROP_PROFILE,
    RULE,
    /** The station's readings a re-plan during the night corrected the forecast with. */
    READINGS
  }

  /** One input: its kind, its name relative to its folder, and its bytes. */
  public record Input(Kind kind, String name, byte[] content) {
    public Input {
      content = content.clone();
    }

    @Override
    public byte[] content() {
      return content.clone();
    }
  }

  /** Where a data folder was taken from. */
  public enum Origin {
    /** named by {@code --crop-profiles} or {@code --rules} */
    OPTION("option"),
    /** named in farm.yaml */
    FARM_FILE("farm.yaml"),
    /** {@code crop-profiles/} or {@code rules/} beside farm.yaml */
    FARM_FOLDER("farm folder"),
    /** the copy bundled with Rimeward */
    BUNDLED("bundled");

    private final String label;

    Origin(String label) {
      this.label = label;
    }

    public String label() {
      return label;
    }
  }

  /**
   * A folder of crop profiles or rules as used.
   *
   * @param shown the folder as the manager knows it: relative to the farm folder when inside it,
   *     "(bundled)" for the bundled copy, else as given
   * @param sha256 a digest over the names and contents of the files read, in name order
   */
  public record Folder(Origin origin, String shown, String sha256) {
    public Folder {
      Objects.requireNonNull(origin, "origin");
      Objects.requireNonNull(shown, "shown");
      Objects.requireNonNull(sha256, "sha256");
    }

    /** The first 12 hex digits: enough to tell two sets apart at a glance. */
    public String shortHash() {
      return sha256.substring(0, 12);
    }
  }

  /**
   * The forecast as used.
   *
   * @param file the file's name as planned from (relative to the farm folder when inside it)
   * @param format the format it was recognised as, e.g. {@code open-meteo}
   * @param notes how it was read: interpolation, coarse values, a converted time zone
   * @param fetched what {@code forecast fetch} recorded beside the file; null for a file saved
   *     by hand
   */
  public record ForecastUsed(String file, String format, List<String> notes, Fetched fetched) {
    public ForecastUsed {
      Objects.requireNonNull(file, "file");
      Objects.requireNonNull(format, "format");
      notes = List.copyOf(notes);
    }
  }

  /**
   * Where and when a fetched forecast came from.
   *
   * @param url the URL asked, without secrets
   * @param unchanged whether the file's bytes are still those fetched (by SHA-256)
   */
  public record Fetched(String source, String url, java.time.Instant fetchedAt, String sha256,
      boolean unchanged) {
    public Fetched {
      Objects.requireNonNull(source, "source");
      Objects.requireNonNull(url, "url");
      Objects.requireNonNull(fetchedAt, "fetchedAt");
      Objects.requireNonNull(sha256, "sha256");
    }
  }

  /** The digest of one kind of input: SHA-256 over each file's name, a NUL, its bytes' SHA-256. */
  static String digest(List<Input> files, Kind kind) {
    try {
      MessageDigest all = MessageDigest.getInstance("SHA-256");
      for (Input in : files.stream().filter(f -> f.kind() == kind)
          .sorted(Comparator.comparing(Input::name)).toList()) {
        all.update(in.name().getBytes(StandardCharsets.UTF_8));
        all.update((byte) 0);
        all.update(MessageDigest.getInstance("SHA-256").digest(in.content));
      }
      return HexFormat.of().formatHex(all.digest());
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }
}
