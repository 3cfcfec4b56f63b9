package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.audit.AuditSamples;
import org.rimeward.audit.AuditStore;

/**
 * The trail as a farm manager reads it: profile edits in the farm's own profiles, listed with
 * their own command and named by 'audit why', and 'why' answering for the latest run.
 */
class TrailAsManagerReadsItTest {
  static final Clock EVENING = Clock.fixed(Instant.parse("2026-04-14T23:00:00Z"), ZoneOffset.UTC);

  @TempDir Path tmp;
  Path farm;

  @BeforeEach
  void aFarmWithoutProfilesOfItsOwn() throws IOException {
    farm = Files.createDirectory(tmp.resolve("farm"));
    try (Stream<Path> s = Files.list(Path.of("demo-farm"))) {
      for (Path p : s.filter(p -> Files.isRegularFile(p)
          && !p.getFileName().toString().startsWith("audit.db")).toList()) {
        Files.copy(p, farm.resolve(p.getFileName()));
      }
    }
    assertThat(farm.resolve("crop-profiles")).doesNotExist();
  }

  @Test
  void theFirstEditCopiesTheBundledProfilesIntoTheFarmAndWhyNamesIt() throws Exception {
    String bundled = Files.readString(Path.of("crop-profiles", "apple.yaml"));
    Cli.Result set = Cli.run(EVENING, "profile", "set", "apple/rome-beauty", "--stage",
        "tight-cluster", "--t10", "-3.5C", "--note", "bud cuts 2026-04-14, creek block",
        "--by", "M. Manager", "--farm", farm.toString());
    assertThat(set.exitCode()).as(set.toString()).isZero();
    assertThat(set.out()).contains("copied the bundled ones into " + farm.resolve("crop-profiles"));
    assertThat(Files.readString(farm.resolve("crop-profiles/apple.yaml"))).contains("t10: -3.5C");
    assertThat(Files.readString(Path.of("crop-profiles", "apple.yaml"))).isEqualTo(bundled);
    try (Stream<Path> s = Files.list(farm.resolve("crop-profiles"))) {
      assertThat(s.filter(p -> p.toString().endsWith(".yaml")).count()).isGreaterThan(5);
    }
    // The second edit goes to the farm's copy, and says nothing about copying.
    Cli.Result again = Cli.run(EVENING, "profile", "set", "apple/winesap", "--stage",
        "tight-cluster", "--t10", "-4.5C", "--note", "bud cuts", "--farm", farm.toString());
    assertThat(again.exitCode()).as(again.toString()).isZero();
    assertThat(again.out()).doesNotContain("copied");

    Cli.Result list = Cli.run("profile", "list", "--farm", farm.toString());
    assertThat(list.out()).startsWith("Crop profiles in " + farm.resolve("crop-profiles"));

    Cli.Result edits = Cli.run("audit", "edits", "--farm", farm.toString(), "--crop", "apple");
    assertThat(edits.exitCode()).as(edits.toString()).isZero();
    // Rome Beauty at tight cluster: -3.9 °C (the Red Delicious table's 25 °F less the 2 °F
    // footnote offset, WSU via Penn State Extension) to -3.5 °C is a warmer kill temperature.
    assertThat(edits.out()).contains("M. Manager")
        .contains("apple/rome-beauty tight-cluster T10 -3.9 °C → -3.5 °C (more tender)")
        .contains("note: bud cuts 2026-04-14, creek block")
        .contains("apple/winesap tight-cluster T10").contains("(hardier)");
    assertThat(Cli.run("audit", "edits", "--farm", farm.toString(), "--crop", "pear").out())
        .contains("no profile edits");
    assertThat(Cli.run("audit", "edits", "--farm", farm.toString(), "--since", "2030-01-01")
        .out()).contains("no profile edits");

    Clock later = Clock.fixed(Instant.parse("2026-04-15T03:05:00Z"), ZoneOffset.UTC);
    Cli.Result plan = Cli.run(later, "plan", "--farm", farm.toString(), "--crop-profiles",
        farm.resolve("crop-profiles").toString());
    assertThat(plan.exitCode()).as(plan.toString()).isIn(0, 3);
    Cli.Result why = Cli.run("audit", "why", "creek-rome", "--farm", farm.toString());
    assertThat(why.exitCode()).as(why.toString()).isZero();
    assertThat(why.out()).contains("Profile edits that changed these values:")
        .contains("by M. Manager: T10 -3.9 °C → -3.5 °C (bud cuts 2026-04-14, creek block)")
        .doesNotContain("winesap");
  }

  @Test
  void whyWithoutANightAnswersForTheLatestRunNotTheLatestNight() {
    Path db = farm.resolve("audit.db");
    try (AuditStore store = AuditStore.open(db)) {
      store.appendRun(AuditSamples.sampleRun("r-tomorrow", Instant.parse("2026-04-15T18:00:00Z"),
          LocalDate.parse("2026-04-16")));
      // Re-run afterwards for an earlier night (a late forecast for last night).
      store.appendRun(AuditSamples.sampleRun("r-rerun", Instant.parse("2026-04-15T19:00:00Z"),
          LocalDate.parse("2026-04-15")));
    }
    Cli.Result why = Cli.run("audit", "why", "north-gala", "--farm", farm.toString());
    assertThat(why.exitCode()).as(why.toString()).isZero();
    assertThat(why.out()).contains("Run r-rerun").contains("night of 2026-04-15");
    Cli.Result night = Cli.run("audit", "why", "north-gala", "--farm", farm.toString(),
        "--night", "2026-04-16");
    assertThat(night.out()).contains("Run r-tomorrow");
  }
}
