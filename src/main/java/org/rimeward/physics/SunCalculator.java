package org.rimeward.physics;

import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.util.Objects;
import java.util.Optional;

/**
 * Sunrise, sunset and civil twilight with the NOAA Solar Calculator method (Meeus 1991). All
 * arithmetic is in UT; each event is converted with the zone's offset at that instant, so nights of
 * a daylight-saving change come out right.
 */
public final class SunCalculator {
  /** Sunrise/sunset: centre 0.833° below the horizon (refraction 0.567° + semi-diameter 0.266°). */
  static final double SUNRISE_ZENITH_DEG = 90.833;
  /** Civil twilight: centre 6° below the horizon. */
  static final double CIVIL_ZENITH_DEG = 96.0;

  private SunCalculator() {}

  /**
   * Civil dawn, sunrise, sunset and civil dusk for latitude (−90…90°, north positive), longitude
   * (−180…180°, east positive), a local date (years 1000…3000) and a zone; NOAA Solar Calculator
   * (Meeus 1991), within about a minute below ±72° latitude. Events belong to the solar day whose
   * noon is nearest local noon of the date, so an event may fall just past midnight.
   */
  public static SolarTimes times(double latDeg, double lonDeg, LocalDate date, ZoneId zone) {
    Ranges.check("latitude", latDeg, -90, 90, "°");
    Ranges.check("longitude", lonDeg, -180, 180, "°");
    Objects.requireNonNull(date, "date");
    Objects.requireNonNull(zone, "zone");
    Ranges.check("year", date.getYear(), 1000, 3000, "");
    double localNoon = SolarPosition.julianDay(date.atTime(LocalTime.NOON).atZone(zone).toInstant());
    double dayStart = Math.floor(localNoon - 0.5) + 0.5;
    double transit = dayStart + 0.5;
    for (int i = 0; i < 3; i++) {
      double eot = SolarPosition.at(transit).equationOfTimeMin();
      transit = dayStart + (720 - 4 * lonDeg - eot) / 1440.0;
      // Keep the transit nearest local noon: a far-off zone may put it on the next or previous UT day.
      if (transit - localNoon > 0.5) {
        dayStart -= 1;
        transit -= 1;
      } else if (localNoon - transit > 0.5) {
        dayStart += 1;
        transit += 1;
      }
    }
    double cosH = cosHourAngle(latDeg, SolarPosition.at(transit).declinationDeg(), SUNRISE_ZENITH_DEG);
    SolarTimes.Polar polar = cosH > 1 ? SolarTimes.Polar.NIGHT : cosH < -1 ? SolarTimes.Polar.DAY : null;
    return new SolarTimes(date, zone,
        event(latDeg, lonDeg, dayStart, transit, CIVIL_ZENITH_DEG, -1, zone),
        event(latDeg, lonDeg, dayStart, transit, SUNRISE_ZENITH_DEG, -1, zone),
        event(latDeg, lonDeg, dayStart, transit, SUNRISE_ZENITH_DEG, +1, zone),
        event(latDeg, lonDeg, dayStart, transit, CIVIL_ZENITH_DEG, +1, zone),
        polar);
  }

  /**
   * The night starting on a local date: sunset of {@code date} and sunrise of {@code date + 1},
   * same inputs and method as {@link #times}.
   */
  public static Night night(double latDeg, double lonDeg, LocalDate date, ZoneId zone) {
    SolarTimes evening = times(latDeg, lonDeg, date, zone);
    SolarTimes morning = times(latDeg, lonDeg, date.plusDays(1), zone);
    return new Night(date, evening.sunset(), morning.sunrise());
  }

  /** sign −1 = morning, +1 = evening. Refines the time with the Sun's position at the event. */
  private static Optional<ZonedDateTime> event(double lat, double lon, double dayStart, double transit,
      double zenith, int sign, ZoneId zone) {
    double jd = transit;
    for (int i = 0; i < 4; i++) {
      SolarPosition sun = SolarPosition.at(jd);
      double cosH = cosHourAngle(lat, sun.declinationDeg(), zenith);
      if (cosH > 1 || cosH < -1) {
        return Optional.empty();
      }
      double hourAngle = Math.toDegrees(Math.acos(cosH));
      jd = dayStart + (720 - 4 * (lon - sign * hourAngle) - sun.equationOfTimeMin()) / 1440.0;
    }
    return Optional.of(ZonedDateTime.ofInstant(SolarPosition.instantOf(jd), zone));
  }

  private static double cosHourAngle(double latDeg, double declDeg, double zenithDeg) {
    double lat = Math.toRadians(latDeg);
    double decl = Math.toRadians(declDeg);
    return Math.cos(Math.toRadians(zenithDeg)) / (Math.cos(lat) * Math.cos(decl))
        - Math.tan(lat) * Math.tan(decl);
  }
}
