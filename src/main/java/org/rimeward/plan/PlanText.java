package org.rimeward.plan;

import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rimeward.rules.Explanations;
import org.rimeward.rules.FiredRule;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/** The plan as one screen a manager reads at dusk, in the chosen units. */
public final class PlanText {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);
  private static final DateTimeFormatter DAY_CLOCK = DateTimeFormatter.ofPattern("EEE HH:mm", Locale.ENGLISH);

  private PlanText() {}

  public static String render(Plan plan, UnitSystem units, boolean explain) {
    ZoneId zone = plan.night().zone();
    StringBuilder sb = new StringBuilder();
    NightSummary n = plan.night();
    sb.append("Frost plan for ").append(plan.farmName()).append(", night of ").append(n.date())
        .append(" (").append(zone.getId()).append(")\n");
    sb.append("  sunset ").append(day(n.sunset(), zone)).append(", sunrise ").append(day(n.sunrise(), zone))
        .append(", coldest ").append(temp(n.minAirC(), units)).append(" at ").append(day(n.coldestAt(), zone))
        .append(" (forecast air)\n");
    sb.append("  Decision support only: check thermometers at bud height in each block, and follow"
        + " local codes, water rights and licensed practice.\n\n");

    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"block", "crop / stage", "risk", "coldest bud", "plan", "start", "stop", "water"});
    for (BlockPlan b : plan.blocks()) {
      String crop = b.crop() + (b.variety() != null ? " " + b.variety() : "") + " / " + b.stageName();
      String risk = word(b.risk()) + (b.killPctUnprotected() >= 1
          ? String.format(Locale.ROOT, " (%.0f%% kill)", b.killPctUnprotected()) : "");
      String bud = temp(b.minBudC(), units);
      if (b.actions().isEmpty()) {
        rows.add(new String[] {b.blockId(), crop, risk, bud, statusWord(b), "", "", ""});
      }
      boolean first = true;
      for (Action a : b.actions()) {
        String[] row = first ? new String[] {b.blockId(), crop, risk, bud, "", "", "", ""}
            : new String[] {"", "", "", "", "", "", "", ""};
        first = false;
        if (a instanceof Action.Cover c) {
          row[4] = c.sufficient() ? "covers on" : "covers on (not enough alone)";
          row[5] = clock(c.deployStart(), zone);
          row[6] = clock(c.remove(), zone);
        } else if (a instanceof Action.Sprinkle s) {
          sprinkleRow(row, s, units, zone);
        }
        rows.add(row);
      }
      if (b.status() == org.rimeward.rules.facts.Status.SHORT_OF_WATER
          || b.status() == org.rimeward.rules.facts.Status.PARTLY_PROTECTED
          || b.status() == org.rimeward.rules.facts.Status.UNPROTECTED && !b.actions().isEmpty()) {
        rows.add(new String[] {"", "", "", "", "-> " + statusWord(b)
            + (b.sprinkle().filter(s -> !s.withWater()).isPresent()
                ? String.format(Locale.ROOT, ": sprinklers off, expect %.0f%% kill", b.killPctUnprotected()) : ""),
            "", "", ""});
      }
    }
    table(sb, rows);

    sb.append("\nWater\n");
    for (WaterEntry w : plan.water()) {
      sb.append("  ").append(w.source()).append(": peak ")
          .append(Quantities.format(w.peakFlowM3H(), Dimension.FLOW, units, 0))
          .append(w.isShortOfWater() ? " (full protection wants "
              + Quantities.format(w.wantedPeakFlowM3H(), Dimension.FLOW, units, 0) + ")" : "")
          .append(" of ")
          .append(Quantities.format(w.maxFlowM3H(), Dimension.FLOW, units, 0)).append(", ")
          .append(Quantities.format(w.volumeM3(), Dimension.VOLUME, units, 0)).append(" of ")
          .append(Double.isNaN(w.availableM3()) ? "no volume limit"
              : Quantities.format(w.availableM3(), Dimension.VOLUME, units, 0))
          .append(w.isShortOfWater() ? "  SHORT: " + shortWords(w) : "  enough")
          .append('\n');
    }

    sb.append("\nCautions\n");
    for (BlockPlan b : plan.blocks()) {
      for (FiredRule c : b.cautions()) {
        sb.append("  - ").append(b.blockId()).append(": ").append(render(c, units, zone)).append('\n');
      }
    }
    for (FiredRule c : plan.trail()) {
      if (c.isCaution() && c.blockId() == null) {
        sb.append("  - ").append(render(c, units, zone)).append('\n');
      }
    }
    for (String c : StandingCautions.ALL) {
      sb.append("  - ").append(c).append('\n');
    }

    if (explain) {
      sb.append("\nWhy (rules in the order they fired)\n");
      for (BlockPlan b : plan.blocks()) {
        sb.append("  ").append(b.blockId()).append('\n');
        for (FiredRule r : b.rules()) {
          sb.append("    ").append(r.ruleId()).append(": ").append(render(r, units, zone)).append('\n');
        }
      }
      List<FiredRule> farmWide = plan.trail().stream().filter(r -> r.blockId() == null).toList();
      if (!farmWide.isEmpty()) {
        sb.append("  farm-wide\n");
        for (FiredRule r : farmWide) {
          sb.append("    ").append(r.ruleId()).append(": ").append(render(r, units, zone)).append('\n');
        }
      }
    } else {
      sb.append("\nRun again with --explain to see every rule that fired, with its numbers.\n");
    }
    return sb.toString();
  }

  static String render(FiredRule r, UnitSystem units, ZoneId zone) {
    return units == UnitSystem.METRIC ? r.explanation()
        : Explanations.render(r.template(), r.values(), units, zone);
  }

  /** One sprinkling row: what runs, at what rate, over how much of the block; no times without water. */
  private static void sprinkleRow(String[] row, Action.Sprinkle s, UnitSystem units, ZoneId zone) {
    int rd = units == UnitSystem.US ? 2 : 1;
    String rate = Quantities.format(s.runRateMmH(), Dimension.RATE, units, rd);
    String design = Quantities.format(s.designRateMmH(), Dimension.RATE, units, rd);
    double blockHa = s.wantedFlowM3H() / (s.designRateMmH() * 10.0);
    String part = Quantities.format(s.areaHa(), Dimension.AREA, units, 1) + " of "
        + Quantities.format(blockHa, Dimension.AREA, units, 1);
    String from = " from " + s.source() + (s.startsAtOnce() && s.withWater() ? ", START NOW" : "");
    row[4] = switch (s.grant()) {
      case FULL -> "sprinkle " + rate + from;
      case REDUCED_RATE -> "sprinkle " + rate + " (installed " + design + ")" + from;
      case SETS -> "sprinkle sets " + String.join(", ", s.sets()) + " (" + part + ") " + rate + from;
      case PART_AREA -> "sprinkle " + part + " at " + rate + from;
      case NONE -> "NO WATER from " + s.source() + ": keep sprinklers off";
    };
    if (s.withWater()) {
      row[5] = clock(s.start(), zone);
      row[6] = clock(s.stop(), zone);
      row[7] = Quantities.format(s.waterM3(), Dimension.VOLUME, units, 0);
    }
  }

  private static String shortWords(WaterEntry w) {
    List<String> parts = new ArrayList<>();
    if (!w.part().isEmpty()) {
      parts.add("in part: " + String.join(", ", w.part()));
    }
    if (!w.without().isEmpty()) {
      parts.add("without water: " + String.join(", ", w.without()));
    }
    return parts.isEmpty() ? "rates reduced, every block protected whole" : String.join("; ", parts);
  }

  private static String statusWord(BlockPlan b) {
    return switch (b.status()) {
      case NOT_NEEDED -> "nothing needed";
      case UNPROTECTED -> "UNPROTECTED: no method available";
      case SHORT_OF_WATER -> "SHORT OF WATER";
      case PARTLY_PROTECTED -> "PROTECTED IN PART, the rest unprotected";
      default -> word(b.status());
    };
  }

  private static void table(StringBuilder sb, List<String[]> rows) {
    int cols = rows.get(0).length;
    int[] w = new int[cols];
    for (String[] r : rows) {
      for (int i = 0; i < cols; i++) {
        w[i] = Math.max(w[i], r[i].length());
      }
    }
    for (String[] r : rows) {
      StringBuilder line = new StringBuilder("  ");
      for (int i = 0; i < cols; i++) {
        line.append(r[i]);
        if (i < cols - 1) {
          line.append(" ".repeat(w[i] - r[i].length() + 2));
        }
      }
      sb.append(line.toString().stripTrailing()).append('\n');
    }
  }

  private static String temp(double c, UnitSystem units) {
    return Quantities.format(c, Dimension.TEMPERATURE, units, 1);
  }

  private static String clock(Instant t, ZoneId zone) {
    return t == null ? "?" : CLOCK.format(t.atZone(zone));
  }

  private static String day(Instant t, ZoneId zone) {
    return DAY_CLOCK.format(t.atZone(zone));
  }

  private static String word(Enum<?> e) {
    return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
  }
}
