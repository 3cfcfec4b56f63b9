package org.rimeward.audit;

/**
 * One rule that fired for a block, as the engine reported it.
 *
 * @param seq firing order within the block, starting anywhere, strictly increasing
 * @param factsJson a JSON object of the fact values the rule used
 */
public record RecordedRule(int seq, String ruleId, String explanation, String factsJson) {
  public RecordedRule {
    if (ruleId == null || ruleId.isBlank()) {
      throw new IllegalArgumentException("a recorded rule needs its rule id (firing " + seq + ")");
    }
    if (explanation == null) {
      throw new IllegalArgumentException("rule " + ruleId + ": explanation is missing");
    }
    if (factsJson == null || factsJson.isBlank()) {
      throw new IllegalArgumentException("rule " + ruleId + ": factsJson is missing; use {} when none");
    }
  }
}
