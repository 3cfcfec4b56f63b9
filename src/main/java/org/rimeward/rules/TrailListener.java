package org.rimeward.rules;

import java.lang.reflect.Method;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;
import org.kie.api.definition.rule.Rule;
import org.kie.api.event.rule.AfterMatchFiredEvent;
import org.kie.api.event.rule.DefaultAgendaEventListener;
import org.kie.api.runtime.rule.Match;
import org.rimeward.units.UnitSystem;

/**
 * Builds the trail of a run from what actually fired: for every match, the rule's id, kind and
 * explanation template, and the values of the variables the template names. Rules themselves
 * never print and never write to the trail.
 */
final class TrailListener extends DefaultAgendaEventListener {
  private final List<FiredRule> fired = new ArrayList<>();
  private final ZoneId zone;
  private final Map<List<Object>, String> formatted = new HashMap<>();

  TrailListener(ZoneId zone) {
    this.zone = zone;
  }

  @Override
  public void afterMatchFired(AfterMatchFiredEvent event) {
    Match match = event.getMatch();
    Rule rule = match.getRule();
    Map<String, Object> meta = rule.getMetaData();
    String template = String.valueOf(meta.getOrDefault("explain", rule.getName()));
    String kind = String.valueOf(meta.getOrDefault("kind", "decision"));
    List<String> ids = match.getDeclarationIds();
    Map<String, Object> values = Explanations.resolve(template, name -> {
      if (ids.contains("$" + name)) {
        return match.getDeclarationValue("$" + name);
      }
      if (ids.contains(name)) {
        return match.getDeclarationValue(name);
      }
      throw new IllegalStateException("rule " + rule.getName() + ": explanation names {" + name
          + "} but the rule binds no $" + name);
    });
    String blockId = null;
    String sourceId = null;
    for (Object o : match.getObjects()) {
      if (blockId == null) {
        blockId = idOf(o, "blockId");
      }
      if (sourceId == null) {
        sourceId = idOf(o, "sourceId");
      }
    }
    String text = Explanations.render(template, values, UnitSystem.METRIC, zone, formatted);
    fired.add(new FiredRule(fired.size() + 1, rule.getName(), kind, blockId, sourceId, template,
        values, text));
  }

  private static String idOf(Object fact, String accessor) {
    Method m = (accessor.equals("blockId") ? BLOCK_ID : SOURCE_ID).get(fact.getClass()).orElse(null);
    if (m == null) {
      return null;
    }
    try {
      Object v = m.invoke(fact);
      return v == null ? null : v.toString();
    } catch (ReflectiveOperationException e) {
      throw new IllegalStateException(e);
    }
  }

  // Looked up once per fact class: a large farm fires tens of thousands of rules.
  private static final ClassValue<Optional<Method>> BLOCK_ID = accessorOf("blockId");
  private static final ClassValue<Optional<Method>> SOURCE_ID = accessorOf("sourceId");

  private static ClassValue<Optional<Method>> accessorOf(String name) {
    return new ClassValue<>() {
      @Override
      protected Optional<Method> computeValue(Class<?> type) {
        try {
          return Optional.of(type.getMethod(name));
        } catch (NoSuchMethodException e) {
          return Optional.empty();
        }
      }
    };
  }

  List<FiredRule> fired() {
    return List.copyOf(fired);
  }
}
