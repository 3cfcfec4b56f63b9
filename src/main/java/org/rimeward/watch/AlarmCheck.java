package org.rimeward.watch;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.physics.Wind;
import org.rimeward.plan.Action;
import org.rimeward.plan.AlarmReading;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.NightUpdate;
import org.rimeward.plan.Plan;
import org.rimeward.units.UnitFormat;
import org.rimeward.weather.Reading;

/**
 * Which alarms hold at {@code now}, given the re-plan and the latest reading. Numbers in messages
 * are in the user's units; thresholds are the {@link WatchPolicy}'s and the plan's own.
 */
public final class AlarmCheck {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private AlarmCheck() {}

  public static List<Alarm> check(Plan plan, Farm farm, Optional<Reading> latest, Instant now,
      WatchPolicy p, UnitFormat fmt) {
    ZoneId zone = farm.zone();
    List<Alarm> out = new ArrayList<>();
    NightUpdate.ReadingsSummary r = plan.update().readings();
    Optional<Instant> last = r.lastAt();
    if (last.isEmpty() || Duration.between(last.get(), now).compareTo(p.staleAfter()) > 0) {
      out.add(new Alarm(Alarm.FARM_WIDE, AlarmKind.STALE, 1, now, last.map(t -> "no reading since "
          + clock(t, zone) + " (" + Duration.between(t, now).toMinutes() + " min)").orElse("no reading"
          + " yet") + ": the station or its logger may have failed; the plan runs on the forecast"));
    }
    if (!Double.isNaN(r.biasC()) && -r.biasC() > p.colderMarginC()) {
      int level = (int) Math.floor(-r.biasC() / p.colderMarginC());
      out.add(new Alarm(Alarm.FARM_WIDE, AlarmKind.COLDER_THAN_FORECAST, level, now,
          "readings " + fmt.tempDelta(-r.biasC()) + " colder than forecast over the last hour"));
    }
    // The wind rules judge the wind at 10 m, as extension limits are stated; the station's wind is
    // brought there from its own height through the 2 m wind (FAO-56 Eq. 47), as the plan does.
    double wind2m = latest.flatMap(x -> x.windMs().isPresent()
        ? Optional.of(Wind.at2mMs(x.windMs().getAsDouble(), x.windHeightM())) : Optional.empty())
        .orElse(Double.NaN);
    double wind10m = wind2m / Wind.at2mMs(1.0, 10.0);
    for (BlockPlan b : plan.blocks()) {
      Block block = farm.blocks().stream().filter(x -> x.id().equals(b.blockId())).findFirst().orElseThrow();
      Optional<Action.Sprinkle> s = b.sprinkle().filter(Action.Sprinkle::withWater);
      alarmTemperature(out, b, block, s, latest, now, zone, fmt);
      if (s.isPresent()) {
        Instant start = s.get().start();
        Instant stop = s.get().stop();
        if (now.isBefore(start)) {
          if (!now.plus(p.lead()).isBefore(start)) {
            out.add(new Alarm(b.blockId(), AlarmKind.START_DUE, 1, now, "start sprinkling at "
                + clock(start, zone) + " (in " + Duration.between(now, start).toMinutes() + " min)"));
          }
        } else if (now.isBefore(stop)) {
          out.add(new Alarm(b.blockId(), AlarmKind.START_DUE, 2, now, "start overdue since "
              + clock(start, zone) + ": sprinkling should be running"));
          windAlarm(out, b, wind10m, wind2m, p, now, "while sprinkling", fmt);
        } else {
          out.add(new Alarm(b.blockId(), AlarmKind.STOP_ALLOWED, 1, now, "the stop condition is met"
              + " (from " + clock(stop, zone) + "): sprinklers may stop once the ice is loose and"
              + " melting"));
        }
      }
      Optional<Action.Cover> c = b.cover();
      if (c.isPresent() && !now.isBefore(c.get().deployStart()) && now.isBefore(c.get().remove())) {
        windAlarm(out, b, wind10m, wind2m, p, now, "with covers on", fmt);
      }
    }
    return out;
  }

  /**
   * The plan's own alarm temperature for the block (rules ALARM-*), so that the watch rings at the
   * number the plan told the manager to set the alarm at: before a granted run starts, and on a
   * block the plan gives no run (a near miss, a run advised against or left without water), where
   * the cold coming early is exactly what the manager must hear.
   */
  private static void alarmTemperature(List<Alarm> out, BlockPlan b, Block block,
      Optional<Action.Sprinkle> granted, Optional<Reading> latest, Instant now, ZoneId zone,
      UnitFormat fmt) {
    Optional<AlarmReading> alarm = b.alarm();
    if (latest.isEmpty() || alarm.isEmpty()
        || granted.isPresent() && !now.isBefore(granted.get().start())) {
      return;
    }
    double airNow = latest.get().airTempC() + block.coldAirOffsetC();
    if (airNow > alarm.get().alarmAirC()) {
      return;
    }
    String then;
    if (granted.isPresent()) {
      then = "; sprinkling starts when the air falls to " + fmt.temp(alarm.get().startAirC())
          + ", planned at " + clock(granted.get().start(), zone);
    } else if (b.sprinkle().isPresent()) {
      then = "; the plan does not sprinkle this block tonight (advised against, or no water for"
          + " it): the crop is at risk below " + fmt.temp(alarm.get().startAirC())
          + "; see the block's row for what to do instead";
    } else {
      then = "; the plan forecast a near miss: start sprinkling when the air falls to "
          + fmt.temp(alarm.get().startAirC());
    }
    out.add(new Alarm(b.blockId(), AlarmKind.ALARM_TEMPERATURE, 1, now, "air " + fmt.temp(airNow)
        + " at the block, at or below the alarm temperature the plan sets, "
        + fmt.temp(alarm.get().alarmAirC()) + then));
  }

  private static void windAlarm(List<Alarm> out, BlockPlan b, double wind10m, double wind2m,
      WatchPolicy p, Instant now, String when, UnitFormat fmt) {
    if (!Double.isNaN(wind10m) && wind10m > p.windyWind10mMs()) {
      out.add(new Alarm(b.blockId(), AlarmKind.WIND, 1, now, "wind " + fmt.speed(wind10m)
          + " at 10 m (" + fmt.speed(wind2m) + " at 2 m), above the windy limit of "
          + fmt.speed(p.windyWind10mMs()) + " " + when));
    }
  }

  private static String clock(Instant t, ZoneId zone) {
    return CLOCK.format(t.atZone(zone));
  }
}
