package org.rimeward.fetch;

import java.net.URI;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/** URLs as they may be shown and recorded: without user names, passwords or keys. */
final class Urls {
  private static final Pattern SECRET = Pattern.compile(
      "(?i)(api_?key|apikey|key|token|access_token|secret|password|passwd|sig|signature|auth)");

  private Urls() {}

  static String withoutSecrets(URI url) {
    StringBuilder sb = new StringBuilder();
    sb.append(url.getScheme()).append("://").append(url.getHost());
    if (url.getPort() > 0) {
      sb.append(':').append(url.getPort());
    }
    sb.append(url.getRawPath() == null ? "" : url.getRawPath());
    String q = url.getRawQuery();
    if (q != null && !q.isEmpty()) {
      List<String> kept = new ArrayList<>();
      for (String part : q.split("&")) {
        String name = part.contains("=") ? part.substring(0, part.indexOf('=')) : part;
        kept.add(SECRET.matcher(name).matches() ? name + "=(removed)" : part);
      }
      sb.append('?').append(String.join("&", kept));
    }
    return sb.toString();
  }
}
