package org.rimeward.plan;

import java.time.Instant;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Function;
import org.rimeward.rules.Explanations;
import org.rimeward.rules.FiredRule;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;

/** The plan as one screen a manager reads at dusk, in the chosen units. */
public final class PlanText {
  private static final DateTimeFormatter FETCHED_AT =
      DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm 'UTC'", Locale.ROOT).withZone(java.time.ZoneOffset.UTC);

  private PlanText() {}

  /** One line naming the forecast, profiles and rules used; one more if the forecast was reshaped. */
  static void inputs(StringBuilder sb, PlanDocument.Inputs in) {
    if (in == null) {
      return;
    }
    PlanDocument.Fetched fetched = in.forecast().fetched();
    sb.append("  Inputs: forecast ").append(in.forecast().file()).append(" (")
        .append(in.forecast().format())
        .append(fetched == null ? "" : ", fetched " + FETCHED_AT.format(Instant.parse(fetched.fetchedAt())))
        .append("); crop profiles ").append(folder(in.cropProfiles()))
        .append("; rules ").append(folder(in.rules())).append('\n');
    if (!in.forecast().notes().isEmpty()) {
      sb.append("  Forecast: ").append(String.join("; ", in.forecast().notes())).append('\n');
    }
  }

  private static String folder(PlanDocument.Folder f) {
    String hash = f.sha256().length() > 12 ? f.sha256().substring(0, 12) : f.sha256();
    return (f.from().equals(PlanInputs.Origin.BUNDLED.label()) ? "bundled"
        : f.folder() + " (" + f.from() + ")") + " #" + hash;
  }

  public static String render(Plan plan, UnitSystem units, boolean explain) {
    return render(PlanDocuments.of(plan), UnitFormat.of(units), explain, explainer(plan, units));
  }

  /**
   * The explanations of a plan's rules in {@code units}, by firing order: the recorded text is
   * metric, so other units are rendered again from each rule's template and values.
   */
  public static Function<PlanDocument.Rule, String> explainer(Plan plan, UnitSystem units) {
    if (units == UnitSystem.METRIC) {
      return PlanDocument.Rule::explanation;
    }
    Map<Integer, FiredRule> bySeq = new HashMap<>();
    plan.trail().forEach(r -> bySeq.put(r.seq(), r));
    return r -> {
      FiredRule f = bySeq.get(r.seq());
      return f == null ? r.explanation()
          : Explanations.render(f.template(), f.values(), units, plan.night().zone());
    };
  }

  /** The plan document as text; {@code explain} gives each rule's words in the display units. */
  public static String render(PlanDocument plan, UnitFormat fmt, boolean explain,
      Function<PlanDocument.Rule, String> words) {
    StringBuilder sb = new StringBuilder();
    // A re-plan during the night says first what changed; past times read as due or overdue.
    if (plan.now() != null) {
      sb.append(NightUpdateView.header(plan, fmt));
    }
    PlanDocument.Night n = plan.night();
    sb.append("Frost plan for ").append(plan.farm()).append(", night of ").append(n.date())
        .append(" (").append(n.zone()).append(")\n");
    sb.append("  sunset ").append(fmt.dayClock(n.sunset())).append(", sunrise ")
        .append(fmt.dayClock(n.sunrise())).append(", coldest ").append(fmt.temp(n.minAirC()))
        .append(" at ").append(fmt.dayClock(n.coldestAt())).append(" (")
        .append(NightUpdateView.coldestBasis(plan)).append(")\n");
    sb.append("  Decision support only: check thermometers at bud height in each block, and follow"
        + " local codes, water rights and licensed practice.\n");
    inputs(sb, plan.inputs());
    sb.append('\n');

    if (plan.blocks().stream().noneMatch(b -> !b.actions().isEmpty())) {
      quiet(sb, plan, fmt);
    } else {
      timeline(sb, plan, fmt);
      blocksAndWater(sb, plan, fmt);
    }
    cautions(sb, plan, words);

    if (explain) {
      sb.append("\nWhy (rules in the order they fired)\n");
      for (PlanDocument.Block b : plan.blocks()) {
        sb.append("  ").append(b.block()).append('\n');
        for (PlanDocument.Rule r : b.rules()) {
          sb.append("    ").append(r.id()).append(": ").append(words.apply(r)).append('\n');
        }
      }
      if (!plan.farmRules().isEmpty()) {
        sb.append("  farm-wide\n");
        for (PlanDocument.Rule r : plan.farmRules()) {
          sb.append("    ").append(r.id()).append(": ").append(words.apply(r)).append('\n');
        }
      }
    } else {
      sb.append("\nRun again with --explain to see every rule that fired, with its numbers.\n");
    }
    return sb.toString();
  }

