package org.rimeward.plan;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Stream;
import org.rimeward.crop.CropLibrary;
import org.rimeward.crop.EffectiveProfile;
import org.rimeward.crop.EffectiveStage;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.farm.Policy;
import org.rimeward.farm.Station;
import org.rimeward.farm.Target;
import org.rimeward.farm.WaterSource;
import org.rimeward.io.BadInputException;
import org.rimeward.io.Loaded;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;
import org.rimeward.rules.RuleBook;
import org.rimeward.rules.facts.BlockFact;
import org.rimeward.rules.facts.BlockSets;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.NightFact;
import org.rimeward.rules.facts.PolicyFact;
import org.rimeward.rules.facts.StationFact;
import org.rimeward.rules.facts.StopBasis;
import org.rimeward.rules.facts.StopBeyondForecast;
import org.rimeward.rules.facts.TargetBasis;
import org.rimeward.rules.facts.WaterSourceFact;
import org.rimeward.water.IrrigationSet;
import org.rimeward.weather.CoarseSpan;
import org.rimeward.weather.FetchRecord;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastFiles;
import org.rimeward.weather.ForecastStep;
import org.rimeward.weather.Interpolation;
import org.rimeward.weather.Site;

/**
 * The nightly decision run: reads the farm, the forecast, the crop profiles and the rules,
 * computes each block's night with the physics core, lets the rules decide, and assembles the
 * plan. It reads no clock: the night comes from the request or the forecast.
 */
public final class NightPlanner {
  /** The forecast must reach this far past sunrise, so a stop time can be found. */
  static final Duration AFTER_SUNRISE = Duration.ofHours(1);

  private final RuleBookSource rules;

  /** How the planner gets its compiled rules: compiled anew, or from a cache. */
  @FunctionalInterface
  public interface RuleBookSource {
    RuleBook load(Path rulesDir);
  }

  public NightPlanner() {
    this(RuleBook::load);
  }

  public NightPlanner(RuleBookSource rules) {
    this.rules = rules;
  }

  public Plan plan(PlanRequest request) {
    Read r = read(request);
    return plan(r.farm(), r.forecast(), r.crops(), r.book(), r.night(), r.inputs());
  }

  /**
   * Everything a run reads, each file once: the bytes planned from are the bytes the audit trail
   * keeps.
   *
   * @param night the evening asked for, or the one a fetched forecast was fetched for; null when
   *     neither says, for the caller to take from the forecast
   */
  public record Read(Farm farm, Forecast forecast, CropLibrary crops, RuleBook book,
      PlanInputs inputs, LocalDate night) {}

  /** Reads the farm, the forecast, the crop profiles and the rules a request names. */
  public Read read(PlanRequest request) {
    Loaded<Farm> farmFile = FarmLoader.loadWithContent(request.farmDir());
    Farm farm = farmFile.value();
    Path forecastFile = ForecastFiles.resolve(
        request.forecastFile() != null ? request.forecastFile() : farm.forecastFile());
    Loaded<Forecast> forecastRead = ForecastFiles.readWithContent(forecastFile, site(farm));
    Forecast forecast = forecastRead.value();
    // The farm folder is the unit: its own profiles and rules, else the bundled ones; never
    // whatever folder the run happens to start in.
    DataFolder profiles = DataFolder.choose(request.cropProfilesDir(), farm.ownCropProfiles(),
        Farm.DEFAULT_CROP_PROFILES, farm);
    DataFolder ruleDir = DataFolder.choose(request.rulesDir(), farm.ownRules(), Farm.DEFAULT_RULES, farm);
    CropLibrary crops = CropLibrary.load(profiles.dir());
    RuleBook book = rules.load(ruleDir.dir());
    Optional<FetchRecord> fetched = FetchRecord.besides(forecastFile);
    PlanInputs inputs = inputsOf(farm, farmFile.content(), forecast, forecastRead.content(),
        profiles, ruleDir, book, fetched);
    // A fetched forecast knows the evening it was fetched for; a file saved by hand does not.
    LocalDate night = request.night() != null ? request.night()
        : fetched.map(FetchRecord::night).orElse(null);
    return new Read(farm, forecast, crops, book, inputs, night);
  }

