package org.rimeward.plan;

import java.time.Duration;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/** How a re-plan's update goes into the plan document, and how its text reads. */
final class NightUpdateView {
  /** An event within this of now is "due now" rather than past or upcoming (common practice). */
  static final Duration DUE_NOW = Duration.ofMinutes(5);
  private static final Pattern DEGREES = Pattern.compile("(\\d+\\.\\d) °C");

  private NightUpdateView() {}

  static PlanDocument.Readings readings(NightUpdate u, ZoneId zone) {
    NightUpdate.ReadingsSummary r = u.readings();
    PlanDocument.SiteMinimum site = r.siteMinimum().map(s -> new PlanDocument.SiteMinimum(s.t0C(),
        s.td0C(), s.siteMinC(), s.intervalHalfC(), nullIfNaN(s.forecastMinC()), s.usedSite(),
        s.why())).orElse(null);
    List<StationReadings> stations = r.stations().stream().map(st -> new StationReadings(st.id(),
        st.declared(), st.isDefault(), nullIfNaN(st.heightM()), nullIfNaN(st.budHeightM()),
        st.blocks(), st.rows(), st.lastAt().map(t -> PlanDocuments.time(t, zone)).orElse(null),
        nullIfNaN(st.biasC()), nullIfNaN(st.dewBiasC()), st.stale(),
        st.note().isEmpty() ? null : st.note(), st.hangsIn(), st.points().stream()
            .map(p -> new PlanDocument.Point(PlanDocuments.time(p.at(), zone), p.airC())).toList()))
        .toList();
    return new PlanDocument.Readings(r.file(),
        r.lastAt().map(t -> PlanDocuments.time(t, zone)).orElse(null), nullIfNaN(r.biasC()),
        nullIfNaN(r.dewBiasC()), stations, r.station(), r.method(), r.methodText(), r.rows(),
        r.skipped().size(), r.skipped().stream().limit(5).toList(), r.stale(), r.staleAfterMin(),
        site, r.points().stream().map(p -> new PlanDocument.Point(PlanDocuments.time(p.at(), zone),
            p.airC())).toList());
  }

  static List<PlanDocument.Change> changes(NightUpdate u) {
    return u.changes().stream().map(c -> new PlanDocument.Change(c.blockId(), c.what(), c.before(),
        c.after(), c.text())).toList();
  }

  private static Double nullIfNaN(double v) {
    return Double.isNaN(v) ? null : v;
  }

  /** A planned time as the table shows it: upcoming, due now, or overdue since. */
  static String when(OffsetDateTime t, OffsetDateTime now, UnitFormat fmt) {
    if (t == null || now == null || t.isAfter(now.plus(DUE_NOW))) {
      return fmt.clock(t);
    }
    return t.isBefore(now.minus(DUE_NOW)) ? "overdue since " + fmt.clock(t) : "due now";
  }

