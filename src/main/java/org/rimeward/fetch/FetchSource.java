package org.rimeward.fetch;

import java.net.URI;
import java.util.Arrays;
import java.util.stream.Collectors;

/** The weather services {@code forecast fetch} asks, with their public addresses. */
public enum FetchSource {
  OPEN_METEO("open-meteo", "Open-Meteo", "https://api.open-meteo.com", false),
  NWS("nws", "NWS (api.weather.gov)", "https://api.weather.gov", true),
  MET_NORWAY("met-norway", "MET Norway", "https://api.met.no", true);

  private final String id;
  private final String label;
  private final URI baseUrl;
  private final boolean wantsContact;

  FetchSource(String id, String label, String baseUrl, boolean wantsContact) {
    this.id = id;
    this.label = label;
    this.baseUrl = URI.create(baseUrl);
    this.wantsContact = wantsContact;
  }

  public String id() {
    return id;
  }

  public String label() {
    return label;
  }

  public URI baseUrl() {
    return baseUrl;
  }

  /** Whether the service's terms ask each client to give a contact in its User-Agent. */
  public boolean wantsContact() {
    return wantsContact;
  }

  public static FetchSource of(String id) {
    return Arrays.stream(values()).filter(s -> s.id.equals(id)).findFirst()
        .orElseThrow(() -> new IllegalArgumentException(id));
  }

  public static String ids() {
    return Arrays.stream(values()).map(FetchSource::id).collect(Collectors.joining(", "));
  }
}
