package org.rimeward.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.rimeward.crop.CropLibrary;
import org.rimeward.farm.Farm;
import org.rimeward.farm.Station;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.RuleThresholds;
import org.rimeward.rules.facts.Thresholds;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastStep;
import org.rimeward.weather.Reading;
import org.rimeward.weather.Readings;

/**
 * Re-plans the rest of a night from the stations' readings. The farm, forecast, crop profiles and
 * rules are read once; each {@link #replan} costs only the corrections and the rules, so a watch
 * can re-plan every few minutes.
 */
public final class Replanner {
  private final Farm farm;
  private final Forecast forecast;
  private final CropLibrary crops;
  private final RuleBook book;
  private final PlanInputs inputs;
  private final LocalDate night;
  private final Instant sunset;
  private final Instant sunrise;
  private final NightPlanner planner;
  private final SiteMinimumStep siteMinimum;
  private final Thresholds thresholds;
  private Map<String, Basis> lastBasis = Map.of();
  private Map<String, Reading> lastReading = Map.of();

  private Replanner(Farm farm, Forecast forecast, CropLibrary crops, RuleBook book,
      PlanInputs inputs, LocalDate night, NightPlanner planner) {
    this.farm = farm;
    this.forecast = forecast;
    this.crops = crops;
    this.book = book;
    this.inputs = inputs;
    this.night = night;
    this.planner = planner;
    Night sun = SunCalculator.night(farm.latitude(), farm.longitude(), night, farm.zone());
    this.sunset = sun.sunset().map(ZonedDateTime::toInstant).orElseThrow(() -> new BadInputException(
        farm.origin() + ": the sun does not set on " + night + "; Rimeward plans nights with a sunset"));
    this.sunrise = sun.sunrise().map(ZonedDateTime::toInstant).orElseThrow(() -> new BadInputException(
        farm.origin() + ": the sun does not rise after " + night + "; Rimeward plans nights with a sunrise"));
    this.thresholds = RuleThresholds.of(book);
    this.siteMinimum = SiteMinimumStep.forFarm(farm, RadiationNightCriteria.of(thresholds));
  }

  /** Reads everything but the readings. */
  public static Replanner load(PlanRequest request, NightPlanner.RuleBookSource rules) {
    NightPlanner planner = new NightPlanner(rules);
    NightPlanner.Read r = planner.read(request);
    LocalDate night = r.night() != null ? r.night() : NightPlanner.defaultNight(r.forecast(), r.farm());
    return new Replanner(r.farm(), r.forecast(), r.crops(), r.book(), r.inputs(), night, planner);
  }

  public Farm farm() {
    return farm;
  }

  /**
   * The thresholds the rule files set (rule THRESHOLDS), for what judges the night beside the
   * plan: the watch's alarms, the site model's radiation-night criteria.
   */
  public Thresholds thresholds() {
    return thresholds;
  }

  public LocalDate night() {
    return night;
  }

  public Instant sunrise() {
    return sunrise;
  }

  public Instant sunset() {
    return sunset;
  }

  /**
   * What a block was planned by in the latest re-plan: the station whose readings corrected it,
   * its corrected forecast, and the cold-air offset to add to that forecast and to the station's
   * readings for the block's air (none where the station hangs in the block).
   */
  public record Basis(String station, Forecast forecast, double coldAirOffsetC) {}

