package org.rimeward.plan;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.time.ZoneId;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/** The plan as CSV: one row per block action (a block with nothing to do has one row), metric. */
public final class PlanCsv {
  static final String[] HEADER = {"night", "block", "crop", "variety", "stage", "risk",
      "kill_pct_unprotected", "status", "method", "start", "stop", "required_rate_mm_h",
      "installed_rate_mm_h", "water_m3", "source", "water_granted", "area_ha", "flow_m3_h", "grant"};

  private PlanCsv() {}

  public static String render(Plan plan) {
    ZoneId zone = plan.night().zone();
    StringWriter out = new StringWriter();
    try (CSVPrinter p = new CSVPrinter(out, CSVFormat.DEFAULT.builder().setHeader(HEADER)
        .setRecordSeparator("\n").get())) {
      for (BlockPlan b : plan.blocks()) {
        Object[] head = {plan.night().date(), b.blockId(), b.crop(), b.variety(), b.stage(),
            PlanJson.word(b.risk()), PlanJson.round(b.killPctUnprotected(), 1), PlanJson.word(b.status())};
        if (b.actions().isEmpty()) {
          p.printRecord(concat(head, "none", "", "", "", "", "", "", "", "", "", ""));
        }
        for (Action a : b.actions()) {
          if (a instanceof Action.Sprinkle s && !s.withWater()) {
            // Not "sprinkle" with times: a block granted no water keeps its sprinklers off.
            p.printRecord(concat(head, "sprinklers-off", "", "", PlanJson.round(s.requiredRateMmH(), 2),
                "", "", s.source(), false, PlanJson.round(0, 2), "", PlanJson.word(s.grant())));
          } else if (a instanceof Action.Sprinkle s) {
            p.printRecord(concat(head, "sprinkle", PlanJson.time(s.start(), zone),
                PlanJson.time(s.stop(), zone), PlanJson.round(s.requiredRateMmH(), 2),
                PlanJson.round(s.runRateMmH(), 2), PlanJson.round(s.waterM3(), 1), s.source(), true,
                PlanJson.round(s.areaHa(), 2), PlanJson.round(s.flowM3H(), 1), PlanJson.word(s.grant())));
          } else if (a instanceof Action.Cover c) {
            p.printRecord(concat(head, "cover", PlanJson.time(c.deployStart(), zone),
                PlanJson.time(c.remove(), zone), "", "", "", "", "", "", "", ""));
          }
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  private static Object[] concat(Object[] head, Object... tail) {
    Object[] all = new Object[head.length + tail.length];
    System.arraycopy(head, 0, all, 0, head.length);
    System.arraycopy(tail, 0, all, head.length, tail.length);
    return all;
  }
}