  /** The night at a glance: what to do when, in time order. */
  private static void timeline(StringBuilder sb, PlanDocument plan, UnitFormat fmt) {
    sb.append("Tonight, in time order\n");
    List<String> what = Timeline.words(plan, fmt);
    List<String[]> rows = new ArrayList<>();
    for (int i = 0; i < plan.timeline().size(); i++) {
      PlanDocument.TimelineEntry e = plan.timeline().get(i);
      String who = e.block() != null ? e.block() : e.source() != null ? e.source() : "";
      rows.add(new String[] {(e.past() ? "PAST " : "") + fmt.clock(e.at()), who, what.get(i)});
    }
    if (!rows.isEmpty()) {
      table(sb, rows);
    }
    sb.append('\n');
  }

  /** A night that needs nothing: one line per block. */
  private static void quiet(StringBuilder sb, PlanDocument plan, UnitFormat fmt) {
    sb.append("Nothing to do tonight: no block needs protection.\n");
    List<String[]> rows = new ArrayList<>();
    for (PlanDocument.Block b : plan.blocks()) {
      String crop = b.crop() + (b.variety() != null ? " " + b.variety() : "") + " / " + b.stageName();
      rows.add(new String[] {b.block(), crop, "coldest bud " + fmt.temp(b.minBudC()),
          b.atRisk() ? b.risk() + ", nothing needed" : "nothing needed"});
    }
    table(sb, rows);
  }