  /** The farm's point and zone, as the forecast readers check them. */
  public static Site site(Farm farm) {
    return new Site(farm.latitude(), farm.longitude(), farm.zone());
  }

  /** Plans a night from inputs already read. */
  public Plan plan(Farm farm, Forecast forecast, CropLibrary crops, RuleBook book, LocalDate night,
      PlanInputs inputs) {
    return plan(farm, forecast, Map.of(), crops, book, night, inputs);
  }

  /**
   * The forecast one block is planned by when it is not the night's (a re-plan corrects each
   * block by its own station's readings), and the cold-air offset still to add to it.
   */
  record BlockWeather(Forecast forecast, double coldAirOffsetC) {}

  /**
   * Plans a night from inputs already read; a block named in {@code byBlock} is planned by its
   * own forecast, the others by {@code forecast}, which also gives the night's coldest air.
   */
  Plan plan(Farm farm, Forecast forecast, Map<String, BlockWeather> byBlock, CropLibrary crops,
      RuleBook book, LocalDate night, PlanInputs inputs) {
    String forecastName = forecast.file().getFileName().toString();
    LocalDate date = night != null ? night : defaultNight(forecast, farm);
    Night sun = SunCalculator.night(farm.latitude(), farm.longitude(), date, farm.zone());
    Instant sunset = sun.sunset().map(ZonedDateTime::toInstant).orElseThrow(() -> new BadInputException(
        farm.origin() + ": the sun does not set at latitude " + farm.latitude() + " on " + date
            + "; Rimeward plans nights that have a sunset and a sunrise"));
    Instant sunrise = sun.sunrise().map(ZonedDateTime::toInstant).orElseThrow(() -> new BadInputException(
        farm.origin() + ": the sun does not rise at latitude " + farm.latitude() + " on "
            + date.plusDays(1) + "; Rimeward plans nights that have a sunset and a sunrise"));
    List<String> forecastNotes = new ArrayList<>(inputs.forecast().notes());
    List<ForecastStep> window = window(forecast, forecastName, farm, date, sunset, sunrise,
        forecastNotes);
    inputs = inputs.withForecastNotes(forecastNotes);

    double pressureKPa = Atmosphere.stationPressureKPa(farm.elevationM());
    NightFact nightFact = new NightFact(date, farm.zone(), sunset, sunrise, pressureKPa);
    PolicyFact policy = policyFact(farm.policy());
    List<Object> facts = new ArrayList<>();
    facts.add(nightFact);
    facts.add(policy);
    for (WaterSource w : farm.waterSources()) {
      facts.add(new WaterSourceFact(w.id(), w.maxFlowM3H(), w.volumeM3().orElse(Double.NaN)));
    }
    for (Station st : farm.stations()) {
      List<String> standsFor = farm.blocks().stream().map(Block::id)
          .filter(id -> farm.stationOf(id).filter(st::equals).isPresent()).toList();
      facts.add(new StationFact(st.id(), st.heightM(), st.budHeightM().orElse(Double.NaN),
          String.join(", ", standsFor)));
    }
    Map<String, BlockFact> blockFacts = new HashMap<>();
    Map<String, BlockNight> nights = new HashMap<>();
    // Blocks of one crop and variety share a profile, and blocks of one site and forecast their
    // physics.
    Map<List<String>, EffectiveProfile> profiles = new HashMap<>();
    Map<Forecast, BlockPhysics.Memo> physics = new IdentityHashMap<>();
    Map<Forecast, List<ForecastStep>> windows = new IdentityHashMap<>();
    windows.put(forecast, window);
    for (Block b : farm.blocks()) {
      BlockWeather weather = byBlock.getOrDefault(b.id(), new BlockWeather(forecast,
          b.coldAirOffsetC()));
      List<ForecastStep> steps = windows.computeIfAbsent(weather.forecast(), f -> window(f,
          forecastName, farm, date, sunset, sunrise));
      BlockFact bf = blockFact(b, weather.coldAirOffsetC(), crops, profiles);
      BlockNight bn = BlockPhysics.compute(b, weather.coldAirOffsetC(), bf.t10C(), bf.t90C(), steps,
          pressureKPa, forecastName, physics.computeIfAbsent(weather.forecast(),
              f -> new BlockPhysics.Memo()));
      blockFacts.put(b.id(), bf);
      nights.put(b.id(), bn);
      facts.add(bf);
      facts.add(bn);
      b.sprinklers().filter(sp -> !sp.sets().isEmpty()).ifPresent(sp -> facts.add(new BlockSets(b.id(),
          sp.sets().stream().map(x -> new IrrigationSet(x.id(), x.areaHa(), x.flowM3H())).toList())));
    }
    RuleBook.Outcome outcome = book.run(facts, farm.zone());
    List<StopBeyondForecast> beyond = outcome.all(StopBeyondForecast.class);
    if (!beyond.isEmpty()) {
      StopBeyondForecast first = beyond.stream().min(Comparator.comparing(StopBeyondForecast::blockId)).get();
      throw new BadInputException(forecastName + ": the forecast ends at "
          + first.forecastEnd().atZone(farm.zone()).toLocalTime() + " while the wet bulb on block "
          + first.blockId() + " is still below the stop threshold; extend the forecast into the"
          + " late morning so the plan can say when sprinkling may stop");
    }
    return PlanAssembly.assemble(farm, forecast, nightFact, window, blockFacts, nights, outcome,
        inputs);
  }

