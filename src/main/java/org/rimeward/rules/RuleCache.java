package org.rimeward.rules;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.InvalidClassException;
import java.io.ObjectInputFilter;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.ObjectStreamClass;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collection;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.logging.Level;
import java.util.logging.Logger;
import java.util.stream.Stream;
import org.kie.api.definition.KiePackage;

/**
 * Compiled rule packages kept between runs, so a start does not pay for compiling the DRL again.
 * An entry is found by a key that covers the rule files' content, the Rimeward classes the rules
 * were compiled against, the rule engine's version and the Java version; any change to one of
 * them misses and the rules are compiled anew. An entry that cannot be read back, for whatever
 * reason, is treated as missing: the cache may make a run faster but never changes its result.
 *
 * <p>The cache folder is {@code -Drimeward.cache=DIR}, else {@code RIMEWARD_CACHE},
 * else {@code $XDG_CACHE_HOME/rimeward/rules}, else {@code ~/.cache/rimeward/rules}; the value
 * {@code off} turns the folder off.
 */
public final class RuleCache {
  /** System property naming the cache folder, or {@code off}. */
  public static final String PROPERTY = "rimeward.cache";
  /** Environment variable naming the cache folder, or {@code off}; the property wins. */
  public static final String ENV = "RIMEWARD_CACHE";
  /** Entries beyond this many, oldest first, are removed when a new one is written. */
  static final int KEEP = 8;

  private static final Logger LOG = Logger.getLogger(RuleCache.class.getName());
  private static final byte[] MAGIC = "RIMEWARD-RULES\n".getBytes(StandardCharsets.US_ASCII);
  private static final int FORMAT = 1;
  private static final String SUFFIX = ".rules.bin";

  private final Path dir;

  private RuleCache(Path dir) {
    this.dir = dir;
  }

  /** The cache a plain run uses, in the configured folder. */
  public static RuleCache standard() {
    return new RuleCache(configuredDir(System.getProperty(PROPERTY), System.getenv(ENV),
        System.getenv("XDG_CACHE_HOME"), System.getProperty("user.home")));
  }

  /** A cache in {@code dir}. */
  public static RuleCache inFolder(Path dir) {
    return new RuleCache(Objects.requireNonNull(dir, "dir"));
  }

  /** No cache at all: every load compiles. */
  public static RuleCache none() {
    return new RuleCache(null);
  }

  static Path configuredDir(String property, String env, String xdg, String home) {
    String chosen = property != null && !property.isBlank() ? property
        : env != null && !env.isBlank() ? env : null;
    if (chosen != null) {
      return "off".equalsIgnoreCase(chosen.strip()) ? null : Path.of(chosen.strip());
    }
    if (xdg != null && !xdg.isBlank() && Path.of(xdg).isAbsolute()) {
      return Path.of(xdg, "rimeward", "rules");
    }
    return home == null || home.isBlank() ? null : Path.of(home, ".cache", "rimeward", "rules");
  }

  /** The folder entries are written to, if any. */
  public Optional<Path> folder() {
    return Optional.ofNullable(dir);
  }

  /** The entry for {@code key}, or empty when there is none or it cannot be used. */
  Optional<List<KiePackage>> read(String key) {
    if (dir == null) {
      return Optional.empty();
    }
    Path file = entry(dir, key);
    byte[] bytes;
    try {
      bytes = Files.readAllBytes(file);
    } catch (IOException e) {
      return Optional.empty();
    }
    return decode(bytes, key, file.toString());
  }

  /** Stores the packages under {@code key}; a failure to write only costs the next run time. */
  void write(String key, Collection<KiePackage> packages) {
    if (dir == null) {
      return;
    }
    try {
      Files.createDirectories(dir);
      org.rimeward.io.AtomicFiles.write(entry(dir, key), encode(key, packages));
      prune(dir, KEEP);
    } catch (IOException | RuntimeException e) {
      LOG.log(Level.FINE, "compiled rules not cached in " + dir, e);
    }
  }

  static Path entry(Path dir, String key) {
    return dir.resolve(key + SUFFIX);
  }

