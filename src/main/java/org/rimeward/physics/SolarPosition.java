package org.rimeward.physics;

import java.time.Instant;

/**
 * Apparent position of the Sun at one instant, NOAA Solar Calculator equations after Meeus,
 * <i>Astronomical Algorithms</i> (1991, ch. 25 low-accuracy method).
 *
 * @param julianDay Julian Day of the instant (UT)
 * @param apparentLongitudeDeg apparent ecliptic longitude, degrees 0…360
 * @param declinationDeg declination, degrees
 * @param rightAscensionDeg apparent right ascension, degrees 0…360
 * @param equationOfTimeMin equation of time (apparent minus mean solar time), minutes
 */
public record SolarPosition(double julianDay, double apparentLongitudeDeg, double declinationDeg,
    double rightAscensionDeg, double equationOfTimeMin) {

  /** Julian Day of an instant; JD 2451545.0 = 2000-01-01 12:00 UT (Meeus 1991, ch. 7). */
  public static double julianDay(Instant instant) {
    return instant.getEpochSecond() / 86400.0 + instant.getNano() / 86400e9 + 2440587.5;
  }

  /** The instant of a Julian Day, rounded to the second. */
  public static Instant instantOf(double julianDay) {
    return Instant.ofEpochSecond(Math.round((julianDay - 2440587.5) * 86400.0));
  }

  /**
   * Solar coordinates at a Julian Day (years 1000…3000); NOAA Solar Calculator / Meeus (1991)
   * ch. 25 and the equation of time of ch. 28, accurate to about 0.01° and a few seconds of time.
   */
  public static SolarPosition at(double julianDay) {
    Ranges.check("Julian Day", julianDay, 2086302.5, 2816787.5, "");
    double t = (julianDay - 2451545.0) / 36525.0;
    double l0 = mod360(280.46646 + t * (36000.76983 + 0.0003032 * t));
    double m = 357.52911 + t * (35999.05029 - 0.0001537 * t);
    double e = 0.016708634 - t * (0.000042037 + 0.0000001267 * t);
    double mr = Math.toRadians(m);
    double c = Math.sin(mr) * (1.914602 - t * (0.004817 + 0.000014 * t))
        + Math.sin(2 * mr) * (0.019993 - 0.000101 * t)
        + Math.sin(3 * mr) * 0.000289;
    double trueLong = l0 + c;
    double omega = Math.toRadians(125.04 - 1934.136 * t);
    double lambda = trueLong - 0.00569 - 0.00478 * Math.sin(omega);
    double eps0 = 23 + (26 + (21.448 - t * (46.815 + t * (0.00059 - t * 0.001813))) / 60) / 60;
    double eps = Math.toRadians(eps0 + 0.00256 * Math.cos(omega));
    double lr = Math.toRadians(lambda);
    double decl = Math.toDegrees(Math.asin(Math.sin(eps) * Math.sin(lr)));
    double ra = mod360(Math.toDegrees(Math.atan2(Math.cos(eps) * Math.sin(lr), Math.cos(lr))));
    // The equation of time uses the mean obliquity (Meeus 1991, eq. 28.3, as in NOAA's calculator).
    double y = Math.pow(Math.tan(Math.toRadians(eps0 + 0.00256 * Math.cos(omega)) / 2), 2);
    double l0r = Math.toRadians(l0);
    double eot = y * Math.sin(2 * l0r) - 2 * e * Math.sin(mr) + 4 * e * y * Math.sin(mr) * Math.cos(2 * l0r)
        - 0.5 * y * y * Math.sin(4 * l0r) - 1.25 * e * e * Math.sin(2 * mr);
    return new SolarPosition(julianDay, mod360(lambda), decl, ra, 4 * Math.toDegrees(eot));
  }

  private static double mod360(double deg) {
    double r = deg % 360.0;
    return r < 0 ? r + 360.0 : r;
  }
}
