package org.rimeward.plan;

import java.time.Instant;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What a re-plan during the night adds to a plan: the time it was made for, what the station's
 * readings showed and how they corrected the forecast, and what changed since the latest recorded
 * run for the night.
 *
 * @param now the time the rest of the night is planned from
 * @param readings the readings and the correction
 * @param changes decisions that moved since the previous recorded run, block by block
 */
public record NightUpdate(Instant now, ReadingsSummary readings, List<Change> changes) {
  public NightUpdate {
    Objects.requireNonNull(now, "now");
    Objects.requireNonNull(readings, "readings");
    changes = List.copyOf(changes);
  }

  public NightUpdate withChanges(List<Change> c) {
    return new NightUpdate(now, readings, c);
  }

  /**
   * The readings a re-plan used. The top-level figures are the main station's: the farm's default
   * station, or the one planned by when farm.yaml declares none; each station's are in
   * {@link #stations}.
   *
   * @param file the readings file's name
   * @param lastAt the latest reading at or before now, of the main station
   * @param biasC mean observed − forecast air temperature over the last hour, °C (NaN: unknown)
   * @param dewBiasC the same for the dew point (NaN: unknown)
   * @param stations every station in the file or in farm.yaml, with the blocks each stands for
   * @param station the main station (the empty id: the file names none)
   * @param method the correction method's stable name
   * @param methodText the method in words
   * @param rows usable rows read
   * @param skipped messages of the rows skipped
   * @param stale whether a station that stands for a block has no reading in the last
   *     {@code staleAfterMin} minutes before now
   * @param staleAfterMin the rule files' stale limit (rule THRESHOLDS)
   * @param siteMinimum the site model's minimum beside the forecast's, when it applies
   * @param points the station's air readings over the planned window up to now, in time order
   */
  public record ReadingsSummary(String file, Optional<Instant> lastAt, double biasC, double dewBiasC,
      List<StationSummary> stations, String station, String method, String methodText, int rows,
      List<String> skipped, boolean stale, int staleAfterMin, Optional<SiteMinimum> siteMinimum,
      List<Point> points) {
    public ReadingsSummary {
      stations = List.copyOf(stations);
      skipped = List.copyOf(skipped);
      points = List.copyOf(points);
    }

    /** The station whose readings corrected {@code blockId}'s forecast, if any did. */
    public Optional<StationSummary> stationOf(String blockId) {
      return stations.stream().filter(s -> s.blocks().contains(blockId)).findFirst();
    }

    /** The stations that stand for at least one block. */
    public List<StationSummary> planning() {
      return stations.stream().filter(s -> !s.blocks().isEmpty()).toList();
    }
  }

  /**
   * One station's readings in a re-plan.
   *
   * @param id the station's id (empty: the file names none)
   * @param declared whether farm.yaml declares it; an undeclared station's rows are not used
   * @param isDefault whether it stands for the blocks no station lists
   * @param hangsIn the blocks farm.yaml lists for it: it hangs in them, so its readings are their
   *     air, with no cold-air offset added
   * @param points its air readings over the planned window up to now, in time order
   * @param heightM its thermometer's height above the ground, m (NaN: not declared)
   * @param budHeightM the height of its blocks' lowest buds, m (NaN: not given)
   * @param blocks the blocks whose forecast its readings corrected
   * @param rows its usable rows
   * @param lastAt its latest reading at or before now
   * @param biasC its mean observed − forecast air over the last hour, °C (NaN: unknown)
   * @param dewBiasC the same for the dew point
   * @param stale whether it has no reading in the last the rule files' stale limit
   * @param note what the grower should know about it (empty: nothing)
   */
  public record StationSummary(String id, boolean declared, boolean isDefault, double heightM,
      double budHeightM, List<String> blocks, int rows, Optional<Instant> lastAt, double biasC,
      double dewBiasC, boolean stale, String note, List<String> hangsIn, List<Point> points) {
    public StationSummary {
      Objects.requireNonNull(id, "id");
      blocks = List.copyOf(blocks);
      hangsIn = List.copyOf(hangsIn);
      points = List.copyOf(points);
      Objects.requireNonNull(lastAt, "lastAt");
      Objects.requireNonNull(note, "note");
    }
  }

  /** One reading of the air at the station, °C. */
  public record Point(Instant at, double airC) {}

  /**
   * The site model's minimum beside the forecast's (FAO 2005 ch. 6).
   *
   * @param t0C air at sunset + 2 h, °C
   * @param td0C dew point at sunset + 2 h, °C
   * @param siteMinC the site model's minimum, °C
   * @param forecastMinC the corrected forecast's minimum before sunrise, °C
   * @param usedSite whether the plan follows the site model (the colder, or the policy's choice)
   * @param why in words
   */
  public record SiteMinimum(double t0C, double td0C, double siteMinC, double intervalHalfC,
      double forecastMinC, boolean usedSite, String why) {}

  /** One decision that moved: {@code what} is start, stop, covers or status. */
  public record Change(String blockId, String what, String before, String after, String text) {}
}