  private static void blocksAndWater(StringBuilder sb, PlanDocument plan, UnitFormat fmt) {
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"block", "crop / stage", "risk", "coldest bud", "plan", "start", "stop",
        "need / installed", "water"});
    for (PlanDocument.Block b : plan.blocks()) {
      String crop = b.crop() + (b.variety() != null ? " " + b.variety() : "") + " / " + b.stageName();
      String risk = b.risk() + (b.killPctUnprotected() >= 1
          ? String.format(Locale.ROOT, " (%.0f%% kill)", b.killPctUnprotected()) : "");
      String bud = fmt.temp(b.minBudC());
      List<String[]> blockRows = new ArrayList<>();
      if (b.actions().isEmpty()) {
        blockRows.add(row(statusWord(b), "", "", "", ""));
      }
      for (PlanDocument.Action a : b.actions()) {
        if (a instanceof PlanDocument.Cover c) {
          String what = b.status().equals("watch") ? "covers on (near miss)"
              : c.sufficient() ? "covers on" : "covers on (not enough alone)";
          blockRows.add(row(what, NightUpdateView.when(c.deployStart(), plan.now(), fmt),
              NightUpdateView.when(c.remove(), plan.now(), fmt), "", ""));
        } else if (a instanceof PlanDocument.Sprinkle s) {
          String[] r = row("", "", "", need(b, s, fmt), "");
          if (s.isAdvised()) {
            sprinkleRow(r, s, fmt, plan.now());
          } else {
            // No start or stop: a crew must not read this row as "sprinkle".
            r[4] = "NOT ADVISED, keep sprinklers off (" + fmt.rate(s.designRateMmH()) + " from "
                + s.source() + ")" + notAdvised(b, fmt);
          }
          blockRows.add(r);
        }
      }
      // Sprinklers that stay off get no alarm (recorded runs from before it was left out of the
      // document have one; it is not shown).
      if (b.alarmAirC() != null && b.sprinkle().map(PlanDocument.Sprinkle::waterGranted).orElse(true)) {
        blockRows.add(row("alarm at " + fmt.temp(b.alarmAirC()) + " air; start at "
            + fmt.temp(b.startAirC()) + " air (wet bulb " + fmt.temp(b.startWetBulbC()) + ")",
            b.alarmAt() == null ? "" : NightUpdateView.when(b.alarmAt(), plan.now(), fmt), "", "", ""));
      }
      if (b.status().equals("short-of-water") || b.status().equals("partly-protected")
          || b.status().equals("not-advised")
          || b.status().equals("unprotected") && !b.actions().isEmpty()) {
        blockRows.add(row("-> " + statusWord(b)
            + (b.sprinkle().filter(s -> s.isAdvised() && !s.waterGranted()).isPresent()
                ? String.format(Locale.ROOT, ": sprinklers off, expect %.0f%% kill",
                    b.killPctUnprotected()) : ""), "", "", "", ""));
      }
      for (int i = 0; i < blockRows.size(); i++) {
        String[] r = blockRows.get(i);
        if (i == 0) {
          r[0] = b.block();
          r[1] = crop;
          r[2] = risk;
          r[3] = bud;
        }
        rows.add(r);
      }
    }
    table(sb, rows);

    sb.append("\nWater\n");
    for (PlanDocument.Water w : plan.water()) {
      sb.append("  ").append(w.source()).append(": peak ").append(fmt.flow(w.peakFlowM3H()))
          .append(w.shortOfWater() ? " (full protection wants " + fmt.flow(w.wantedPeakFlowM3H())
              + ")" : "")
          .append(" of ").append(fmt.flow(w.maxFlowM3H())).append(", ")
          .append(fmt.volume(w.volumeM3())).append(" of ")
          .append(w.availableM3() == null ? "no volume limit" : fmt.volume(w.availableM3()))
          .append(w.shortOfWater() ? "  SHORT: " + shortWords(w) : "  enough")
          .append('\n');
    }

  }

  /** Cautions that matter tonight first, block by block; the standing ones folded into one line. */
  private static void cautions(StringBuilder sb, PlanDocument plan,
      Function<PlanDocument.Rule, String> words) {
    sb.append("\nCautions\n");
    for (PlanDocument.Block b : plan.blocks()) {
      for (PlanDocument.Rule c : b.cautionRules()) {
        sb.append("  - ").append(b.block()).append(": ").append(words.apply(c)).append('\n');
      }
    }
    for (PlanDocument.Rule c : plan.farmRules()) {
      if (c.isCaution()) {
        sb.append("  - ").append(words.apply(c)).append('\n');
      }
    }
    sb.append("  - ").append(StandingCautions.ONE_LINE).append('\n');

  }

  /** One sprinkling row: what runs, at what rate, over how much of the block; no times without water. */
  private static void sprinkleRow(String[] row, PlanDocument.Sprinkle s, UnitFormat fmt,
      java.time.OffsetDateTime now) {
    String rate = fmt.rate(s.installedRateMmH());
    String design = fmt.rate(s.designRateMmH());
    double blockHa = s.wantedFlowM3H() / (s.designRateMmH() * 10.0);
    String part = fmt.area(s.areaHa()) + " of " + fmt.area(blockHa);
    String from = " from " + s.source() + (s.startsAtOnce() && s.waterGranted() ? ", START NOW" : "");
    row[4] = switch (s.grant()) {
      case "reduced-rate" -> "sprinkle " + rate + " (installed " + design + ")" + from;
      case "sets" -> "sprinkle sets " + String.join(", ", s.sets()) + " (" + part + ") " + rate + from;
      case "part-area" -> "sprinkle " + part + " at " + rate + from;
      case "none" -> "NO WATER from " + s.source() + ": keep sprinklers off";
      default -> "sprinkle " + rate + from;
    };
    if (s.waterGranted()) {
      row[5] = NightUpdateView.when(s.start(), now, fmt);
      row[6] = NightUpdateView.when(s.stop(), now, fmt);
      row[8] = fmt.volume(s.waterM3());
    }
  }

  private static String[] row(String plan, String start, String stop, String need, String water) {
    return new String[] {"", "", "", "", plan, start, stop, need, water};
  }

  /** The need over the run against the installed rate; "unknown" where the balance gives none. */
  private static String need(PlanDocument.Block b, PlanDocument.Sprinkle s, UnitFormat fmt) {
    return (b.requiredRateMmH() == null ? "unknown" : fmt.rate(b.requiredRateMmH())) + " / "
        + fmt.rate(s.designRateMmH());
  }

  /** Why sprinkling is not advised, said in the table row with its numbers. */
  private static String notAdvised(PlanDocument.Block b, UnitFormat fmt) {
    List<String> parts = new ArrayList<>();
    List<String> why = b.notAdvisedBecause() == null ? List.of() : b.notAdvisedBecause();
    if (why.contains("wind")) {
      // The wind the deciding rule saw, from its recorded values.
      String wind = b.rules().stream().filter(r -> r.id().equals("SPRINKLE-UNSAFE-WIND")
              && r.values() != null && r.values().hasNonNull("w.maxWind10mMs"))
          .findFirst().map(r -> ", wind " + fmt.speed(r.values().get("w.maxWind10mMs").asDouble())
              + " at 10 m (" + fmt.speed(r.values().get("w.wind2mMs").asDouble())
              + " at 2 m) below freezing").orElse("");
      parts.add("wind-borne freeze" + wind);
    }
    if (why.contains("rate-short")) {
      parts.add("rate short of the need, not advised alone");
    }
    if (why.contains("need-unknown")) {
      parts.add("need beyond the water balance's range");
    }
    return parts.isEmpty() ? "" : ": " + String.join("; ", parts);
  }

  private static String shortWords(PlanDocument.Water w) {
    List<String> parts = new ArrayList<>();
    if (!w.part().isEmpty()) {
      parts.add("in part: " + String.join(", ", w.part()));
    }
    if (!w.without().isEmpty()) {
      parts.add("without water: " + String.join(", ", w.without()));
    }
    return parts.isEmpty() ? "rates reduced, every block protected whole" : String.join("; ", parts);
  }

  /** An action in a line of words, in the display units. */
  public static String action(PlanDocument.Action a, UnitFormat fmt) {
    if (a instanceof PlanDocument.Cover c) {
      return "cover: deploy from " + fmt.clock(c.deployStart()) + ", on by "
          + fmt.clock(c.deployBy()) + ", remove at " + fmt.clock(c.remove());
    }
    PlanDocument.Sprinkle s = (PlanDocument.Sprinkle) a;
    if (!s.isAdvised()) {
      return "sprinklers off: sprinkling not advised (" + fmt.rate(s.requiredRateMmH())
          + " needed, " + fmt.rate(s.designRateMmH()) + " installed, from " + s.source() + ")";
    }
    if (!s.waterGranted()) {
      return "sprinklers off: no water from " + s.source() + " (" + fmt.rate(s.requiredRateMmH())
          + " needed)";
    }
    return "sprinkle " + fmt.clock(s.start()) + " to " + fmt.clock(s.stop()) + ": "
        + fmt.rate(s.requiredRateMmH()) + " needed, " + fmt.rate(s.installedRateMmH())
        + " installed, " + fmt.volume(s.waterM3()) + " from " + s.source();
  }

  /** How a block's status reads in the table. */
  public static String statusWord(PlanDocument.Block b) {
    return switch (b.status()) {
      case "not-needed" -> "nothing needed";
      case "watch" -> "watch: near miss";
      case "not-advised" -> String.format(Locale.ROOT,
          "NOT ADVISED: expected kill unprotected %.0f%%, against the risk of sprinkling short;"
              + " the manager decides", b.killPctUnprotected());
      case "unprotected" -> b.cover().isPresent() ? "UNPROTECTED: covers not enough alone"
          : "UNPROTECTED: no method available";
      case "short-of-water" -> "SHORT OF WATER";
      case "partly-protected" -> "PROTECTED IN PART, the rest unprotected";
      default -> b.status();
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
}
