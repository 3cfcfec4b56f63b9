package org.rimeward.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledOnOs;
import org.junit.jupiter.api.condition.OS;
import org.junit.jupiter.api.io.TempDir;

/** Strict UTF-8, a byte-order mark dropped, folders, devices and endless input refused. */
class TextFileTest {
  @TempDir Path dir;

  @Test
  void byteOrderMarkIsDroppedAndBytesAreKept() throws IOException {
    Path f = dir.resolve("a.yaml");
    byte[] bytes = "\uFEFFcrop: apple\n".getBytes(StandardCharsets.UTF_8);
    Files.write(f, bytes);
    TextFile t = TextFile.read(f, 1000, "crop file", "x");
    assertThat(t.text()).isEqualTo("crop: apple\n");
    assertThat(t.bytes()).isEqualTo(bytes);
  }

  @Test
  void notUtf8NamesLineAndColumn() throws IOException {
    Path f = dir.resolve("a.drl");
    Files.write(f, "rule A\nwhen caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
    assertThatThrownBy(() -> TextFile.read(f, 1000, "rule file", "x"))
        .isInstanceOf(BadInputException.class)
        .hasMessage(f + ":2: not UTF-8 text (byte 0xE9 at column 9); save the file as UTF-8");
  }

  @Test
  void folderIsRefusedByName() throws IOException {
    Path d = Files.createDirectories(dir.resolve("x.drl"));
    assertThatThrownBy(() -> TextFile.read(d, 1000, "rule file", "move it out"))
        .hasMessage(d + ": is a folder, not a rule file; move it out");
  }

  @Test
  void missingFileSaysWhatToGive() {
    Path f = dir.resolve("none.csv");
    assertThatThrownBy(() -> TextFile.read(f, 1000, "forecast file", "put it there"))
        .hasMessage(f + ": no such forecast file; put it there");
  }

  @Test
  @EnabledOnOs(OS.LINUX)
  void endlessDeviceStopsAtTheStatedSize() {
    assertTimeoutPreemptively(Duration.ofSeconds(60), () -> {
      assertThatThrownBy(() -> TextFile.read(Path.of("/dev/zero"), TextFile.MAX_TABLE_BYTES,
          "forecast file", "x"))
          .isInstanceOf(BadInputException.class)
          .hasMessage("/dev/zero: is larger than 16 MB, far more than any forecast file; check that"
              + " this is the right file (a device or an endless stream is not a file)");
    });
  }

  @Test
  void quoteEscapesControlCharactersAndCutsLongValues() {
    assertThat(Text.quote("Hill\u001b[31mside")).isEqualTo("'Hill\\u001B[31mside'");
    assertThat(Text.quote("y".repeat(100))).isEqualTo("'" + "y".repeat(40) + "'... (100 characters)");
  }
}
