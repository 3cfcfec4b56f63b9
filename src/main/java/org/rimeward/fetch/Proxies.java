package org.rimeward.fetch;

import java.io.IOException;
import java.net.InetSocketAddress;
import java.net.Proxy;
import java.net.ProxySelector;
import java.net.SocketAddress;
import java.net.URI;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The proxy the environment names, as curl and most tools read it: {@code HTTPS_PROXY} for
 * https, {@code HTTP_PROXY} for http (either in lower case too), never for the loopback or the
 * hosts in {@code NO_PROXY}.
 */
final class Proxies extends ProxySelector {
  private final Map<String, String> env;

  private Proxies(Map<String, String> env) {
    this.env = env;
  }

  static ProxySelector fromEnvironment(Map<String, String> env) {
    return new Proxies(Map.copyOf(env));
  }

  @Override
  public List<Proxy> select(URI uri) {
    String host = uri.getHost() == null ? "" : uri.getHost().toLowerCase(Locale.ROOT);
    if (isLoopback(host) || excluded(host)) {
      return List.of(Proxy.NO_PROXY);
    }
    String value = "https".equalsIgnoreCase(uri.getScheme()) ? get("HTTPS_PROXY") : get("HTTP_PROXY");
    if (value == null || value.isBlank()) {
      return List.of(Proxy.NO_PROXY);
    }
    URI proxy = URI.create(value.contains("://") ? value : "http://" + value);
    int port = proxy.getPort() > 0 ? proxy.getPort() : 80;
    return List.of(new Proxy(Proxy.Type.HTTP, InetSocketAddress.createUnresolved(proxy.getHost(), port)));
  }

  @Override
  public void connectFailed(URI uri, SocketAddress sa, IOException ioe) {
    // The request fails with its own message; there is no other proxy to try.
  }

  /** The proxy an https request to {@code uri} would use, for messages; null for none. */
  String describe(URI uri) {
    Proxy p = select(uri).get(0);
    return p.type() == Proxy.Type.DIRECT ? null : p.address().toString();
  }

  private String get(String name) {
    String v = env.get(name);
    return v != null ? v : env.get(name.toLowerCase(Locale.ROOT));
  }

  private boolean excluded(String host) {
    String list = get("NO_PROXY");
    if (list == null) {
      return false;
    }
    return Arrays.stream(list.split(",")).map(String::trim).map(s -> s.toLowerCase(Locale.ROOT))
        .filter(s -> !s.isEmpty())
        .anyMatch(s -> s.equals("*") || host.equals(s.replaceFirst("^\\.", ""))
            || host.endsWith(s.startsWith(".") ? s : "." + s));
  }

  private static boolean isLoopback(String host) {
    return host.equals("localhost") || host.startsWith("127.") || host.equals("[::1]") || host.equals("::1");
  }
}
