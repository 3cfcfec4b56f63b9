package org.rimeward.weather;

import java.time.ZoneId;
import java.util.Objects;

/**
 * Where a forecast should be for: the farm's point and time zone. Readers use the zone for
 * local times without an offset and the point to refuse a response for another place.
 */
public record Site(double latitude, double longitude, ZoneId zone) {
  public Site {
    Objects.requireNonNull(zone, "zone");
    if (!(Math.abs(latitude) <= 90) || !(Math.abs(longitude) <= 180)) {
      throw new IllegalArgumentException("latitude " + latitude + " or longitude " + longitude
          + " is outside -90..90 / -180..180");
    }
  }

  /** Great-circle distance to another point, km (spherical Earth, mean radius 6371.0 km). */
  public double distanceKm(double lat, double lon) {
    double p1 = Math.toRadians(latitude);
    double p2 = Math.toRadians(lat);
    double dp = p2 - p1;
    double dl = Math.toRadians(lon - longitude);
    double a = Math.sin(dp / 2) * Math.sin(dp / 2)
        + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) * Math.sin(dl / 2);
    return 2 * 6371.0 * Math.asin(Math.min(1, Math.sqrt(a)));
  }
}
