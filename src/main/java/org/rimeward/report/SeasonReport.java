package org.rimeward.report;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rimeward.io.Json;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/**
 * The season as text, CSV, JSON or a page. CSV and JSON columns carry their unit in their name
 * ({@code water_m3}, or {@code water_gal} with US units), so a water-use form can be filled in
 * from them; the page has a strip of the season's nights coloured and lettered by risk.
 */
public final class SeasonReport {
  private SeasonReport() {}

  public static String text(Season.Totals s, UnitFormat fmt) {
    StringBuilder b = new StringBuilder();
    b.append("Season for ").append(s.farm()).append(": ").append(s.nights().size())
        .append(s.nights().size() == 1 ? " night" : " nights").append(" recorded")
        .append(range(s)).append('\n');
    b.append("  Each night counts once, from its latest run. Decision support only: figures are the"
        + " plans' estimates; 'done' is what the crew recorded.\n\n");
    b.append(String.format(Locale.ROOT, "  %-18s %6s %6s %9s %9s %12s %6s %8s %8s %12s%n", "block",
        "risk", "prot.", "h sprink.", "h done", "water", "covers", "kill", "w/ plan", "loss avoided"));
    for (Season.BlockTotal t : s.blocks()) {
      b.append(String.format(Locale.ROOT, "  %-18s %6d %6d %9.1f %9s %12s %6d %7.0f%% %7.0f%% %12s%n",
          t.block(), t.nightsAtRisk(), t.nightsProtected(), t.hoursSprinkled(),
          t.hoursSprinkledDone() == null ? "-" : String.format(Locale.ROOT, "%.1f", t.hoursSprinkledDone()),
          fmt.volume(t.waterM3()), t.coverNights(), t.killUnprotectedPct(), t.killWithPlanPct(),
          t.lossAvoided() == null ? "-" : String.format(Locale.ROOT, "%.0f", t.lossAvoided())));
    }
    b.append("\nWater sources\n");
    for (Season.SourceTotal t : s.sources()) {
      b.append("  ").append(t.source()).append(": ").append(fmt.volume(t.waterM3()))
          .append(" over ").append(t.nights()).append(t.nights() == 1 ? " night" : " nights")
          .append(", highest peak flow ").append(fmt.flow(t.peakFlowM3H())).append('\n');
      for (Season.SourceNight n : s.sourceNights()) {
        if (n.source().equals(t.source())) {
          b.append("    ").append(n.night()).append(": ").append(fmt.volume(n.waterM3()))
              .append(", peak ").append(fmt.flow(n.peakFlowM3H())).append('\n');
        }
      }
    }
    b.append("\nNights\n");
    for (Season.Night n : s.nights()) {
      b.append("  ").append(n.night()).append("  worst risk ").append(n.worstRisk()).append(", ")
          .append(n.blocksAtRisk()).append(" blocks at risk (run ").append(n.runId()).append(")\n");
    }
    return b.toString();
  }

