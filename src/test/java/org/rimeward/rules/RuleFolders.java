package org.rimeward.rules;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

/**
 * Copies of the bundled rules folder with other numbers in rule THRESHOLDS, for tests that show a
 * command or a layer taking its numbers from the rule files rather than from Java.
 */
public final class RuleFolders {
  /** The bundled THRESHOLDS values exactly as policy/thresholds.drl writes them. */
  public static final String BUNDLED_THRESHOLDS = """
      new Thresholds(1.5, 2.2, 4.5, 30.0, 0.0, 1.0, 0.5, 70.0, 0.5,
            30, 1.0, 60,
            2.0, 25.0, 2.0, 1.0, 90)""";

  private RuleFolders() {}

  /**
   * The bundled rules copied to {@code to}, with {@code thresholds} in place of
   * {@link #BUNDLED_THRESHOLDS}; fails when the bundled file no longer holds those values.
   */
  public static Path withThresholds(Path to, String thresholds) throws IOException {
    Path from = Path.of("rules");
    try (Stream<Path> files = Files.walk(from)) {
      for (Path f : files.toList()) {
        Path target = to.resolve(from.relativize(f).toString());
        if (Files.isDirectory(f)) {
          Files.createDirectories(target);
        } else {
          Files.copy(f, target);
        }
      }
    }
    Path file = to.resolve("policy/thresholds.drl");
    String text = Files.readString(file, StandardCharsets.UTF_8);
    assertThat(text).as("bundled THRESHOLDS values").contains(BUNDLED_THRESHOLDS);
    Files.writeString(file, text.replace(BUNDLED_THRESHOLDS, thresholds), StandardCharsets.UTF_8);
    return to;
  }
}
