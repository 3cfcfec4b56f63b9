package org.rimeward.rules;

import java.util.Map;
import java.util.Objects;

/**
 * One rule that fired, in firing order, with the values it saw. The explanation is rendered from
 * the rule's {@code @explain} template and those values, so what a grower reads is exactly what
 * the engine matched on.
 *
 * @param seq firing order within the run, from 1
 * @param ruleId the rule's stable id (its name in the DRL file)
 * @param kind {@code inference}, {@code decision} or {@code caution} (the rule's {@code @kind})
 * @param blockId the block whose facts the rule matched, or null for a farm-wide rule
 * @param sourceId the water source the rule matched, or null
 * @param template the rule's explanation template
 * @param values the template's values by placeholder name, in template order
 * @param explanation the rendered explanation, metric units
 */
public record FiredRule(int seq, String ruleId, String kind, String blockId, String sourceId,
    String template, Map<String, Object> values, String explanation) {
  public FiredRule {
    Objects.requireNonNull(ruleId, "ruleId");
    Objects.requireNonNull(kind, "kind");
    Objects.requireNonNull(template, "template");
    values = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(values));
  }

  public boolean isCaution() {
    return "caution".equals(kind);
  }
}
