package org.rimeward.crop;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.BiConsumer;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitSystem;

/** Applies a variety's offset and overrides to its crop's table. */
final class Inheritance {
  private Inheritance() {}

  /**
   * The effective table of {@code variety} (null: the base table). Values that break the limits are
   * reported to {@code problem} (line, message) and that stage is left out.
   */
  static EffectiveProfile resolve(Crop crop, Variety variety, BiConsumer<Integer, String> problem) {
    List<EffectiveStage> out = new ArrayList<>();
    for (Stage s : crop.stages()) {
      String baseSource = baseSource(crop, s);
      double t10 = s.t10C();
      double t90 = s.t90C();
      String src10 = baseSource;
      String src90 = baseSource;
      Provenance prov = Provenance.BASE;
      int line = s.line();
      if (variety != null && variety.offsetAppliesTo(s.id())) {
        double off = variety.hardinessOffsetC();
        t10 -= off;
        t90 -= off;
        String shifted = baseSource + "; shifted " + delta(off) + " colder by the "
            + variety.id() + " hardiness offset (" + variety.citation() + ")";
        src10 = shifted;
        src90 = shifted;
        prov = Provenance.OFFSET;
        line = variety.line();
      }
      StageOverride o = variety == null ? null : variety.override(s.id()).orElse(null);
      if (o != null) {
        String by = "override for " + variety.id() + " (" + o.citation() + ")";
        if (o.toleranceC() != null) {
          t10 = o.toleranceC();
          t90 = o.toleranceC() - crop.toleranceMarginC();
          by += "; single stage tolerance " + both(o.toleranceC()) + ", T90 = tolerance − "
              + delta(crop.toleranceMarginC());
          src10 = by;
          src90 = by;
        }
        if (o.t10C() != null) {
          t10 = o.t10C();
          src10 = by;
        }
        if (o.t90C() != null) {
          t90 = o.t90C();
          src90 = by;
        }
        prov = Provenance.OVERRIDE;
        line = o.line();
      }
      String who = variety == null ? crop.id() : crop.id() + "/" + variety.id();
      if (!check(who, s.id(), "t10", t10, line, problem) | !check(who, s.id(), "t90", t90, line, problem)) {
        continue;
      }
      if (!(t90 < t10)) {
        problem.accept(line, who + " stage '" + s.id() + "': t90 " + both(t90)
            + " is not colder than t10 " + both(t10) + "; T90 (90% of buds killed) must be colder"
            + " than T10 (10% killed). Check both values against the source table");
        continue;
      }
      String source = src10.equals(src90) ? src10 : "t10: " + src10 + " | t90: " + src90;
      out.add(new EffectiveStage(s.id(), s.name(), s.bbch(), s.flowering(), t10, t90, source,
          prov));
    }
    return new EffectiveProfile(crop.id(), variety == null ? null : variety.id(), out);
  }

  private static boolean check(String who, String stage, String field, double c, int line,
      BiConsumer<Integer, String> problem) {
    if (c < Limits.MIN_C || c > Limits.MAX_C) {
      problem.accept(line, who + " stage '" + stage + "': " + field + " comes to " + both(c)
          + ", outside the plausible " + Limits.MIN_C + " to +" + Limits.MAX_C + " °C for a spring"
          + " bud or flower; check the value, its unit and any hardiness offset");
      return false;
    }
    return true;
  }

  static String baseSource(Crop crop, Stage s) {
    if (!s.singleTolerance()) {
      return s.source();
    }
    return s.source() + "; single stage tolerance " + both(s.toleranceC())
        + ", not a 10/90 curve: T10 = tolerance, T90 = tolerance − " + delta(crop.toleranceMarginC())
        + " (tolerance_t90_margin)";
  }

  static String both(double c) {
    return Quantities.format(c, Dimension.TEMPERATURE, UnitSystem.METRIC, 1) + " ("
        + Quantities.format(c, Dimension.TEMPERATURE, UnitSystem.US, 1) + ")";
  }

  static String delta(double c) {
    return String.format(Locale.ROOT, "%.2f °C (%.1f °F)", c, c * 1.8);
  }
}
