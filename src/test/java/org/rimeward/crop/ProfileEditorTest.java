package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.OutputStream;
import java.net.URI;
import java.nio.file.FileSystem;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.units.UnitSystem;

class ProfileEditorTest {
  static final Clock CLOCK = Clock.fixed(Instant.parse("2024-04-15T21:30:00Z"), ZoneId.of("America/Los_Angeles"));

  @TempDir Path dir;

  private Path copyApple() throws IOException {
    Path f = dir.resolve("apple.yaml");
    Files.copy(Path.of("crop-profiles", "apple.yaml"), f);
    return f;
  }

  @Test
  void newVarietyAppendsItsLinesAndLeavesEveryOtherByteAlone() throws IOException {
    Path f = copyApple();
    String before = Files.readString(f);
    ProfileEdit e = new ProfileEditor(dir, CLOCK).newVariety("apple", "honeycrisp", "Honeycrisp",
        null, "0.5C", UnitSystem.METRIC, "grower bud cuts 2023, block 7", "A. Grower");
    String after = Files.readString(f);
    String added = """
          - id: honeycrisp
            name: "Honeycrisp"
            hardiness_offset: 0.5C
            note: "grower bud cuts 2023, block 7"
            set_by: "A. Grower"
            set_on: "2024-04-15"
        """;
    assertThat(after).isEqualTo(before + added);
    assertThat(e).isEqualTo(new ProfileEdit(CLOCK.instant(), "A. Grower", f.toString(), "apple",
        "honeycrisp", null, "variety", null, 0.5, "grower bud cuts 2023, block 7"));
    EffectiveStage s = CropLibrary.load(dir).effective("apple", "honeycrisp").stage("silver-tip").orElseThrow();
    assertThat(s.t10C()).isCloseTo((15 - 32) / 1.8 - 0.5, within(1e-9));
    assertThat(s.source()).contains("grower bud cuts 2023, block 7");
  }

  @Test
  void setRoundTripChangesOnlyTheEditedValue() throws IOException {
    Path f = copyApple();
    ProfileEditor ed = new ProfileEditor(dir, CLOCK);
    ed.newVariety("apple", "gala", null, "golden-delicious", null, UnitSystem.METRIC, "copy", "me");
    String v0 = Files.readString(f);
    List<ProfileEdit> first = ed.set("apple", "gala", "full-bloom", "-3C", null, UnitSystem.METRIC,
        "bud cuts 2024-04-12, block 4", "B. Scout");
    String v1 = Files.readString(f);
    String override = """
            overrides:
              - stage: full-bloom
                t10: -3C
                note: "bud cuts 2024-04-12, block 4"
                set_by: "B. Scout"
                set_on: "2024-04-15"
        """;
    assertThat(v1).isEqualTo(v0 + override);
    assertThat(first).hasSize(1);
    assertThat(first.get(0).beforeC()).isCloseTo((28 - 32) / 1.8 - 1 / 1.8, within(1e-9));
    assertThat(first.get(0).afterC()).isEqualTo(-3.0);
    assertThat(first.get(0).field()).isEqualTo("t10");

    // Second edit of the same value: only that value (and the note, by, date) change in place.
    List<ProfileEdit> second = ed.set("apple", "gala", "full-bloom", "27", null, UnitSystem.US,
        "recount", "C. Scout");
    String v2 = Files.readString(f);
    assertThat(v2).isEqualTo(v1.replace("t10: -3C", "t10: 27F")
        .replace("note: \"bud cuts 2024-04-12, block 4\"",
            "note: \"recount; earlier (B. Scout, 2024-04-15): bud cuts 2024-04-12, block 4\"")
        .replace("set_by: \"B. Scout\"", "set_by: \"C. Scout\""));
    assertThat(second.get(0).beforeC()).isEqualTo(-3.0);
    assertThat(second.get(0).afterC()).isCloseTo((27 - 32) / 1.8, within(1e-9));
    // The comment lines and the published rows above are untouched.
    assertThat(v2).startsWith(Files.readString(Path.of("crop-profiles", "apple.yaml")));
  }

