package org.rimeward.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import org.rimeward.crop.CropLibrary;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Loaded;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;
import org.rimeward.rules.RuleBook;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastReader;
import org.rimeward.weather.Reading;
import org.rimeward.weather.Readings;

/**
 * Re-plans the rest of a night from the station's readings. The farm, forecast, crop profiles and
 * rules are read once; each {@link #replan} costs only the correction and the rules, so a watch
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
  private Forecast lastForecast;

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
    this.siteMinimum = SiteMinimumStep.forFarm(farm);
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
   * The plan for the rest of the night from {@code now}, with the forecast corrected by the
   * readings of {@code station} (empty: the coldest station, by its offset over the last hour).
   */
  public Plan replan(Readings readings, byte[] readingsBytes, Instant now, Optional<String> station) {
    List<String> stations = readings.stations();
    String used = station.orElseGet(() -> coldest(readings, now));
    if (!stations.isEmpty() && !stations.contains(used)) {
      throw new BadInputException("--station: '" + used + "' has no readings in "
          + readings.file().getFileName() + "; stations there: " + String.join(", ", stations));
    }
    List<Reading> of = readings.of(used);
    ForecastCorrection.Corrected c = ForecastCorrection.apply(forecast, of, now, sunrise);
    Forecast planned = c.forecast();
    Optional<NightUpdate.SiteMinimum> site = siteMinimum.apply(of, night, sunset, sunrise, now, c);
    if (site.isPresent() && site.get().usedSite()) {
      planned = siteMinimum.curve(planned, site.get(), sunset, sunrise, now);
    }
    lastForecast = planned;
    List<PlanInputs.Input> files = new ArrayList<>(inputs.files());
    files.add(new PlanInputs.Input(PlanInputs.Kind.READINGS,
        readings.file().getFileName().toString(), readingsBytes));
    Plan plan = planner.plan(farm, planned, crops, book, night, inputs.withFiles(files));
    boolean stale = c.lastAt().map(t -> Duration.between(t, now).toMinutes()
        > NightUpdate.ReadingsSummary.STALE_AFTER_MIN).orElse(true);
    NightUpdate.ReadingsSummary summary = new NightUpdate.ReadingsSummary(
        readings.file().getFileName().toString(), c.lastAt(), c.biasC(), c.dewBiasC(), stations, used,
        ForecastCorrection.METHOD, ForecastCorrection.METHOD_TEXT, readings.readings().size(),
        readings.skipped().stream().map(Readings.Skipped::message).toList(), stale, site,
        // What the page charts beside the forecast: the readings of the planned window to now.
        of.stream().filter(r -> !r.time().isBefore(plan.night().forecastStart()) && !r.time().isAfter(now))
            .map(r -> new NightUpdate.Point(r.time(), r.airTempC())).toList());
    return plan.withUpdate(new NightUpdate(now, summary, List.of()));
  }

  /** The corrected forecast the latest {@link #replan} planned by (the forecast before any). */
  public Forecast lastForecast() {
    return lastForecast != null ? lastForecast : forecast;
  }

  /** The station whose readings run coldest against the forecast over the last hour. */
  private String coldest(Readings readings, Instant now) {
    List<String> stations = readings.stations();
    if (stations.size() <= 1) {
      return stations.isEmpty() ? "" : stations.get(0);
    }
    return stations.stream().min(Comparator.comparingDouble(s -> {
      double b = ForecastCorrection.apply(forecast, readings.of(s), now, sunrise).biasC();
      return Double.isNaN(b) ? Double.MAX_VALUE : b;
    })).orElseThrow();
  }
}
