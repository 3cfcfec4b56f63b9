package org.rimeward.cli;

import java.time.DateTimeException;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZonedDateTime;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rimeward.io.BadInputException;
import org.rimeward.physics.SolarTimes;
import org.rimeward.physics.SunCalculator;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "sun",
    description = {"Civil dawn, sunrise, sunset and civil dusk for one local date (NOAA solar"
        + " calculator method), in the local time of the zone, daylight saving included.",
        "Decision support: frost risk is usually greatest around sunrise."},
    footer = {"", Cautions.HELP_FOOTER})
final class CalcSunCommand implements Runnable {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm xxx", Locale.ROOT);

  @Spec CommandSpec spec;

  @Option(names = "--lat", required = true, paramLabel = "LAT",
      description = "Latitude in decimal degrees, north positive (-90 to 90), e.g. 47.42.")
  double lat;

  @Option(names = "--lon", required = true, paramLabel = "LON",
      description = "Longitude in decimal degrees, east positive (-180 to 180), e.g. -120.31.")
  double lon;

  @Option(names = "--date", required = true, paramLabel = "YYYY-MM-DD", description = "Local date, e.g. 2024-04-15.")
  String date;

  @Option(names = "--zone", required = true, paramLabel = "AREA/CITY",
      description = "Time zone, e.g. America/Los_Angeles or Europe/Berlin.")
  String zone;

  @Option(names = "--json", description = "Print one JSON object.")
  boolean json;

  @Override
  public void run() {
    LocalDate day;
    try {
      day = LocalDate.parse(date.trim());
    } catch (DateTimeParseException e) {
      throw new BadInputException("--date: '" + date + "' is not a date; write it as YYYY-MM-DD,"
          + " for example 2024-04-15");
    }
    ZoneId zoneId;
    try {
      zoneId = ZoneId.of(zone.trim());
    } catch (DateTimeException e) {
      throw new BadInputException("--zone: '" + zone + "' is not a known time zone; write it as"
          + " Area/City, for example America/Los_Angeles");
    }
    SolarTimes t = SunCalculator.times(lat, lon, day, zoneId);
    String polar = t.polar() == null ? null : t.polar().name().toLowerCase(Locale.ROOT);
    if (json) {
      Map<String, Object> m = new LinkedHashMap<>();
      m.put("sunrise", iso(t.sunrise()));
      m.put("sunset", iso(t.sunset()));
      m.put("civil_dawn", iso(t.civilDawn()));
      m.put("civil_dusk", iso(t.civilDusk()));
      m.put("polar", polar);
      CalcOutput.printJson(spec, m);
      return;
    }
    String line = String.format(Locale.ROOT, "%s at %.4f, %.4f (%s): civil dawn %s, sunrise %s,"
        + " sunset %s, civil dusk %s", day, lat, lon, zoneId, clock(t.civilDawn()), clock(t.sunrise()),
        clock(t.sunset()), clock(t.civilDusk()));
    if (t.polar() == SolarTimes.Polar.DAY) {
      line += "; polar day: the Sun does not set";
    } else if (t.polar() == SolarTimes.Polar.NIGHT) {
      line += "; polar night: the Sun does not rise";
    }
    CalcOutput.printLine(spec, line);
  }

  private static String iso(Optional<ZonedDateTime> t) {
    return t.map(z -> z.toOffsetDateTime().format(DateTimeFormatter.ISO_OFFSET_DATE_TIME)).orElse(null);
  }

  private static String clock(Optional<ZonedDateTime> t) {
    return t.map(z -> z.format(CLOCK)).orElse("none");
  }
}
