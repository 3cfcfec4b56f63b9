package org.rimeward.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.bench.PlanBenchmark;
import org.rimeward.crop.CropLibrary;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.farm.FarmLoader;
import org.rimeward.physics.Atmosphere;
import org.rimeward.physics.Night;
import org.rimeward.physics.SunCalculator;
import org.rimeward.rules.FiredRule;
import org.rimeward.rules.facts.BlockFact;
import org.rimeward.rules.facts.BlockNight;
import org.rimeward.rules.facts.Measure;
import org.rimeward.weather.Forecast;
import org.rimeward.weather.ForecastReader;
import org.rimeward.weather.ForecastStep;

/**
 * A large farm is planned with shortcuts (physics shared between blocks of one site, profiles
 * between blocks of one variety, conclusions indexed by block); each must give what planning
 * every block on its own gives. The region is invented and seeded, as in the benchmark.
 */
class RegionPlanTest {
  static final LocalDate NIGHT = LocalDate.of(2026, 4, 14);
  @TempDir static Path dir;
  static CropLibrary crops;
  static Farm farm;
  static Forecast forecast;
  static List<ForecastStep> window;

  @BeforeAll
  static void region() throws IOException {
    crops = CropLibrary.load(Path.of("crop-profiles"));
    PlanBenchmark.Region.generate(dir, 300, 48, crops, 7L);
    farm = FarmLoader.load(dir);
    forecast = ForecastReader.read(farm.forecastFile(), farm.zone());
    Night sun = SunCalculator.night(farm.latitude(), farm.longitude(), NIGHT, farm.zone());
    Instant sunset = sun.sunset().orElseThrow().toInstant();
    Instant sunrise = sun.sunrise().orElseThrow().toInstant();
    window = NightPlanner.window(forecast, "forecast.csv", farm, NIGHT, sunset, sunrise);
  }

  @Test
  void physicsSharedBetweenBlocksOfOneSiteIsWhatEachBlockComputesAlone() {
    double pressureKPa = Atmosphere.stationPressureKPa(farm.elevationM());
    BlockPhysics.Memo shared = new BlockPhysics.Memo();
    Set<Double> offsets = new TreeSet<>();
    for (Block b : farm.blocks()) {
      offsets.add(b.coldAirOffsetC());
      BlockFact f = NightPlanner.blockFact(b, crops);
      BlockNight viaMemo = BlockPhysics.compute(b, b.coldAirOffsetC(), f.t10C(), f.t90C(), window,
          pressureKPa, "f", shared);
      BlockNight alone = BlockPhysics.compute(b, f.t10C(), f.t90C(), window, pressureKPa, "f");
      assertThat(viaMemo).usingRecursiveComparison().ignoringFields("series").isEqualTo(alone);
      assertThat(viaMemo.blockId()).isEqualTo(b.id());
      for (Measure m : Measure.values()) {
        for (int i = 0; i < alone.series().size(); i++) {
          assertThat(viaMemo.series().valueAt(m, i)).as("%s %s step %d", b.id(), m, i)
              .isEqualTo(alone.series().valueAt(m, i));
        }
      }
    }
    assertThat(offsets).as("the region mixes sites, so the memo is really keyed").hasSizeGreaterThan(3);
  }

  @Test
  void sharedProfilesAreTheOnesEachBlockLooksUpAlone() {
    Map<List<String>, org.rimeward.crop.EffectiveProfile> shared = new HashMap<>();
    for (Block b : farm.blocks()) {
      assertThat(NightPlanner.blockFact(b, b.coldAirOffsetC(), crops, shared))
          .isEqualTo(NightPlanner.blockFact(b, crops));
    }
    assertThat(shared.size()).isLessThan(farm.blocks().size());
  }

  @Test
  void eachBlockCarriesItsOwnRulesAndTheWaterListsAgreeWithTheBlocks() {
    Plan plan = new NightPlanner(org.rimeward.rules.RuleBook::load)
        .plan(new PlanRequest(dir, null, Path.of("crop-profiles"), Path.of("rules"), NIGHT));
    assertThat(plan.blocks()).hasSize(300);
    for (BlockPlan b : plan.blocks()) {
      List<FiredRule> own = plan.trail().stream().filter(f -> b.blockId().equals(f.blockId())).toList();
      assertThat(b.rules()).as(b.blockId()).isEqualTo(own);
      assertThat(b.cautions()).isEqualTo(own.stream().filter(FiredRule::isCaution).toList());
    }
    Set<String> withoutByBlocks = new TreeSet<>();
    for (BlockPlan b : plan.blocks()) {
      b.actions().stream().filter(a -> a instanceof Action.Sprinkle s && s.advised() && !s.withWater())
          .forEach(a -> withoutByBlocks.add(b.blockId()));
    }
    Set<String> withoutBySources = new TreeSet<>();
    plan.water().forEach(w -> withoutBySources.addAll(w.without()));
    assertThat(withoutByBlocks).as("some sources of the region run short").isNotEmpty()
        .isEqualTo(withoutBySources);
  }
}
