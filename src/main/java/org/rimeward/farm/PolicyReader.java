package org.rimeward.farm;

import java.util.Locale;
import org.rimeward.io.Fields;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.QuantityException;

/** Reads farm.yaml's {@code policy} section: the target, the start margin and the stop rule. */
final class PolicyReader {
  private PolicyReader() {}

  /** The policy, or null when the section has problems (added to its file's problems). */
  static Policy read(Fields p) {
    if (p == null) {
      return null;
    }
    int before = p.problems().size();
    p.allow("target", "start_margin", "stop_rule");
    Target target = p.has("target") ? target(p) : Policy.DEFAULT.target();
    double margin = Policy.DEFAULT.startMarginC();
    if (p.has("start_margin")) {
      Double m = p.optionalValue("start_margin",
          FarmLoader.quantity(p, "start_margin", Dimension.TEMPERATURE_DELTA));
      if (m != null && !(m >= 0 && m <= Policy.MAX_START_MARGIN_C)) {
        p.problem("start_margin", String.format(Locale.ROOT, "%s (%.2f °C) is outside 0 to %.0f °C;"
            + " give how far above the start temperature to begin sprinkling, e.g. 1.0C or 2F",
            p.quoted("start_margin"), m, Policy.MAX_START_MARGIN_C));
      } else if (m != null) {
        margin = m;
      }
    }
    StopRule stop = Policy.DEFAULT.stopRule();
    String s = p.optionalText("stop_rule");
    if (s != null) {
      stop = StopRule.fromYaml(s).orElse(null);
      if (stop == null) {
        p.problem("stop_rule", p.quoted("stop_rule") + " is not a stop rule; write one of: "
            + StopRule.allowed());
      }
    }
    return p.problems().size() == before ? new Policy(target, margin, stop) : null;
  }

  private static Target target(Fields p) {
    String text = p.optionalText("target");
    if (text == null) {
      return null;
    }
    if (text.trim().equalsIgnoreCase("t10")) {
      return Target.t10();
    }
    double c;
    try {
      c = Quantities.parse(text, Dimension.TEMPERATURE, "policy.target");
    } catch (QuantityException ex) {
      p.problem("target", p.quoted("target") + " is neither t10 nor a temperature; write t10 (the"
          + " stage's 10 % kill temperature) or a temperature such as -1.5C or 29F");
      return null;
    }
    if (!(c >= Target.MIN_FIXED_C && c <= Target.MAX_FIXED_C)) {
      p.problem("target", String.format(Locale.ROOT, "%s (%.2f °C) is outside %.0f to %.0f °C;"
          + " give the temperature to protect to, e.g. -1.5C, or write t10",
          p.quoted("target"), c, Target.MIN_FIXED_C, Target.MAX_FIXED_C));
      return null;
    }
    return Target.fixed(c);
  }
}
