package org.rimeward.watch;

import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.Function;
import java.util.function.ToDoubleFunction;
import org.rimeward.farm.Block;
import org.rimeward.farm.Farm;
import org.rimeward.physics.Wind;
import org.rimeward.plan.Action;
import org.rimeward.plan.AlarmReading;
import org.rimeward.plan.BlockPlan;
import org.rimeward.plan.NightUpdate;
import org.rimeward.plan.Plan;
import org.rimeward.plan.Replanner;
import org.rimeward.units.UnitFormat;
import org.rimeward.weather.Reading;

/**
 * Which alarms hold at {@code now}, given the re-plan and each station's latest reading. A
 * station's alarms (stale, colder than forecast) are raised for the blocks it stands for: once
 * for the farm ({@link Alarm#FARM_WIDE}) when it stands for every block, else block by block,
 * since a block goes stale when its station does. Numbers in messages are in the user's units;
 * thresholds are the {@link WatchPolicy}'s (from the rule files) and the plan's own.
 */
public final class AlarmCheck {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private AlarmCheck() {}

  /** The alarms of a re-plan, each block judged by the latest reading of its own station. */
  public static List<Alarm> check(Plan plan, Replanner replanner, Instant now, WatchPolicy p,
      UnitFormat fmt) {
    return check(plan, replanner.farm(),
        id -> replanner.basis(id).flatMap(x -> replanner.latestReading(x.station())),
        id -> replanner.basis(id).map(Replanner.Basis::coldAirOffsetC).orElse(0.0), now, p, fmt);
  }

  /**
   * As if one station at the forecast point stood for every block: {@code latest} is its reading,
   * and each block's air is that reading plus the block's cold-air offset.
   */
  static List<Alarm> check(Plan plan, Farm farm, Optional<Reading> latest, Instant now,
      WatchPolicy p, UnitFormat fmt) {
    return check(plan, farm, id -> latest,
        id -> farm.block(id).map(Block::coldAirOffsetC).orElse(0.0), now, p, fmt);
  }

  private static List<Alarm> check(Plan plan, Farm farm,
      Function<String, Optional<Reading>> latestFor, ToDoubleFunction<String> offsetFor,
      Instant now, WatchPolicy p, UnitFormat fmt) {
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
        String message = who + "readings " + fmt.tempDelta(-st.biasC())
            + " colder than forecast over the last hour";
        blocks.forEach(b -> out.add(new Alarm(b, AlarmKind.COLDER_THAN_FORECAST, level, now,
            message)));
      }
    }
    for (BlockPlan b : plan.blocks()) {
      Optional<Reading> latest = latestFor.apply(b.blockId());
      double offsetC = offsetFor.applyAsDouble(b.blockId());
      // The wind rules judge the wind at 10 m, as extension limits are stated; the station's wind
      // is brought there from its own height through the 2 m wind (FAO-56 Eq. 47), as the plan does.
      double wind2m = latest.flatMap(x -> x.windMs().isPresent()
          ? Optional.of(Wind.at2mMs(x.windMs().getAsDouble(), x.windHeightM())) : Optional.empty())
          .orElse(Double.NaN);
      double wind10m = wind2m / Wind.at2mMs(1.0, 10.0);
      Optional<Action.Sprinkle> s = b.sprinkle().filter(Action.Sprinkle::withWater);
      alarmTemperature(out, b, offsetC, s, latest, now, zone, fmt);
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
   *
   * @param offsetC what to add to the station's reading for the block's air
   */
  private static void alarmTemperature(List<Alarm> out, BlockPlan b, double offsetC,
      Optional<Action.Sprinkle> granted, Optional<Reading> latest, Instant now, ZoneId zone,
      UnitFormat fmt) {
    Optional<AlarmReading> alarm = b.alarm();
    if (latest.isEmpty() || alarm.isEmpty()
        || granted.isPresent() && !now.isBefore(granted.get().start())) {
      return;
    }
    double airNow = latest.get().airTempC() + offsetC;
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
