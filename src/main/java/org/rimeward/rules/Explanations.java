package org.rimeward.rules;

import java.lang.reflect.Method;
import java.math.BigDecimal;
import java.math.MathContext;
import java.time.Instant;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.rimeward.rules.facts.Moment;
import org.rimeward.units.Dimension;
import org.rimeward.units.Quantities;
import org.rimeward.units.UnitFormat;
import org.rimeward.units.UnitSystem;
import org.rimeward.water.Stake;

/**
 * Renders a rule's explanation template. A placeholder {@code {name}} or {@code {name.part}} names
 * a variable the rule bound ({@code $name}) and, optionally, an accessor of it. The unit is read
 * from the name's suffix, as everywhere in Rimeward: {@code ...C} a temperature, {@code ...MmH} a
 * rate, {@code ...Ms} a wind speed, {@code ...M3H} a flow, {@code ...M3} a volume, {@code ...Ha}
 * an area, {@code ...Pct} a percentage, {@code ...HeightM} a height; {@code ...PerM3} is a ratio
 * per cubic metre. Times show as local clock times in the farm's zone.
 */
public final class Explanations {
  private static final Pattern PLACEHOLDER = Pattern.compile("\\{([A-Za-z][A-Za-z0-9_]*(?:\\.[A-Za-z][A-Za-z0-9_]*)*)}");
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);
  /**
   * A fixed quantity written in both unit systems, {@code {~0 °C|32 °F}}: a threshold quoted from
   * a source, shown in the reader's units, never converted (a source's "10 mph" stays 10 mph).
   */
  private static final Pattern LITERAL = Pattern.compile("\\{~([^|{}]*)\\|([^{}]*)}");
  /** Cubic metres in 1,000 US gallons, from the one unit table (NIST SP 811: 1 gal = 3.785411784 L). */
  private static final double M3_PER_1000_GAL =
      1000 / Quantities.display(1.0, Dimension.VOLUME, UnitSystem.US);

  private Explanations() {}

  /**
   * A template cut once into its fixed text and its placeholders, with the both-units literals
   * already chosen: a watch re-plans every few minutes and a region fires tens of thousands of
   * rules, each of which would otherwise match the same template's patterns again.
   *
   * @param texts the fixed text around the placeholders, one more than {@code paths}
   * @param paths the placeholders, in order
   */
  private record Parsed(List<String> texts, List<String> paths) {}

  private static final Map<String, Parsed> PARSED = new ConcurrentHashMap<>();

  private static Parsed parsed(String template, UnitSystem units) {
    return PARSED.computeIfAbsent(units.name() + '\0' + template, k -> {
      Matcher lit = LITERAL.matcher(template);
      StringBuilder both = new StringBuilder();
      while (lit.find()) {
        lit.appendReplacement(both, Matcher.quoteReplacement(units == UnitSystem.US
            ? lit.group(2) : lit.group(1)));
      }
      lit.appendTail(both);
      String text = both.toString();
      List<String> texts = new ArrayList<>();
      List<String> paths = new ArrayList<>();
      Matcher m = PLACEHOLDER.matcher(text);
      int from = 0;
      while (m.find()) {
        texts.add(text.substring(from, m.start()));
        paths.add(m.group(1));
        from = m.end();
      }
      texts.add(text.substring(from));
      return new Parsed(List.copyOf(texts), List.copyOf(paths));
    });
  }

  /** The placeholder names of a template, each resolved against the rule's bound variables. */
  static Map<String, Object> resolve(String template, Function<String, Object> declaration) {
    Map<String, Object> out = new LinkedHashMap<>();
    for (String path : parsed(template, UnitSystem.METRIC).paths()) {
      if (out.containsKey(path)) {
        continue;
      }
      int dot = path.indexOf('.');
      Object v = declaration.apply(dot < 0 ? path : path.substring(0, dot));
      while (dot >= 0 && v != null) {
        int next = path.indexOf('.', dot + 1);
        v = accessor(v, path.substring(dot + 1, next < 0 ? path.length() : next));
        dot = next;
      }
      out.put(path, v);
    }
    return out;
  }

  /** Each fact class's accessors, looked up once by name. */
  private static final ClassValue<Map<String, Method>> ACCESSORS = new ClassValue<>() {
    @Override
    protected Map<String, Method> computeValue(Class<?> type) {
      return new ConcurrentHashMap<>();
    }
  };

  private static Object accessor(Object target, String name) {
    try {
      Method method = ACCESSORS.get(target.getClass()).get(name);
      if (method == null) {
        method = target.getClass().getMethod(name);
        ACCESSORS.get(target.getClass()).put(name, method);
      }
      return method.invoke(target);
    } catch (ReflectiveOperationException e) {
      throw new IllegalStateException("explanation placeholder '" + name + "' is not an accessor of "
          + target.getClass().getSimpleName(), e);
    }
  }

  /** Fills a template with already resolved values, in the given units and zone. */
  public static String render(String template, Map<String, Object> values, UnitSystem units, ZoneId zone) {
    return render(template, values, units, zone, null);
  }

  /**
   * As {@link #render(String, Map, UnitSystem, ZoneId)}, reusing numbers and times already
   * formatted for the same placeholder name: a run over thousands of blocks formats the same
   * thresholds and hours tens of thousands of times. {@code formatted} belongs to one units
   * system and zone; null formats every value afresh.
   */
  static String render(String template, Map<String, Object> values, UnitSystem units, ZoneId zone,
      Map<List<Object>, String> formatted) {
    Parsed p = parsed(template, units);
    StringBuilder sb = new StringBuilder(template.length() + 32);
    for (int i = 0; i < p.paths().size(); i++) {
      sb.append(p.texts().get(i));
      String path = p.paths().get(i);
      String last = path.substring(path.lastIndexOf('.') + 1);
      Object v = values.get(path);
      if (formatted != null && (v instanceof Number || v instanceof Instant || v instanceof Moment)) {
        sb.append(formatted.computeIfAbsent(List.of(last, v), k -> format(last, v, units, zone)));
      } else {
        sb.append(format(last, v, units, zone));
      }
    }
    return sb.append(p.texts().get(p.paths().size())).toString();
  }

  static String format(String name, Object v, UnitSystem units, ZoneId zone) {
    if (v == null) {
      return "none";
    }
    if (v instanceof Moment moment) {
      return CLOCK.format(moment.at().atZone(zone));
    }
    if (v instanceof Instant t) {
      return CLOCK.format(t.atZone(zone));
    }
    if (v instanceof Number n) {
      double d = n.doubleValue();
      if (Double.isNaN(d)) {
        return "no limit";
      }
      if (Double.isInfinite(d)) {
        return "more than any sprinkler can give";
      }
      if (name.endsWith("PerM3")) {
        return perWater(d, units);
      }
      Dimension dim = dimensionOf(name);
      if (dim == null) {
        return n instanceof Integer || n instanceof Long ? n.toString()
            : String.format(Locale.ROOT, "%.1f", d);
      }
      int decimals = switch (dim) {
        case FLOW, VOLUME, PERCENT -> 0;
        case RATE -> units == UnitSystem.US ? 3 : 2;
        default -> 1;
      };
      if (dim == Dimension.PERCENT) {
        return String.format(Locale.ROOT, "%.0f %%", d);
      }
      return Quantities.format(d, dim, units, decimals);
    }
    if (v instanceof Stake s) {
      // Hectares of buds saved per m³ is an area per volume: acres per 1,000 gal in US units.
      if (s.byValue()) {
        return "crop value saved " + perWater(s.perM3(), units);
      }
      String[] perUnit = perWater(Quantities.display(s.perM3(), Dimension.AREA, units), units)
          .split(" ", 2);
      return perUnit[0] + " " + Quantities.symbol(Dimension.AREA, units) + " of buds saved "
          + perUnit[1];
    }
    if (v instanceof Boolean b) {
      return b ? "yes" : "no";
    }
    if (v instanceof String text) {
      // A source note may quote a figure in both systems: the reader's alone in US units.
      return UnitFormat.of(units).quoted(text);
    }
    if (v instanceof Enum<?> e) {
      return e.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
    return v.toString();
  }

  /**
   * A stake per unit of water (crop value or hectares saved), not a volume: such ratios span
   * orders of magnitude, so three significant figures, not a fixed number of decimals.
   */
  private static String perWater(double perM3, UnitSystem units) {
    double shown = units == UnitSystem.US ? perM3 * M3_PER_1000_GAL : perM3;
    return new BigDecimal(shown).round(new MathContext(3)).stripTrailingZeros().toPlainString()
        + (units == UnitSystem.US ? " per 1,000 gal" : " per m³");
  }

  static Dimension dimensionOf(String name) {
    if (name.endsWith("M3H")) {
      return Dimension.FLOW;
    }
    if (name.endsWith("M3")) {
      return Dimension.VOLUME;
    }
    if (name.endsWith("MmH")) {
      return Dimension.RATE;
    }
    if (name.endsWith("Ms")) {
      return Dimension.SPEED;
    }
    if (name.endsWith("Ha")) {
      return Dimension.AREA;
    }
    if (name.endsWith("Pct")) {
      return Dimension.PERCENT;
    }
    String lower = name.toLowerCase(Locale.ROOT);
    if (lower.endsWith("heightm")) {
      return Dimension.LENGTH;
    }
    if (lower.endsWith("deltac") || lower.endsWith("marginc") || lower.endsWith("protectionc")
        || lower.endsWith("depressionc") || lower.endsWith("offsetc") || lower.endsWith("bandc")) {
      return Dimension.TEMPERATURE_DELTA;
    }
    if (name.endsWith("C")) {
      return Dimension.TEMPERATURE;
    }
    return null;
  }
}
