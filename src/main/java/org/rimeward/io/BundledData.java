package org.rimeward.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.file.FileSystem;
import java.nio.file.FileSystemAlreadyExistsException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

/**
 * Finds the data folders that ship with Rimeward ({@code rules/}, {@code crop-profiles/}).
 * A folder of that name in the working directory wins, so an agronomist can edit it without a
 * rebuild; otherwise the copy packed into the jar at build time is used, read in place.
 */
public final class BundledData {
  private BundledData() {}

  /** The folder to use when the user named none: {@code ./NAME} if present, else the bundled copy. */
  public static Path folder(String name) {
    Path local = Path.of(name);
    if (Files.isDirectory(local)) {
      return local;
    }
    return bundled(name);
  }

  /** The copy of {@code NAME/} packed into the jar (or the classes folder in a build). */
  public static Path bundled(String name) {
    URL url = BundledData.class.getResource("/rimeward/" + name);
    if (url == null) {
      throw new BadInputException("no bundled '" + name + "' folder in this build; pass the folder"
          + " with its option");
    }
    try {
      URI uri = url.toURI();
      if ("jar".equals(uri.getScheme())) {
        FileSystem fs;
        try {
          fs = FileSystems.newFileSystem(uri, Map.of());
        } catch (FileSystemAlreadyExistsException e) {
          fs = FileSystems.getFileSystem(uri);
        }
        return fs.getPath("/rimeward/" + name);
      }
      return Path.of(uri);
    } catch (URISyntaxException e) {
      throw new IllegalStateException(e);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Whether {@code dir} is inside the jar, where nothing can be written. */
  public static boolean isReadOnly(Path dir) {
    return !"file".equals(dir.getFileSystem().provider().getScheme());
  }
}
