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
   * The readings a re-plan used.
   *
   * @param file the readings file's name
   * @param lastAt the latest reading at or before now, of the station used
   * @param biasC mean observed − forecast air temperature over the last hour, °C (NaN: unknown)
   * @param dewBiasC the same for the dew point (NaN: unknown)
   * @param stations every station in the file (the empty id: the file names none)
   * @param station the station planned by
   * @param method the correction method's stable name
   * @param methodText the method in words
   * @param rows usable rows read
   * @param skipped messages of the rows skipped
   * @param stale whether no reading falls in the last {@link ReadingsSummary#STALE_AFTER_MIN}
   *     minutes before now
   * @param siteMinimum the site model's minimum beside the forecast's, when it applies
   * @param points the station's air readings over the planned window up to now, in time order
   */
  public record ReadingsSummary(String file, Optional<Instant> lastAt, double biasC, double dewBiasC,
      List<String> stations, String station, String method, String methodText, int rows,
      List<String> skipped, boolean stale, Optional<SiteMinimum> siteMinimum, List<Point> points) {
    /** No reading for this long is stale: the station or its logger has failed (common practice). */
    public static final int STALE_AFTER_MIN = 60;

    public ReadingsSummary {
      stations = List.copyOf(stations);
      skipped = List.copyOf(skipped);
      points = List.copyOf(points);
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