  @Test
  void setInsertsIntoAHandWrittenVarietyInTheMiddleOfTheFile() throws IOException {
    Path f = copyApple();
    String before = Files.readString(f);
    new ProfileEditor(dir, CLOCK).set("apple", "golden-delicious", "tight-cluster", null, "-6.5",
        UnitSystem.METRIC, "freezer test 2024", "lab");
    String after = Files.readString(f);
    String anchor = "Golden Delicious and Winesap about 1 °F hardier than Red Delicious\"\n";
    int at = before.indexOf(anchor) + anchor.length();
    assertThat(after).isEqualTo(before.substring(0, at) + """
            overrides:
              - stage: tight-cluster
                t90: -6.5C
                note: "freezer test 2024"
                set_by: "lab"
                set_on: "2024-04-15"
        """ + before.substring(at));
    assertThat(CropLibrary.load(dir).effective("apple", "winesap").stage("tight-cluster")
        .orElseThrow().t90C()).isCloseTo((21 - 32) / 1.8 - 1 / 1.8, within(1e-9));
  }

  @Test
  void newVarietyInAFileWithoutVarietiesAddsTheList() throws IOException {
    Path f = dir.resolve("peach.yaml");
    Files.copy(Path.of("crop-profiles", "peach.yaml"), f);
    String before = Files.readString(f);
    new ProfileEditor(dir, CLOCK).newVariety("peach", "redhaven", null, null, null, UnitSystem.METRIC,
        "block 2 planting", "me");
    assertThat(Files.readString(f)).startsWith(before + "\nvarieties:\n  - id: redhaven\n");
    assertThat(CropLibrary.load(dir).effective("peach", "redhaven").stages())
        .allMatch(s -> s.provenance() == Provenance.BASE);
  }

  @Test
  void aRejectedEditWritesNothing() throws IOException {
    Path f = copyApple();
    String before = Files.readString(f);
    ProfileEditor ed = new ProfileEditor(dir, CLOCK, (p, c) -> {
      throw new AssertionError("must not write");
    });
    // T90 -1 °C would be warmer than T10 -2.2 °C.
    assertThatThrownBy(() -> ed.set("apple", "golden-delicious", "full-bloom", null, "-1C",
        UnitSystem.METRIC, "typo", "me")).isInstanceOf(BadInputException.class)
        .hasMessageContaining("the change was not written")
        .hasMessageContaining("apple/golden-delicious stage 'full-bloom': t90 -1.0 °C");
    assertThatThrownBy(() -> ed.set("apple", "golden-delicious", "full-bloom", "-40C", null,
        UnitSystem.METRIC, "typo", "me")).hasMessageContaining("is outside the plausible");
    assertThatThrownBy(() -> ed.set("apple", "golden-delicious", "full-blom", "-3C", null,
        UnitSystem.METRIC, "n", "me")).hasMessageContaining("unknown stage 'full-blom'")
        .hasMessageContaining("silver-tip, green-tip");
    assertThatThrownBy(() -> ed.set("apple", "honeycrisp", "full-bloom", "-3C", null,
        UnitSystem.METRIC, "n", "me")).hasMessageContaining("unknown variety 'honeycrisp'")
        .hasMessageContaining("new-variety apple/honeycrisp");
    assertThatThrownBy(() -> ed.set("apple", null, "full-bloom", "-3C", null, UnitSystem.METRIC,
        "n", "me")).hasMessageContaining("not the published base table");
    assertThatThrownBy(() -> ed.set("apple", "winesap", "full-bloom", "-3C", null, UnitSystem.METRIC,
        " ", "me")).hasMessageContaining("--note is required");
    assertThatThrownBy(() -> ed.newVariety("apple", "winesap", null, null, null, UnitSystem.METRIC,
        "n", "me")).hasMessageContaining("variety 'winesap' already exists");
    assertThatThrownBy(() -> ed.newVariety("apple", "big", null, null, "5C", UnitSystem.METRIC,
        "n", "me")).hasMessageContaining("hardiness_offset: '5C' is more than 3.0 °C");
    assertThatThrownBy(() -> ed.newVariety("apple", "big", null, null, "1", null, "n", "me"))
        .hasMessageContaining("--offset: '1' has no unit");
    assertThat(Files.readString(f)).isEqualTo(before);
  }

