package org.rimeward.audit;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.rimeward.io.BundledData;

/**
 * Which recorded rule files a replay may run. A rule file is code: its actions run Java with the
 * rights of whoever runs Rimeward. A trail from somebody else (an insurer replaying a farm's
 * trail, a farm replaying a consultant's) could carry rule files that do anything, so a replay
 * runs a recorded rule file only when its SHA-256 matches a rule file the user already trusts: a
 * bundled rule file of this build or of a released version ({@code released-rules.sha256}), or a
 * rule file in the farm's own rules folder today.
 */
public final class RuleTrust {
  private final Set<String> trusted;

  private RuleTrust(Set<String> trusted) {
    this.trusted = Set.copyOf(trusted);
  }

  /**
   * The rule files trusted for a replay: the bundled ones, the released ones, and those under
   * {@code farmRulesDirs} (folders that do not exist are skipped).
   */
  public static RuleTrust standard(List<Path> farmRulesDirs) {
    Set<String> hashes = new HashSet<>(released());
    addRuleFiles(BundledData.bundled("rules"), hashes);
    for (Path d : farmRulesDirs) {
      if (Files.isDirectory(d)) {
        addRuleFiles(d, hashes);
      }
    }
    return new RuleTrust(hashes);
  }

  /** Whether a rule file with this SHA-256 (lower-case hex) is trusted. */
  public boolean trusts(String sha256) {
    return trusted.contains(sha256);
  }

  /** The recorded rule files of {@code run} that match no trusted rule file, by name. */
  public List<String> untrusted(RunRecord run) {
    List<String> out = new ArrayList<>();
    for (RecordedInput in : run.inputs()) {
      if (in.kind() == InputKind.RULE && !trusts(in.sha256())) {
        out.add(in.name());
      }
    }
    return out;
  }

  private static void addRuleFiles(Path dir, Set<String> hashes) {
    try (Stream<Path> s = Files.walk(dir)) {
      for (Path p : s.filter(p -> p.getFileName() != null
          && p.getFileName().toString().endsWith(".drl") && Files.isRegularFile(p)).toList()) {
        hashes.add(RecordedInput.sha256Hex(Files.readAllBytes(p)));
      }
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read the rule files in " + dir, e);
    }
  }

  static Set<String> released() {
    Set<String> out = new HashSet<>();
    try (InputStream in = RuleTrust.class.getResourceAsStream("released-rules.sha256")) {
      if (in == null) {
        return out;
      }
      BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
      for (String line; (line = r.readLine()) != null; ) {
        String l = line.strip();
        if (!l.isEmpty() && !l.startsWith("#")) {
          out.add(l.split("\\s+")[0]);
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read the list of released rule files", e);
    }
    return out;
  }
}