  /** The lines that come first in the text: what changed, then what the readings showed. */
  static String header(PlanDocument plan, UnitFormat fmt) {
    PlanDocument.Readings r = plan.readings();
    List<StationReadings> planning = r == null ? List.of() : r.stations().stream()
        .filter(st -> !st.blocks().isEmpty()).toList();
    StringBuilder sb = new StringBuilder();
    sb.append("Re-planned at ").append(fmt.clock(plan.now())).append(planning.size() > 1
        ? " from the stations' readings\n" : " from the station's readings\n");
    List<PlanDocument.Change> changes = plan.changes() == null ? List.of() : plan.changes();
    if (changes.isEmpty()) {
      sb.append("  No decision changed since the latest recorded plan for this night.\n");
    } else {
      sb.append("  Changed since the latest recorded plan for this night:\n");
      changes.forEach(c -> sb.append("  - ").append(inUnits(c.text(), fmt)).append('\n'));
    }
    if (r == null) {
      return sb.append('\n').toString();
    }
    if (planning.size() > 1) {
      sb.append("  Readings (").append(r.file()).append("), by station:\n");
      for (StationReadings st : planning) {
        sb.append("  - ").append(st.id()).append(st.isDefault() ? " (default" : " (").append(
            st.heightM() == null ? "" : (st.isDefault() ? ", " : "") + "thermometer "
                + fmt.length(st.heightM())).append(") for ").append(String.join(", ", st.blocks()))
            .append(": ").append(last(st.lastAt(), st.biasC(), fmt)).append('\n');
        if (st.stale()) {
          sb.append("    STALE: no reading in the last ").append(staleLimit(r)).append("; the station or its logger may have failed. Its"
                  + " blocks' rest of the night is the forecast").append(st.biasC() == null
                  ? " alone" : "").append(".\n");
        }
      }
    } else {
      sb.append("  Readings (").append(r.file())
          .append(r.station() == null || r.station().isEmpty() ? "" : ", station " + r.station())
          .append("): ").append(last(r.lastAt(), r.biasC(), fmt)).append('\n');
      if (r.stale()) {
        sb.append("  STALE: no reading in the last ").append(staleLimit(r)).append("; the station or its logger may have failed. The rest of"
                + " the night is the forecast").append(r.biasC() == null ? " alone" : "").append(".\n");
      }
    }
    for (StationReadings st : r.stations()) {
      if (!st.declared() && st.blocks().isEmpty() && st.note() != null
          && !st.note().startsWith("not planned by")) {
        sb.append("  ").append(st.id().isEmpty() ? "" : "Station " + st.id() + ": ")
            .append(st.note()).append(".\n");
      }
    }
    if (r.rowsSkipped() > 0) {
      sb.append("  ").append(r.rowsSkipped()).append(" unusable row(s) skipped; first: ")
          .append(r.skipped().isEmpty() ? "?" : r.skipped().get(0)).append('\n');
    }
    sb.append("  Correction: ").append(r.methodText()).append(".\n");
    if (r.siteMinimum() != null) {
      sb.append("  Site minimum: ").append(inUnits(r.siteMinimum().why(), fmt)).append(".\n");
    }
    return sb.append('\n').toString();
  }

  private static String last(OffsetDateTime lastAt, Double biasC, UnitFormat fmt) {
    StringBuilder sb = new StringBuilder(lastAt == null ? "none yet" : "last at " + fmt.clock(lastAt));
    if (biasC != null && Math.abs(biasC) < 0.05) {
      sb.append(", matching the forecast over the last hour");
    } else if (biasC != null) {
      sb.append(", ").append(fmt.tempDelta(Math.abs(biasC))).append(biasC < 0 ? " colder"
          : " warmer").append(" than forecast over the last hour");
    }
    return sb.toString();
  }

  /**
   * The words after the night's coldest air in the text's second line: what that air is, the
   * forecast's or the forecast corrected by readings.
   */
  static String coldestBasis(PlanDocument plan) {
    PlanDocument.Readings r = plan.readings();
    if (plan.now() == null || r == null) {
      return "forecast air";
    }
    if (r.lastAt() == null) {
      return "forecast air: no reading yet";
    }
    boolean several = r.stations().stream().filter(st -> !st.blocks().isEmpty()).count() > 1;
    return "forecast corrected by " + (several && r.station() != null && !r.station().isEmpty()
        ? "station " + r.station() + "'s readings" : "readings");
  }

  /** The rule files' stale limit as the plan recorded it; older plans did not record it. */
  private static String staleLimit(PlanDocument.Readings r) {
    return r.staleAfterMin() == null ? "hour" : r.staleAfterMin() + " min";
  }

  /** The recorded words are metric; other units rewrite their temperatures. */
  private static String inUnits(String text, UnitFormat fmt) {
    if (fmt.system() == UnitSystem.METRIC) {
      return text;
    }
    Matcher m = DEGREES.matcher(text);
    StringBuilder out = new StringBuilder();
    while (m.find()) {
      m.appendReplacement(out, Matcher.quoteReplacement(fmt.tempDelta(Double.parseDouble(m.group(1)))));
    }
    m.appendTail(out);
    return out.toString();
  }
}
