package org.rimeward;

import java.io.IOException;
import java.io.InputStream;
import java.util.Properties;

/** The version of this build: from the jar's manifest, or from the build's properties file. */
public final class BuildInfo {
  private BuildInfo() {}

  public static String version() {
    String v = BuildInfo.class.getPackage().getImplementationVersion();
    if (v != null) {
      return v;
    }
    try (InputStream in = BuildInfo.class.getResourceAsStream("/org/rimeward/version.properties")) {
      Properties p = new Properties();
      if (in != null) {
        p.load(in);
      }
      return p.getProperty("version", "unknown");
    } catch (IOException e) {
      return "unknown";
    }
  }
}
