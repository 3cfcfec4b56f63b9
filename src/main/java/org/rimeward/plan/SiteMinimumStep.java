package org.rimeward.plan;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rimeward.farm.Farm;
import org.rimeward.io.BadInputException;
import org.rimeward.minimum.NightSample;
import org.rimeward.minimum.RadiationNights;
import org.rimeward.minimum.SiteMinimumFile;
import org.rimeward.minimum.SiteMinimumModel;
import org.rimeward.physics.CoolingCurve;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.ForecastStep;
import org.rimeward.weather.Reading;

/**
 * The site model's minimum in a re-plan (FAO 2005 ch. 6): once the readings reach two hours after
 * sunset on a clear calm night, the farm's own model predicts the minimum from T0 and Td0 there.
 * By default the plan follows the colder of that and the corrected forecast's minimum; the
 * model file may say {@code use: site} or {@code use: forecast} instead. Followed, the air from the
 * latest reading to sunrise takes the book's square-root cooling curve down to the site minimum
 * (anchored at the latest reading rather than at sunset + 2 h, so it starts where the air is), and
 * after sunrise the difference fades as {@link ForecastCorrection#weight} does.
 */
final class SiteMinimumStep {
  enum Use { COLDER, SITE, FORECAST }

  private final Optional<SiteMinimumModel> model;
  private final Use use;
  private final RadiationNights.Criteria criteria;

  private SiteMinimumStep(Optional<SiteMinimumModel> model, Use use,
      RadiationNights.Criteria criteria) {
    this.model = model;
    this.use = use;
    this.criteria = criteria;
  }

  /** The farm's model, if it has one, judging tonight by the rule files' {@code criteria}. */
  static SiteMinimumStep forFarm(Farm farm, RadiationNights.Criteria criteria) {
    Path file = SiteMinimumFile.in(farm.folder());
    if (!Files.isRegularFile(file)) {
      return new SiteMinimumStep(Optional.empty(), Use.COLDER, criteria);
    }
    Use use = Use.COLDER;
    try {
      String word = new ObjectMapper(new YAMLFactory()).readTree(Files.readAllBytes(file))
          .path("use").asText("colder");
      use = switch (word) {
        case "colder" -> Use.COLDER;
        case "site" -> Use.SITE;
        case "forecast" -> Use.FORECAST;
        default -> throw new BadInputException(file + ": use: '" + word + "' is not a choice;"
            + " write colder (the default), site or forecast");
      };
    } catch (IOException e) {
      throw new BadInputException(file + ": not readable (" + e.getMessage() + ")", e);
    }
    return new SiteMinimumStep(Optional.of(SiteMinimumFile.read(file)), use, criteria);
  }

  /** The station the model was fitted to (empty: its history named none); empty without a model. */
  Optional<String> station() {
    return model.map(SiteMinimumModel::station);
  }

  Optional<NightUpdate.SiteMinimum> apply(List<Reading> readings, java.time.LocalDate night,
      Instant sunset, Instant sunrise, Instant now, ForecastCorrection.Corrected c) {
    if (model.isEmpty() || !now.isBefore(sunrise)) {
      return Optional.empty();
    }
    Optional<NightSample> tonight = RadiationNights.tonight(readings, night, sunset, now, criteria);
    if (tonight.isEmpty()) {
      return Optional.empty();
    }
    NightSample s = tonight.get();
    SiteMinimumModel m = model.get();
    double site = m.minAirC(s.airC(), s.dewC());
    double forecastMin = c.forecast().steps().stream()
        .filter(x -> x.time().isAfter(now) && !x.time().isAfter(sunrise))
        .mapToDouble(ForecastStep::airTempC).min().orElse(Double.NaN);
    if (s.excluded().isPresent()) {
      return Optional.of(new NightUpdate.SiteMinimum(s.airC(), s.dewC(), site, m.halfWidthC(s.airC(),
          s.dewC()), forecastMin, false, "not used: tonight is not a radiation night ("
          + s.excluded().get() + ")"));
    }
    boolean followSite = switch (use) {
      case SITE -> true;
      case FORECAST -> false;
      case COLDER -> Double.isNaN(forecastMin) || site < forecastMin;
    };
    String why = String.format(Locale.ROOT, "site model %.1f °C from T0 %.1f °C, Td0 %.1f °C at"
        + " sunset + 2 h; corrected forecast %.1f °C; planning by %s (%s)", site, s.airC(), s.dewC(),
        forecastMin, followSite ? "the site model, with the square-root cooling curve to sunrise"
            : "the forecast", use == Use.COLDER ? "the colder of the two" : "use: " + use.name()
            .toLowerCase(Locale.ROOT));
    return Optional.of(new NightUpdate.SiteMinimum(s.airC(), s.dewC(), site,
        m.halfWidthC(s.airC(), s.dewC()), forecastMin, followSite, why));
  }

  /** The forecast with the site model's cooling curve from the latest reading to sunrise. */
  Forecast curve(Forecast f, NightUpdate.SiteMinimum site, Instant sunset, Instant sunrise,
      Instant now) {
    ForecastStep anchor = null;
    for (ForecastStep s : f.steps()) {
      if (!s.time().isAfter(now)) {
        anchor = s;
      }
    }
    if (anchor == null || !anchor.time().isBefore(sunrise)) {
      return f;
    }
    double startC = Math.max(anchor.airTempC(), site.siteMinC());
    CoolingCurve curve = new CoolingCurve(startC, site.siteMinC(), anchor.time(), sunrise);
    double shiftAtSunrise = Double.isNaN(site.forecastMinC()) ? 0 : site.siteMinC() - site.forecastMinC();
    List<ForecastStep> out = new ArrayList<>();
    for (ForecastStep s : f.steps()) {
      if (!s.time().isAfter(anchor.time())) {
        out.add(s);
        continue;
      }
      double air = !s.time().isAfter(sunrise) ? curve.tempAtC(s.time())
          : s.airTempC() + shiftAtSunrise * ForecastCorrection.weight(s.time(), sunrise);
      out.add(new ForecastStep(s.time(), s.offset(), air, Math.min(s.dewPointC(), air), s.windMs(),
          s.windHeightM(), s.cloudPct(), s.solarWm2(), s.line()));
    }
    return new Forecast(f.file(), out);
  }
}