  /** The evening a forecast belongs to: a run after midnight still plans the night before. */
  static LocalDate defaultNight(Forecast forecast, Farm farm) {
    return forecast.start().atZone(farm.zone()).minusHours(12).toLocalDate();
  }

  /**
   * The forecast steps of the night: from the last step at or before sunset (or the first step,
   * on a late run) to the first step at or after noon the next day, when frost is over; checked
   * for gaps and for reaching past sunrise.
   */
  static List<ForecastStep> window(Forecast forecast, String name, Farm farm, LocalDate date,
      Instant sunset, Instant sunrise) {
    return window(forecast, name, farm, date, sunset, sunrise, new ArrayList<>());
  }

  /** As above, adding to {@code notes} what the plan should say about how the forecast was used. */
  static List<ForecastStep> window(Forecast forecast, String name, Farm farm, LocalDate date,
      Instant sunset, Instant sunrise, List<String> notes) {
    List<ForecastStep> steps = forecast.steps();
    Instant noon = date.plusDays(1).atTime(12, 0).atZone(farm.zone()).toInstant();
    if (!forecast.start().isBefore(sunrise)) {
      throw new BadInputException(name + ": the forecast starts at " + local(forecast.start(), farm)
          + ", after sunrise on " + date.plusDays(1) + "; give a forecast for the night of " + date
          + " or pass --night with the date of the evening it covers");
    }
    if (forecast.end().isBefore(sunrise.plus(AFTER_SUNRISE))) {
      throw new BadInputException(name + ": the forecast ends at " + local(forecast.end(), farm)
          + ", before " + local(sunrise.plus(AFTER_SUNRISE), farm) + " (an hour after sunrise);"
          + " the night must be covered from sunset until it is safe to stop sprinkling");
    }
    int first = 0;
    for (int i = 0; i < steps.size(); i++) {
      if (!steps.get(i).time().isAfter(sunset)) {
        first = i;
      }
    }
    int last = steps.size() - 1;
    for (int i = first; i < steps.size(); i++) {
      if (!steps.get(i).time().isBefore(noon)) {
        last = i;
        break;
      }
    }
    List<ForecastStep> window = steps.subList(first, last + 1);
    for (int i = 1; i < window.size(); i++) {
      ForecastStep a = window.get(i - 1);
      ForecastStep b = window.get(i);
      Duration gap = Duration.between(a.time(), b.time());
      if (gap.compareTo(Interpolation.MAX_STEP) > 0) {
        String where = b.line() > 0 ? name + ":" + b.line() + ": " + gap.toMinutes()
            + " minutes pass between line " + a.line() + " and this line"
            : name + ": " + gap.toMinutes() + " minutes pass between " + local(a.time(), farm)
                + " and " + local(b.time(), farm);
        throw new BadInputException(where + ", during the night; Rimeward fills steps of up to 3 h"
            + " by interpolating in time, but across a longer step the night's cooling, and the"
            + " hour it reaches the start temperature, cannot be told; give a forecast with steps"
            + " of 3 h or less from sunset to the morning");
      }
    }
    Interpolation.Hourly hourly = Interpolation.toHourly(window, farm.zone());
    if (hourly.interpolated()) {
      notes.add("forecast steps of up to " + hours(hourly.filledFrom()) + " were interpolated to"
          + " hourly (air temperature, dew point, wind and cloud linear in time)");
    }
    coarse(forecast, window, name, farm, notes);
    return hourly.steps();
  }

