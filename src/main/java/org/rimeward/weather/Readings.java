package org.rimeward.weather;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;

/**
 * The readings of a station file, in time order per station, and the rows that were skipped. A
 * logger glitch costs one row, never the night: a bad row is skipped with its reason and counted.
 *
 * @param file the readings file
 * @param readings every usable reading, in file order (time order within each station)
 * @param skipped the rows left out, with line and reason
 */
public record Readings(Path file, List<Reading> readings, List<Skipped> skipped) {
  public Readings {
    Objects.requireNonNull(file, "file");
    readings = List.copyOf(readings);
    skipped = List.copyOf(skipped);
  }

  /** A row left out: its line and why, written as a message the grower can act on. */
  public record Skipped(int line, String message) {}

  /** The station ids present, sorted; the empty id is the farm's default station. */
  public List<String> stations() {
    return List.copyOf(new TreeSet<>(readings.stream().map(Reading::station).toList()));
  }

  /** The readings of one station (the empty id: the file's unnamed station), in time order. */
  public List<Reading> of(String station) {
    return readings.stream().filter(r -> r.station().equals(station)).toList();
  }

  /** The latest reading at or before {@code now}, of any station. */
  public Optional<Reading> latestAtOrBefore(Instant now) {
    return readings.stream().filter(r -> !r.time().isAfter(now))
        .max(java.util.Comparator.comparing(Reading::time));
  }
}