  /**
   * The plan for the rest of the night from {@code now}, each block's forecast corrected by the
   * readings of its station ({@link ReadingsByStation}); {@code station}, when given, stands for
   * every block.
   */
  public Plan replan(Readings readings, byte[] readingsBytes, Instant now, Optional<String> station) {
    ReadingsByStation split = ReadingsByStation.of(farm, readings, station,
        rows -> ForecastCorrection.apply(forecast, rows, now, sunrise).biasC());
    // The site model predicts the minimum where its history was logged: that station, else the
    // main one.
    String siteStation = siteMinimum.station().filter(id -> !split.overridden()
        && !farm.stations().isEmpty() && split.sources().stream()
            .anyMatch(x -> x.id().equals(id) && !x.blocks().isEmpty())).orElse(split.main());
    Map<String, NightPlanner.BlockWeather> byBlock = new HashMap<>();
    Map<String, Basis> basis = new HashMap<>();
    List<NightUpdate.StationSummary> stations = new ArrayList<>();
    Forecast nightForecast = forecast;
    ForecastCorrection.Corrected main = null;
    Optional<NightUpdate.SiteMinimum> site = Optional.empty();
    boolean anyStale = false;
    Map<String, Reading> latest = new HashMap<>();
    for (ReadingsByStation.Source src : split.sources()) {
      src.readings().stream().filter(x -> !x.time().isAfter(now)).reduce((x, y) -> y)
          .ifPresent(x -> latest.put(src.id(), x));
      // A station hanging in blocks is measured against the forecast at the first of them (with
      // its cold-air offset): a thermometer in a known cold pocket is not "colder than forecast"
      // by the pocket's offset every night. The default station stands at the forecast point.
      double ownOffset = src.listed().isEmpty() ? 0
          : farm.block(src.listed().get(0)).orElseThrow().coldAirOffsetC();
      Map<Double, ForecastCorrection.Corrected> byOffset = new HashMap<>();
      Function<Double, ForecastCorrection.Corrected> correct = o -> byOffset.computeIfAbsent(o,
          x -> ForecastCorrection.apply(x == 0 ? forecast : shifted(forecast, x), src.readings(),
              now, sunrise));
      ForecastCorrection.Corrected own = correct.apply(ownOffset);
      boolean stale = own.lastAt().map(t -> Duration.between(t, now).toMinutes()
          > thresholds.staleAfterMin()).orElse(true);
      stations.add(summary(src, own, stale, points(src.readings(), now)));
      if (src.id().equals(split.main())) {
        main = own;
        nightForecast = own.forecast();
      }
      if (src.blocks().isEmpty()) {
        continue;
      }
      anyStale |= stale;
      Optional<NightUpdate.SiteMinimum> s = src.id().equals(siteStation)
          ? siteMinimum.apply(src.readings(), night, sunset, sunrise, now, own) : Optional.empty();
      Optional<NightUpdate.SiteMinimum> curve = s.filter(NightUpdate.SiteMinimum::usedSite);
      Map<Double, Forecast> planned = new HashMap<>();
      Function<Double, Forecast> plannedAt = o -> planned.computeIfAbsent(o,
          x -> followed(correct.apply(x).forecast(), curve, now));
      if (src.id().equals(split.main())) {
        nightForecast = plannedAt.apply(ownOffset);
      }
      if (src.id().equals(siteStation)) {
        site = s;
      }
      for (String id : src.blocks()) {
        double offset = farm.block(id).orElseThrow().coldAirOffsetC();
        // A thermometer hanging in the block reads the block's air: its readings correct the
        // block's forecast (with the block's offset), and nothing is added after. Other blocks
        // keep their offset against the station.
        boolean listed = src.listed().contains(id);
        Forecast f = plannedAt.apply(listed ? offset : 0.0);
        double add = listed ? 0 : offset;
        byBlock.put(id, new NightPlanner.BlockWeather(f, add));
        basis.put(id, new Basis(src.id(), f, add));
      }
    }
    lastBasis = Map.copyOf(basis);
    lastReading = Map.copyOf(latest);
    List<PlanInputs.Input> files = new ArrayList<>(inputs.files());
    files.add(new PlanInputs.Input(PlanInputs.Kind.READINGS,
        readings.file().getFileName().toString(), readingsBytes));
    Plan plan = planner.plan(farm, nightForecast, byBlock, crops, book, night,
        inputs.withFiles(files));
    NightUpdate.ReadingsSummary summary = new NightUpdate.ReadingsSummary(
        readings.file().getFileName().toString(), main.lastAt(), main.biasC(), main.dewBiasC(),
        stations, split.main(), ForecastCorrection.METHOD, ForecastCorrection.METHOD_TEXT,
        readings.readings().size(), readings.skipped().stream().map(Readings.Skipped::message)
            .toList(), anyStale, thresholds.staleAfterMin(), site,
        stations.stream().filter(st -> st.id().equals(split.main())).findFirst()
            .map(NightUpdate.StationSummary::points).orElse(List.of()));
    return plan.withUpdate(new NightUpdate(now, summary, List.of()));
  }

  private Forecast followed(Forecast corrected, Optional<NightUpdate.SiteMinimum> curve,
      Instant now) {
    return curve.map(x -> siteMinimum.curve(corrected, x, sunset, sunrise, now)).orElse(corrected);
  }

  /** The forecast at a block {@code offsetC} colder or warmer than the forecast point. */
  private static Forecast shifted(Forecast f, double offsetC) {
    List<ForecastStep> steps = new ArrayList<>();
    for (ForecastStep s : f.steps()) {
      double air = s.airTempC() + offsetC;
      steps.add(new ForecastStep(s.time(), s.offset(), air, Math.min(s.dewPointC(), air), s.windMs(),
          s.windHeightM(), s.cloudPct(), s.solarWm2(), s.line()));
    }
    return new Forecast(f.file(), steps);
  }

  /**
   * What the page charts beside the forecast: a station's air readings up to now, from the
   * window's first forecast step (the chart starts there).
   */
  private List<NightUpdate.Point> points(List<Reading> rows, Instant now) {
    Instant from = forecast.steps().isEmpty() ? Instant.MIN : forecast.steps().get(0).time();
    return rows.stream().filter(r -> !r.time().isAfter(now) && !r.time().isBefore(from))
        .map(r -> new NightUpdate.Point(r.time(), r.airTempC())).toList();
  }

  private static NightUpdate.StationSummary summary(ReadingsByStation.Source src,
      ForecastCorrection.Corrected c, boolean stale, List<NightUpdate.Point> points) {
    return new NightUpdate.StationSummary(src.id(), src.declared().isPresent(),
        src.declared().map(Station::isDefault).orElse(false),
        src.declared().map(Station::heightM).orElse(Double.NaN),
        src.declared().flatMap(st -> st.budHeightM().isPresent()
            ? Optional.of(st.budHeightM().getAsDouble()) : Optional.empty()).orElse(Double.NaN),
        src.blocks(), src.readings().size(), c.lastAt(), c.biasC(), c.dewBiasC(), stale,
        src.note(), src.listed(), points);
  }

  /** A station's latest reading at or before the latest {@link #replan}'s now. */
  public Optional<Reading> latestReading(String station) {
    return Optional.ofNullable(lastReading.get(station));
  }

  /** What each block was planned by in the latest {@link #replan}; empty before any. */
  public Optional<Basis> basis(String blockId) {
    return Optional.ofNullable(lastBasis.get(blockId));
  }
}
