package org.rimeward.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.rimeward.BuildInfo;

/**
 * The list of rule files a replay trusts without being told ({@code released-rules.sha256}) holds
 * every rule file this build bundles, so a trail recorded by this build replays in any later one
 * without {@code --trust-recorded-rules}. The list only grows: a rule file once shipped stays
 * trusted. After changing a rule file, append its hash with
 * {@code mvn test -Dtest=ReleasedRulesTest -Drimeward.released.update=true} and commit the list
 * with the rule.
 */
class ReleasedRulesTest {
  static final boolean UPDATE = Boolean.getBoolean("rimeward.released.update");
  static final Path LIST = Path.of("src/main/resources/org/rimeward/audit/released-rules.sha256");
  static final Path RULES = Path.of("rules");

  @Test
  void everyBundledRuleFileIsListed() throws IOException {
    Set<String> listed = RuleTrust.released();
    List<String> missing = new ArrayList<>();
    try (Stream<Path> s = Files.walk(RULES)) {
      for (Path p : s.filter(p -> p.toString().endsWith(".drl")).sorted().toList()) {
        String hash = RecordedInput.sha256Hex(Files.readAllBytes(p));
        if (!listed.contains(hash)) {
          missing.add(hash + " " + BuildInfo.version() + " "
              + RULES.relativize(p).toString().replace('\\', '/'));
        }
      }
    }
    if (UPDATE && !missing.isEmpty()) {
      Files.writeString(LIST, String.join("\n", missing) + "\n", StandardCharsets.UTF_8,
          java.nio.file.StandardOpenOption.APPEND);
      return;
    }
    assertThat(missing).as("bundled rule files missing from %s; append them with"
        + " -Drimeward.released.update=true", LIST).isEmpty();
  }

  @Test
  void everyLineIsAHashAVersionAndAPathListedOnce() throws IOException {
    Set<String> seen = new HashSet<>();
    int lineNo = 0;
    for (String line : Files.readAllLines(LIST, StandardCharsets.UTF_8)) {
      lineNo++;
      if (line.isBlank() || line.startsWith("#")) {
        continue;
      }
      assertThat(line).as("line %d", lineNo).matches("[0-9a-f]{64} \\S+ [\\w./-]+\\.drl");
      assertThat(seen.add(line.substring(0, 64))).as("line %d lists a hash again", lineNo).isTrue();
    }
    assertThat(seen).as("the list is not empty").isNotEmpty();
  }

  @Test
  void aRuleFileNoLongerBundledButOnceShippedIsStillTrusted() throws IOException {
    // The first rule files of the project's history are no longer bundled as they were: a trail
    // recorded with them must still replay without being told to trust them.
    Set<String> bundled = new HashSet<>();
    try (Stream<Path> s = Files.walk(RULES)) {
      for (Path p : s.filter(p -> p.toString().endsWith(".drl")).toList()) {
        bundled.add(RecordedInput.sha256Hex(Files.readAllBytes(p)));
      }
    }
    Set<String> older = new HashSet<>(RuleTrust.released());
    older.removeAll(bundled);
    assertThat(older).as("rule files shipped before this build's").isNotEmpty();
    RuleTrust trust = RuleTrust.standard(List.of());
    for (String hash : older) {
      assertThat(trust.trusts(hash)).as(hash).isTrue();
    }
    assertThat(trust.trusts("0".repeat(64))).isFalse();
  }
}
