package org.rimeward.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.rimeward.audit.AuditSamples;
import org.rimeward.audit.AuditStore;

/**
 * A copy of the trail handed to someone else (an insurer, a read-only share) is read as it is:
 * {@code audit verify}, {@code list} and {@code show} run as another account that can write
 * neither the file nor its folder, from the packaged jar. Run as the superuser, the commands run
 * as {@code nobody} through {@code setpriv}; otherwise the file and folder are made read-only to
 * the account running the test, which a non-superuser cannot get around either.
 */
class ReadOnlyTrailIT {
  static final boolean ROOT = "root".equals(System.getProperty("user.name"));
  Path base;
  Path copy;

  @BeforeEach
  void aReadOnlyCopy() throws Exception {
    base = Files.createTempDirectory("rimeward-ro");
    Files.setPosixFilePermissions(base, PosixFilePermissions.fromString("rwxr-xr-x"));
    Path farm = Files.createDirectories(base.resolve("farm"));
    try (AuditStore store = AuditStore.open(farm.resolve("audit.db"))) {
      store.appendRun(AuditSamples.sampleRun("2026-04-15T180000.000Z-0000aaaa",
          Instant.parse("2026-04-15T18:00:00Z"), LocalDate.parse("2026-04-15")));
    }
    Path share = Files.createDirectories(base.resolve("share"));
    copy = share.resolve("audit.db");
    Files.copy(farm.resolve("audit.db"), copy);
    Files.copy(Path.of(System.getProperty("rimeward.jar", "target/rimeward.jar")),
        base.resolve("rimeward.jar"));
    Files.setPosixFilePermissions(base.resolve("rimeward.jar"),
        PosixFilePermissions.fromString("r--r--r--"));
    Files.setPosixFilePermissions(copy, PosixFilePermissions.fromString("r--r--r--"));
    Files.setPosixFilePermissions(share, PosixFilePermissions.fromString("r-xr-xr-x"));
  }

  @AfterEach
  void cleanUp() throws Exception {
    Files.setPosixFilePermissions(base.resolve("share"), PosixFilePermissions.fromString("rwx------"));
    try (Stream<Path> s = Files.walk(base)) {
      for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
        Files.deleteIfExists(p);
      }
    }
  }

  record Run(int exit, String out, String err) {}

  private Run asAnotherAccount(String... args) throws Exception {
    List<String> cmd = new ArrayList<>();
    if (ROOT) {
      assertThat(Path.of("/usr/bin/setpriv")).as("setpriv (util-linux) runs the jar as nobody")
          .exists();
      cmd.addAll(List.of("/usr/bin/setpriv", "--reuid=65534", "--regid=65534", "--clear-groups",
          "--"));
    }
    cmd.add(System.getProperty("java.home") + File.separator + "bin" + File.separator + "java");
    cmd.add("-Duser.home=" + base);
    cmd.add("-jar");
    cmd.add(base.resolve("rimeward.jar").toString());
    cmd.addAll(List.of(args));
    Process p = new ProcessBuilder(cmd).directory(base.toFile()).start();
    p.getOutputStream().close();
    byte[] out = p.getInputStream().readAllBytes();
    byte[] err = p.getErrorStream().readAllBytes();
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    return new Run(p.exitValue(), new String(out, StandardCharsets.UTF_8),
        new String(err, StandardCharsets.UTF_8));
  }

  @Test
  void verifyListAndShowReadACopyNobodyMayWrite() throws Exception {
    Run verify = asAnotherAccount("audit", "verify", "--audit", copy.toString());
    assertThat(verify.exit()).as(verify.toString()).isZero();
    assertThat(verify.out()).startsWith("chain intact:");
    Run list = asAnotherAccount("audit", "list", "--audit", copy.toString());
    assertThat(list.exit()).as(list.toString()).isZero();
    assertThat(list.out()).contains("2026-04-15T180000.000Z-0000aaaa");
    Run show = asAnotherAccount("audit", "show", "2026-04-15T180000", "--audit",
        copy.toString());
    assertThat(show.exit()).as(show.toString()).isZero();
    Run head = asAnotherAccount("audit", "head", "--audit", copy.toString());
    assertThat(head.exit()).as(head.toString()).isZero();
    try (Stream<Path> s = Files.list(copy.getParent())) {
      assertThat(s.map(p -> p.getFileName().toString())).containsExactly("audit.db");
    }
  }
}
