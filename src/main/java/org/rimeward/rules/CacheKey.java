package org.rimeward.rules;

import java.io.IOException;
import java.io.InputStream;
import java.net.URI;
import java.net.URISyntaxException;
import java.net.URL;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.BasicFileAttributes;
import java.security.CodeSource;
import java.util.HexFormat;
import java.util.List;
import java.util.Properties;
import java.util.TreeMap;
import java.util.stream.Stream;
import java.util.zip.CRC32;

/**
 * The key compiled rules are cached under. Compiled consequences and constraints are bytecode
 * that calls the fact classes as they were at compile time, so besides the rule text the key
 * covers the Rimeward build (run from a classes folder: every class's size and CRC-32; run from
 * a jar: the jar's path, size and modification time), the rule engine's version and the Java
 * version.
 */
final class CacheKey {
  private static final String ROOT = "org/rimeward/";
  private static volatile String codeFingerprint;

  private CacheKey() {}

  static String of(String rulesContentHash) {
    return RuleBook.sha256("rules " + rulesContentHash + "\ncode " + codeFingerprint()
        + "\ndrools " + engineVersion() + "\njava " + System.getProperty("java.specification.version")
        + "\n");
  }

  static String codeFingerprint() {
    String f = codeFingerprint;
    if (f == null) {
      f = computeFingerprint();
      codeFingerprint = f;
    }
    return f;
  }

  /** The version of each engine part that compiles or runs rules. */
  static String engineVersion() {
    StringBuilder sb = new StringBuilder();
    for (String artifact : List.of("drools-core", "drools-compiler", "drools-mvel", "drools-base")) {
      String res = "META-INF/maven/org.drools/" + artifact + "/pom.properties";
      String v = "?";
      try (InputStream in = CacheKey.class.getClassLoader().getResourceAsStream(res)) {
        if (in != null) {
          Properties p = new Properties();
          p.load(in);
          v = p.getProperty("version", "?");
        }
      } catch (IOException e) {
        v = "?";
      }
      sb.append(artifact).append('=').append(v).append(';');
    }
    return sb.toString();
  }

  private static String computeFingerprint() {
    Path location = codeLocation();
    return location == null ? unknown() : fingerprintOf(location);
  }

  /** The fingerprint of the Rimeward classes in a classes folder or a jar. */
  static String fingerprintOf(Path location) {
    TreeMap<String, String> entries = new TreeMap<>();
    try {
      if (Files.isDirectory(location)) {
        Path root = location.resolve(ROOT);
        try (Stream<Path> walk = Files.walk(root)) {
          for (Path p : walk.filter(q -> q.toString().endsWith(".class")).toList()) {
            byte[] bytes = Files.readAllBytes(p);
            CRC32 crc = new CRC32();
            crc.update(bytes);
            String name = location.relativize(p).toString().replace('\\', '/');
            entries.put(name, bytes.length + ":" + Long.toHexString(crc.getValue()));
          }
        }
      } else {
        // A jar is rewritten whole by a build: its path, size and modification time tell one
        // build from another without reading its thousands of entries on every start.
        BasicFileAttributes a = Files.readAttributes(location, BasicFileAttributes.class);
        entries.put(location.toAbsolutePath().toString(),
            a.size() + ":" + a.lastModifiedTime().toMillis());
      }
    } catch (IOException | RuntimeException e) {
      return unknown();
    }
    if (entries.isEmpty()) {
      return unknown();
    }
    StringBuilder sb = new StringBuilder();
    entries.forEach((k, v) -> sb.append(k).append(' ').append(v).append('\n'));
    return RuleBook.sha256(sb.toString());
  }

  /** Unknown code can never be matched with a cached entry: each run gets a fresh fingerprint. */
  private static String unknown() {
    byte[] random = new byte[16];
    new java.security.SecureRandom().nextBytes(random);
    return "unknown-" + HexFormat.of().formatHex(random);
  }

  private static Path codeLocation() {
    CodeSource cs = CacheKey.class.getProtectionDomain().getCodeSource();
    URL url = cs == null ? null : cs.getLocation();
    if (url == null) {
      return null;
    }
    try {
      URI uri = url.toURI();
      return "file".equals(uri.getScheme()) ? Path.of(uri) : null;
    } catch (URISyntaxException | IllegalArgumentException e) {
      return null;
    }
  }
}
