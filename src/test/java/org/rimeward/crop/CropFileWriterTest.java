package org.rimeward.crop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assumptions.assumeThat;

import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.attribute.GroupPrincipal;
import java.nio.file.attribute.PosixFileAttributeView;
import java.nio.file.attribute.PosixFilePermissions;
import java.nio.file.attribute.UserPrincipal;
import java.nio.file.attribute.UserPrincipalLookupService;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rimeward.io.BadInputException;
import org.rimeward.units.UnitSystem;

/**
 * An edit keeps what the people sharing a crop file rely on: its mode, its owner and group, and a
 * symbolic link stays a link to the file it names.
 */
class CropFileWriterTest {
  static final Clock CLOCK = Clock.fixed(Instant.parse("2024-04-15T21:30:00Z"), ZoneOffset.UTC);

  @TempDir Path dir;

  private Path copyApple(Path folder) throws Exception {
    Files.createDirectories(folder);
    Path f = folder.resolve("apple.yaml");
    Files.copy(Path.of("crop-profiles", "apple.yaml"), f);
    return f;
  }

  private static void set(Path folder, String t10) {
    new ProfileEditor(folder, CLOCK).set("apple", "rome-beauty", "tight-cluster", t10, null,
        UnitSystem.METRIC, "bud cuts", "tester");
  }

  @Test
  void anEditKeepsTheFilesMode() throws Exception {
    Path f = copyApple(dir);
    for (String mode : new String[] {"rw-r--r--", "rw-rw-r--", "rw-------"}) {
      Files.setPosixFilePermissions(f, PosixFilePermissions.fromString(mode));
      set(dir, mode.equals("rw-r--r--") ? "-3.0C" : mode.equals("rw-rw-r--") ? "-3.1C" : "-3.2C");
      assertThat(PosixFilePermissions.toString(Files.getPosixFilePermissions(f))).isEqualTo(mode);
    }
    assertThat(Files.readString(f)).contains("t10: -3.2C");
    try (var s = Files.list(dir)) {
      assertThat(s.map(p -> p.getFileName().toString()))
          .as("no temporary file is left behind").containsExactlyInAnyOrder("apple.yaml",
              ".apple.yaml.lock");
    }
  }

  @Test
  void anEditKeepsOwnerAndGroupWhereThisProgramMaySetThem() throws Exception {
    assumeThat(System.getProperty("user.name")).as("only the superuser may give a file away")
        .isEqualTo("root");
    Path f = copyApple(dir);
    UserPrincipalLookupService users = f.getFileSystem().getUserPrincipalLookupService();
    UserPrincipal nobody = users.lookupPrincipalByName("nobody");
    GroupPrincipal group = users.lookupPrincipalByGroupName(
        Files.exists(Path.of("/etc/group")) && Files.readString(Path.of("/etc/group"))
            .contains("nogroup:") ? "nogroup" : "nobody");
    PosixFileAttributeView v = Files.getFileAttributeView(f, PosixFileAttributeView.class);
    v.setOwner(nobody);
    v.setGroup(group);
    set(dir, "-3.0C");
    var after = v.readAttributes();
    assertThat(after.owner()).isEqualTo(nobody);
    assertThat(after.group()).isEqualTo(group);
  }

  @Test
  void anEditWritesThroughASymbolicLinkAndTheLinkStays() throws Exception {
    Path shared = copyApple(dir.resolve("shared"));
    Path profiles = Files.createDirectories(dir.resolve("profiles"));
    Path link = Files.createSymbolicLink(profiles.resolve("apple.yaml"),
        Path.of("..", "shared", "apple.yaml"));
    set(profiles, "-3.0C");
    assertThat(Files.isSymbolicLink(link)).isTrue();
    assertThat(Files.readSymbolicLink(link)).isEqualTo(Path.of("..", "shared", "apple.yaml"));
    assertThat(Files.readString(shared)).contains("t10: -3.0C");
    assertThat(Files.isRegularFile(link, LinkOption.NOFOLLOW_LINKS)).isFalse();
    // The lock sits beside the file that changes, so edits through any link share it.
    assertThat(shared.resolveSibling(".apple.yaml.lock")).exists();
  }

  @Test
  void aPermissionErrorSaysPermissionDeniedWithThePath() throws Exception {
    Path f = copyApple(dir);
    String before = Files.readString(f);
    ProfileEditor denied = new ProfileEditor(dir, CLOCK, (target, content) -> {
      throw new AccessDeniedException(target.toString());
    });
    assertThatThrownBy(() -> denied.set("apple", "rome-beauty", "tight-cluster", "-3.0C", null,
        UnitSystem.METRIC, "bud cuts", "tester")).isInstanceOf(BadInputException.class)
        .hasMessageContaining("permission denied").hasMessageContaining(f.toString())
        .hasMessageContaining("the file is unchanged");
    assertThat(Files.readString(f)).isEqualTo(before);
  }
}