  /**
   * The file layout: a magic line, a format number, the key, the payload's SHA-256 and length,
   * then the payload: the packages in Java serialization.
   */
  static byte[] encode(String key, Collection<KiePackage> packages) throws IOException {
    ByteArrayOutputStream payload = new ByteArrayOutputStream();
    try (ObjectOutputStream out = new ObjectOutputStream(payload)) {
      out.writeObject(new ArrayList<>(packages));
    }
    byte[] body = payload.toByteArray();
    ByteArrayOutputStream file = new ByteArrayOutputStream(body.length + 256);
    try (DataOutputStream out = new DataOutputStream(file)) {
      out.write(MAGIC);
      out.writeInt(FORMAT);
      out.writeUTF(key);
      out.write(sha256(body));
      out.writeInt(body.length);
      out.write(body);
    }
    return file.toByteArray();
  }

  static Optional<List<KiePackage>> decode(byte[] bytes, String key, String where) {
    try {
      DataInputStream in = new DataInputStream(new ByteArrayInputStream(bytes));
      byte[] magic = in.readNBytes(MAGIC.length);
      if (!Arrays.equals(magic, MAGIC) || in.readInt() != FORMAT || !key.equals(in.readUTF())) {
        return miss(where, "not an entry of this format and key", null);
      }
      byte[] digest = in.readNBytes(32);
      int length = in.readInt();
      byte[] body = in.readNBytes(Math.max(0, length));
      if (length < 0 || body.length != length || in.read() != -1
          || !MessageDigest.isEqual(digest, sha256(body))) {
        return miss(where, "truncated or altered", null);
      }
      try (ObjectInputStream obj = new PackageInput(new ByteArrayInputStream(body))) {
        Object o = obj.readObject();
        if (!(o instanceof List<?> list) || list.isEmpty()
            || !list.stream().allMatch(KiePackage.class::isInstance)) {
          return miss(where, "holds no rule packages", null);
        }
        List<KiePackage> out = new ArrayList<>();
        list.forEach(p -> out.add((KiePackage) p));
        return Optional.of(out);
      }
    } catch (IOException | ClassNotFoundException | RuntimeException | LinkageError e) {
      return miss(where, "cannot be read back", e);
    }
  }

  private static <T> Optional<T> miss(String where, String why, Throwable e) {
    LOG.log(Level.FINE, "cached rules in " + where + " " + why + "; compiling instead", e);
    return Optional.empty();
  }

  /** Keeps the {@code keep} most recently written entries; others belong to old rules or builds. */
  static void prune(Path dir, int keep) throws IOException {
    List<Path> entries;
    try (Stream<Path> list = Files.list(dir)) {
      entries = list.filter(p -> p.getFileName().toString().endsWith(SUFFIX))
          .sorted(Comparator.comparing(RuleCache::modified).reversed()).toList();
    }
    for (Path p : entries.subList(Math.min(keep, entries.size()), entries.size())) {
      Files.deleteIfExists(p);
    }
  }

  private static FileTime modified(Path p) {
    try {
      return Files.getLastModifiedTime(p);
    } catch (IOException e) {
      return FileTime.fromMillis(0);
    }
  }

  private static byte[] sha256(byte[] bytes) {
    try {
      return MessageDigest.getInstance("SHA-256").digest(bytes);
    } catch (java.security.NoSuchAlgorithmException e) {
      throw new IllegalStateException(e);
    }
  }

  /**
   * Reads packages with Rimeward's own class loader and only the kinds of classes compiled rule
   * packages are made of, so a planted file cannot make the reader build arbitrary objects.
   */
  private static final class PackageInput extends ObjectInputStream {
    private static final ObjectInputFilter FILTER = ObjectInputFilter.Config.createFilter(
        "maxdepth=200;java.**;javax.**;org.drools.**;org.kie.**;org.mvel2.**;org.rimeward.**;!*");

    PackageInput(InputStream in) throws IOException {
      super(in);
      setObjectInputFilter(FILTER);
    }

    @Override
    protected Class<?> resolveClass(ObjectStreamClass desc) throws IOException, ClassNotFoundException {
      try {
        return Class.forName(desc.getName(), false, RuleCache.class.getClassLoader());
      } catch (ClassNotFoundException e) {
        try {
          return super.resolveClass(desc);
        } catch (ClassNotFoundException again) {
          throw new InvalidClassException(desc.getName(), "class not found: " + again.getMessage());
        }
      }
    }
  }
}