  @Test
  void aCrashWhileWritingLeavesTheOldFile() throws IOException {
    Path f = copyApple();
    String before = Files.readString(f);
    // Writes the whole new text to a temporary file beside the target, then dies before the
    // rename, as a power cut would.
    ProfileEditor ed = new ProfileEditor(dir, CLOCK, (target, content) -> {
      Path tmp = Files.createTempFile(target.getParent(), "." + target.getFileName() + ".", ".tmp");
      Files.writeString(tmp, content);
      throw new IOException("simulated crash after writing " + tmp.getFileName());
    });
    assertThatThrownBy(() -> ed.set("apple", "winesap", "full-bloom", "-3C", null, UnitSystem.METRIC,
        "n", "me")).isInstanceOf(BadInputException.class)
        .hasMessageContaining("could not be written").hasMessageContaining("the file is unchanged");
    assertThat(Files.readString(f)).isEqualTo(before);
    assertThat(CropLibrary.load(dir).effective("apple", "winesap").stage("full-bloom").orElseThrow()
        .provenance()).isEqualTo(Provenance.OFFSET);
  }

  @Test
  void aBrokenFileIsNotEdited() throws IOException {
    Path f = copyApple();
    Files.writeString(f, Files.readString(f).replace("t10: 27F", "t10: 27"));
    assertThatThrownBy(() -> new ProfileEditor(dir, CLOCK).set("apple", "winesap", "full-bloom",
        "-3C", null, UnitSystem.METRIC, "n", "me"))
        .hasMessageContaining("fix these problems").hasMessageContaining("'27' has no unit");
  }

  @Test
  void crlfFilesGetCrlfLines() throws IOException {
    Path f = copyApple();
    Files.writeString(f, Files.readString(f).replace("\n", "\r\n"));
    new ProfileEditor(dir, CLOCK).set("apple", "rome-beauty", "full-bloom", "-3C", null,
        UnitSystem.METRIC, "n", "me");
    String t = Files.readString(f);
    assertThat(t.replace("\r\n", "")).doesNotContain("\n");
    assertThat(CropLibrary.load(dir).effective("apple", "rome-beauty").stage("full-bloom")
        .orElseThrow().t10C()).isEqualTo(-3.0);
  }

  @Test
  void theBundledCopyInsideAJarIsReadButNotEdited() throws IOException {
    Path zip = dir.resolve("data.jar");
    try (OutputStream os = Files.newOutputStream(zip); ZipOutputStream z = new ZipOutputStream(os)) {
      for (String name : List.of("apple.yaml", "peach.yaml")) {
        z.putNextEntry(new ZipEntry("rimeward/crop-profiles/" + name));
        z.write(Files.readAllBytes(Path.of("crop-profiles", name)));
        z.closeEntry();
      }
    }
    try (FileSystem fs = FileSystems.newFileSystem(URI.create("jar:" + zip.toUri()), Map.of())) {
      Path inJar = fs.getPath("/rimeward/crop-profiles");
      CropLibrary lib = CropLibrary.load(inJar);
      assertThat(lib.crops()).extracting(Crop::id).containsExactly("apple", "peach");
      assertThat(lib.effective("apple", "rome-beauty").stages()).hasSize(9);
      assertThatThrownBy(() -> new ProfileEditor(inJar, CLOCK).set("apple", "winesap", "full-bloom",
          "-3C", null, UnitSystem.METRIC, "n", "me")).isInstanceOf(BadInputException.class)
          .hasMessageContaining("packed inside the rimeward jar")
          .hasMessageContaining("--crop-profiles DIR");
    }
  }
}