  /**
   * One table: a row per block ({@code scope} block), per source and night ({@code
   * source-night}) and per source ({@code source}); cells that do not apply are empty.
   */
  public static String csv(Season.Totals s, UnitFormat fmt) {
    boolean us = fmt.system() == UnitSystem.US;
    String water = us ? "water_gal" : "water_m3";
    String flow = us ? "peak_flow_gpm" : "peak_flow_m3_h";
    StringWriter out = new StringWriter();
    try (CSVPrinter p = new CSVPrinter(out, CSVFormat.DEFAULT.builder().setHeader("scope", "id",
        "night", "nights_planned", "nights_at_risk", "nights_protected", "hours_sprinkled",
        "hours_sprinkled_done", water, flow, "cover_nights", "kill_unprotected_pct",
        "kill_with_plan_pct", "loss_avoided").setRecordSeparator("\n").get())) {
      for (Season.BlockTotal t : s.blocks()) {
        p.printRecord("block", t.block(), "", t.nightsPlanned(), t.nightsAtRisk(),
            t.nightsProtected(), Json.round(t.hoursSprinkled(), 2),
            t.hoursSprinkledDone() == null ? "" : Json.round(t.hoursSprinkledDone(), 2),
            Json.round(fmt.volumeValue(t.waterM3()), 1), "", t.coverNights(),
            Json.round(t.killUnprotectedPct(), 1), Json.round(t.killWithPlanPct(), 1),
            t.lossAvoided() == null ? "" : Json.round(t.lossAvoided(), 0));
      }
      for (Season.SourceNight n : s.sourceNights()) {
        p.printRecord("source-night", n.source(), n.night(), "", "", "", "", "",
            Json.round(fmt.volumeValue(n.waterM3()), 1), Json.round(fmt.flowValue(n.peakFlowM3H()), 1),
            "", "", "", "");
      }
      for (Season.SourceTotal t : s.sources()) {
        p.printRecord("source", t.source(), "", t.nights(), "", "", "", "",
            Json.round(fmt.volumeValue(t.waterM3()), 1), Json.round(fmt.flowValue(t.peakFlowM3H()), 1),
            "", "", "", "");
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  /** The totals as JSON, metric, with the same names as the records. */
  public static String json(Season.Totals s) {
    return Json.pretty(s);
  }

  /** One night's cell of the calendar strip. */
  public record Day(String date, String day, String risk, String letter, String title) {}

  /** The page model. */
  public record Model(String title, String farm, String range, int nightCount, List<Day> strip,
      List<Map<String, String>> blocks, List<Map<String, String>> sources,
      List<Map<String, String>> sourceNights, String volumeUnit, String flowUnit) {}

  public static String html(Season.Totals s, UnitFormat fmt) {
    List<Day> strip = new ArrayList<>();
    if (!s.nights().isEmpty()) {
      Map<LocalDate, Season.Night> byDate = new HashMap<>();
      s.nights().forEach(n -> byDate.put(n.night(), n));
      LocalDate first = s.nights().get(0).night();
      LocalDate last = s.nights().get(s.nights().size() - 1).night();
      for (LocalDate d = first; !d.isAfter(last); d = d.plusDays(1)) {
        Season.Night n = byDate.get(d);
        String risk = n == null ? "unplanned" : n.worstRisk();
        strip.add(new Day(d.toString(), String.valueOf(d.getDayOfMonth()), risk,
            switch (risk) {
              case "severe" -> "S";
              case "damage" -> "D";
              case "watch" -> "W";
              case "none" -> "·";
              default -> "";
            },
            d + ": " + (n == null ? "no plan recorded" : "worst risk " + risk + ", "
                + n.blocksAtRisk() + " blocks at risk")));
      }
    }
    List<Map<String, String>> blocks = new ArrayList<>();
    for (Season.BlockTotal t : s.blocks()) {
      Map<String, String> row = new java.util.LinkedHashMap<>();
      row.put("block", t.block());
      row.put("atRisk", String.valueOf(t.nightsAtRisk()));
      row.put("protected", String.valueOf(t.nightsProtected()));
      row.put("hours", String.format(Locale.ROOT, "%.1f", t.hoursSprinkled()));
      row.put("done", t.hoursSprinkledDone() == null ? "–"
          : String.format(Locale.ROOT, "%.1f (recorded)", t.hoursSprinkledDone()));
      row.put("water", fmt.volume(t.waterM3()));
      row.put("covers", String.valueOf(t.coverNights()));
      row.put("kill", String.format(Locale.ROOT, "%.0f %%", t.killUnprotectedPct()));
      row.put("withPlan", String.format(Locale.ROOT, "%.0f %%", t.killWithPlanPct()));
      row.put("loss", t.lossAvoided() == null ? "–" : String.format(Locale.ROOT, "%,.0f", t.lossAvoided()));
      blocks.add(row);
    }
    List<Map<String, String>> sources = new ArrayList<>();
    for (Season.SourceTotal t : s.sources()) {
      sources.add(Map.of("source", t.source(), "nights", String.valueOf(t.nights()),
          "water", fmt.volume(t.waterM3()), "peak", fmt.flow(t.peakFlowM3H())));
    }
    List<Map<String, String>> nights = new ArrayList<>();
    for (Season.SourceNight n : s.sourceNights()) {
      nights.add(Map.of("source", n.source(), "night", n.night().toString(),
          "water", fmt.volume(n.waterM3()), "peak", fmt.flow(n.peakFlowM3H()), "run", n.runId()));
    }
    return Pages.render("season", new Model("Frost season: " + s.farm(), s.farm(),
        range(s).isEmpty() ? "all recorded nights" : range(s).substring(1), s.nights().size(),
        strip, blocks, sources, nights, fmt.symbol(org.rimeward.units.Dimension.VOLUME),
        fmt.symbol(org.rimeward.units.Dimension.FLOW)));
  }

  private static String range(Season.Totals s) {
    if (s.from() == null && s.to() == null) {
      return "";
    }
    return " " + (s.from() == null ? "up" : "from " + s.from()) + (s.to() == null ? " on"
        : " to " + s.to());
  }
}
