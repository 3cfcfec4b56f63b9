package org.rimeward.plan;

/**
 * The policy the run used, as written in the farm file.
 *
 * @param target {@code t10} or a temperature such as {@code -1.5C}
 */
public record PlanPolicy(String target, double startMarginC, String stopRule) {}