  /**
   * Says which properties the source gave coarser than hourly during the night, and refuses a
   * temperature or dew point held over more than 3 h, as it would a CSV with such steps.
   */
  private static void coarse(Forecast forecast, List<ForecastStep> window, String name, Farm farm,
      List<String> notes) {
    Instant from = window.get(0).time();
    Instant to = window.get(window.size() - 1).time();
    Map<String, Duration> longest = new java.util.TreeMap<>();
    for (CoarseSpan c : forecast.coarse()) {
      if (!c.overlaps(from, to)) {
        continue;
      }
      if (c.interpolated() && c.length().compareTo(Interpolation.MAX_STEP) > 0) {
        throw new BadInputException(name + ": " + c.property() + " is given once for "
            + hours(c.length()) + " from " + local(c.from(), farm) + ", during the night; Rimeward"
            + " interpolates temperature and dew point across at most 3 h; fetch a newer forecast"
            + " or give one with steps of 3 h or less");
      }
      longest.merge(c.property(), c.length(), (x, y) -> x.compareTo(y) >= 0 ? x : y);
    }
    if (!longest.isEmpty()) {
      List<String> parts = new ArrayList<>();
      longest.forEach((p, d) -> parts.add(p + " (up to " + hours(d) + ")"));
      notes.add("coarser than hourly tonight, spread over the hours: " + String.join(", ", parts));
    }
  }

  private static String hours(Duration d) {
    long min = d.toMinutes();
    return min % 60 == 0 ? (min / 60) + " h" : String.format(java.util.Locale.ROOT, "%.1f h", min / 60.0);
  }

  private static String local(Instant t, Farm farm) {
    return t.atZone(farm.zone()).toLocalDateTime().toString().replace('T', ' ');
  }

  static PolicyFact policyFact(Policy p) {
    Target t = p.target();
    TargetBasis basis = t.kind() == Target.Kind.T10 ? TargetBasis.T10 : TargetBasis.FIXED;
    StopBasis stop = switch (p.stopRule()) {
      case WET_BULB_ABOVE_FREEZING -> StopBasis.WET_BULB_ABOVE_FREEZING;
      case WET_BULB_ABOVE_TARGET -> StopBasis.WET_BULB_ABOVE_TARGET;
    };
    return new PolicyFact(basis, t.tempC().orElse(Double.NaN), p.startMarginC(), stop);
  }

  static BlockFact blockFact(Block b, CropLibrary crops) {
    return blockFact(b, b.coldAirOffsetC(), crops, new HashMap<>());
  }

