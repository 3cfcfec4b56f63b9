package org.rimeward.plan;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

/** Copies of the demo farm and small invented farms written into a test's temporary folder. */
final class TestFarms {
  static final Path DEMO = Path.of("demo-farm");
  static final Path RULES = Path.of("rules");
  static final Path CROPS = Path.of("crop-profiles");

  private TestFarms() {}

  /** A copy of demo-farm/ (farm.yaml and forecast.csv only, never its audit database). */
  static Path copyDemo(Path tmp) {
    Path dir = tmp.resolve("farm");
    try {
      Files.createDirectories(dir);
      Files.copy(DEMO.resolve("farm.yaml"), dir.resolve("farm.yaml"));
      Files.copy(DEMO.resolve("forecast.csv"), dir.resolve("forecast.csv"));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return dir;
  }

  /** A copy of rules/ that a test may break or change. */
  static Path copyRules(Path tmp) {
    Path dir = tmp.resolve("rules");
    try (Stream<Path> walk = Files.walk(RULES)) {
      for (Path p : walk.toList()) {
        Path target = dir.resolve(RULES.relativize(p).toString());
        if (Files.isDirectory(p)) {
          Files.createDirectories(target);
        } else {
          Files.copy(p, target);
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return dir;
  }

  /** A one-block farm at sea level with the given forecast text. */
  static Path oneBlock(Path tmp, String block, String forecastCsv) {
    return farm(tmp, """
        farm:
          name: Test Slope
          latitude: 46.28
          longitude: -119.45
          elevation: 0 m
          timezone: America/Los_Angeles
        water_sources:
          - id: pond
            max_flow: 450 m3/h
            volume: 9000 m3
        blocks:
        """ + block, forecastCsv);
  }

  static Path farm(Path tmp, String farmYaml, String forecastCsv) {
    Path dir = tmp.resolve("farm");
    try {
      Files.createDirectories(dir);
      Files.writeString(dir.resolve("farm.yaml"), farmYaml);
      Files.writeString(dir.resolve("forecast.csv"), forecastCsv);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return dir;
  }

  static Plan plan(Path farmDir) {
    return new NightPlanner().plan(new PlanRequest(farmDir, null, CROPS, RULES, null));
  }

  static void replace(Path file, String from, String to) {
    try {
      String s = Files.readString(file);
      if (!s.contains(from)) {
        throw new IllegalArgumentException(file + " has no '" + from + "'");
      }
      Files.writeString(file, s.replace(from, to));
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
