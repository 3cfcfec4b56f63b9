package org.rimeward.watch;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rimeward.farm.Farm;
import org.rimeward.physics.Wind;
import org.rimeward.plan.Action;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.NightUpdate;
import org.rimeward.plan.Plan;
import org.rimeward.plan.Replanner;
import org.rimeward.weather.ForecastCorrection;
import org.rimeward.weather.Reading;

/**
 * Which alarms hold at {@code now}, given the re-plan and each station's latest reading. A
 * station's alarms (stale, colder than forecast) are raised for the blocks it stands for: once
 * for the farm ({@link Alarm#FARM_WIDE}) when it stands for every block, else block by block,
 * since a block goes stale when its station does.
 */
public final class AlarmCheck {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private AlarmCheck() {}

  public static List<Alarm> check(Plan plan, Replanner replanner, Instant now, WatchPolicy p) {
    Farm farm = replanner.farm();
    ZoneId zone = farm.zone();
    List<Alarm> out = new ArrayList<>();
    NightUpdate.ReadingsSummary r = plan.update().readings();
    for (NightUpdate.StationSummary st : r.planning()) {
      List<String> blocks = st.blocks().size() == farm.blocks().size() ? List.of(Alarm.FARM_WIDE)
          : st.blocks();
      String who = st.id().isEmpty() ? "" : "station " + st.id() + ": ";
      Optional<Instant> last = st.lastAt();
      if (last.isEmpty() || Duration.between(last.get(), now).compareTo(p.staleAfter()) > 0) {
        String message = who + last.map(t -> "no reading since " + clock(t, zone) + " ("
            + Duration.between(t, now).toMinutes() + " min)").orElse("no reading yet")
            + ": the station or its logger may have failed; the plan runs on the forecast";
        blocks.forEach(b -> out.add(new Alarm(b, AlarmKind.STALE, 1, now, message)));
      }
      if (!Double.isNaN(st.biasC()) && -st.biasC() > p.colderMarginC()) {
        int level = (int) Math.floor(-st.biasC() / p.colderMarginC());
        String message = who + String.format(Locale.ROOT, "readings %.1f °C colder than forecast"
            + " over the last hour", -st.biasC());
        blocks.forEach(b -> out.add(new Alarm(b, AlarmKind.COLDER_THAN_FORECAST, level, now,
            message)));
      }
    }
    for (BlockPlan b : plan.blocks()) {
      Optional<Replanner.Basis> basis = replanner.basis(b.blockId());
      Optional<Reading> latest = basis.flatMap(x -> replanner.latestReading(x.station()));
      double offsetC = basis.map(Replanner.Basis::coldAirOffsetC).orElse(0.0);
      double wind2m = latest.flatMap(x -> x.windMs().isPresent()
          ? Optional.of(Wind.at2mMs(x.windMs().getAsDouble(), x.windHeightM())) : Optional.empty())
          .orElse(Double.NaN);
      Optional<Action.Sprinkle> s = b.sprinkle().filter(Action.Sprinkle::withWater);
      if (s.isPresent()) {
        Instant start = s.get().start();
        Instant stop = s.get().stop();
        if (now.isBefore(start)) {
          if (!now.plus(p.lead()).isBefore(start)) {
            out.add(new Alarm(b.blockId(), AlarmKind.START_DUE, 1, now, "start sprinkling at "
                + clock(start, zone) + " (in " + Duration.between(now, start).toMinutes() + " min)"));
          }
          if (latest.isPresent() && basis.isPresent()
              && !start.isAfter(basis.get().forecast().end())
              && !start.isBefore(basis.get().forecast().start())) {
            double startAir = ForecastCorrection.forecastAirC(basis.get().forecast(), start) + offsetC;
            double airNow = latest.get().airTempC() + offsetC;
            if (airNow <= startAir + p.alarmMarginC()) {
              out.add(new Alarm(b.blockId(), AlarmKind.ALARM_TEMPERATURE, 1, now, String.format(
                  Locale.ROOT, "air %.1f °C at the block, within %.1f °C of the %.1f °C planned for the"
                      + " start at %s", airNow, p.alarmMarginC(), startAir, clock(start, zone))));
            }
          }
        } else if (now.isBefore(stop)) {
          out.add(new Alarm(b.blockId(), AlarmKind.START_DUE, 2, now, "start overdue since "
              + clock(start, zone) + ": sprinkling should be running"));
          windAlarm(out, b, wind2m, p, now, "while sprinkling");
        } else {
          out.add(new Alarm(b.blockId(), AlarmKind.STOP_ALLOWED, 1, now, "the stop condition is met"
              + " (from " + clock(stop, zone) + "): sprinklers may stop once the ice is loose and"
              + " melting"));
        }
      }
      Optional<Action.Cover> c = b.cover();
      if (c.isPresent() && !now.isBefore(c.get().deployStart()) && now.isBefore(c.get().remove())) {
        windAlarm(out, b, wind2m, p, now, "with covers on");
      }
    }
    return out;
  }

  private static void windAlarm(List<Alarm> out, BlockPlan b, double wind2m, WatchPolicy p,
      Instant now, String when) {
    if (!Double.isNaN(wind2m) && wind2m > p.windLimitMs()) {
      out.add(new Alarm(b.blockId(), AlarmKind.WIND, 1, now, String.format(Locale.ROOT,
          "wind %.1f m/s at 2 m, above %.1f m/s %s", wind2m, p.windLimitMs(), when)));
    }
  }

  private static String clock(Instant t, ZoneId zone) {
    return CLOCK.format(t.atZone(zone));
  }
}