  static BlockFact blockFact(Block b, double coldAirOffsetC, CropLibrary crops,
      Map<List<String>, EffectiveProfile> profiles) {
    EffectiveProfile found;
    try {
      found = profiles.computeIfAbsent(java.util.Arrays.asList(b.crop(), b.variety()),
          k -> crops.effective(b.crop(), b.variety()));
    } catch (BadInputException e) {
      String where = (b.variety() != null && crops.crop(b.crop()).isPresent() ? b.varietyRef() : b.cropRef()).toString();
      throw new BadInputException(where + ": block " + b.id() + ": " + e.getMessage(), e);
    }
    EffectiveProfile profile = found;
    EffectiveStage stage = profile.stage(b.stage()).orElseThrow(() -> new BadInputException(
        b.stageRef() + ": block " + b.id() + ": stage '" + b.stage() + "' is not a stage of "
            + profile.label() + "; known stages: "
            + String.join(", ", profile.stages().stream().map(EffectiveStage::id).toList())));
    var sprinklers = b.sprinklers();
    var covers = b.covers();
    return new BlockFact(b.id(), b.crop(), b.variety(), stage.id(), stage.name(), stage.flowering(),
        b.areaHa(), stage.t10C(), stage.t90C(), stage.source(), coldAirOffsetC,
        b.cropValuePerHa().orElse(Double.NaN), sprinklers.isPresent(),
        sprinklers.map(s -> s.rateMmH()).orElse(0.0), sprinklers.map(s -> s.sourceId()).orElse(null),
        covers.isPresent(), covers.map(c -> c.protectionC()).orElse(0.0),
        covers.map(c -> c.protectionSource()).orElse(null), covers.map(c -> c.deployHours()).orElse(0.0));
  }

  static PlanInputs inputsOf(Farm farm, byte[] farmBytes, Forecast forecast, byte[] forecastBytes,
      DataFolder cropDir, DataFolder ruleDir, RuleBook book) {
    return inputsOf(farm, farmBytes, forecast, forecastBytes, cropDir, ruleDir, book, Optional.empty());
  }

  static PlanInputs inputsOf(Farm farm, byte[] farmBytes, Forecast forecast, byte[] forecastBytes,
      DataFolder cropDir, DataFolder ruleDir, RuleBook book, Optional<FetchRecord> fetch) {
    Path forecastFile = forecast.file();
    List<PlanInputs.Input> files = new ArrayList<>();
    files.add(new PlanInputs.Input(PlanInputs.Kind.FARM, farm.sourceFile().getFileName().toString(),
        farmBytes));
    files.add(new PlanInputs.Input(PlanInputs.Kind.FORECAST, forecastFile.getFileName().toString(),
        forecastBytes));
    try (Stream<Path> list = Files.list(cropDir.dir())) {
      for (Path p : list.filter(Files::isRegularFile).sorted().toList()) {
        files.add(new PlanInputs.Input(PlanInputs.Kind.CROP_PROFILE, p.getFileName().toString(), read(p)));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    for (RuleBook.RuleFile f : book.files()) {
      files.add(new PlanInputs.Input(PlanInputs.Kind.RULE, f.name(),
          f.text().getBytes(java.nio.charset.StandardCharsets.UTF_8)));
    }
    PlanInputs.Fetched fetched = fetch.map(r -> new PlanInputs.Fetched(r.source(), r.url(),
        r.fetchedAt(), r.sha256(), r.sha256().equals(FetchRecord.sha256(forecastBytes)))).orElse(null);
    List<String> notes = new ArrayList<>(forecast.notes());
    if (fetched != null && !fetched.unchanged()) {
      notes.add("the forecast file was changed after it was fetched");
    }
    PlanInputs.ForecastUsed used = new PlanInputs.ForecastUsed(
        DataFolder.shown(forecastFile, farm), forecast.format().id(), notes, fetched);
    return new PlanInputs(files, used,
        cropDir.describe(PlanInputs.digest(files, PlanInputs.Kind.CROP_PROFILE)),
        ruleDir.describe(PlanInputs.digest(files, PlanInputs.Kind.RULE)));
  }

  private static byte[] read(Path p) {
    try {
      return Files.readAllBytes(p);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
