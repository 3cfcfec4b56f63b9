package org.rimeward.audit;

import com.fasterxml.jackson.core.JsonProcessingException;
import java.util.List;
import java.util.Objects;
import org.rimeward.io.Json;
import org.rimeward.plan.PlanDocument;

/**
 * The decision for one block in one run, with the rules that led to it in firing order.
 *
 * @param status {@code not-needed}, {@code protected}, {@code short-of-water} or
 *     {@code unprotected}, as in the plan
 * @param decisionJson the block's entry of the plan document, as JSON
 */
public record RecordedBlock(String blockId, String status, String risk, boolean protectionNeeded,
    String decisionJson, List<RecordedRule> rules) {
  public RecordedBlock {
    if (blockId == null || blockId.isBlank()) {
      throw new IllegalArgumentException("a recorded block needs its block id");
    }
    Objects.requireNonNull(status, "status of block " + blockId);
    Objects.requireNonNull(risk, "risk of block " + blockId);
    if (decisionJson == null || decisionJson.isBlank()) {
      throw new IllegalArgumentException("block " + blockId + ": decisionJson is missing");
    }
    rules = List.copyOf(Objects.requireNonNull(rules, "rules of block " + blockId));
    for (int i = 1; i < rules.size(); i++) {
      if (rules.get(i).seq() <= rules.get(i - 1).seq()) {
        throw new IllegalArgumentException("block " + blockId + ": rules must be in firing order,"
            + " but seq " + rules.get(i).seq() + " (" + rules.get(i).ruleId() + ") follows seq "
            + rules.get(i - 1).seq());
      }
    }
  }

  /**
   * The block's entry of the plan document, read back: what {@code why}, {@code show} and the
   * crew's actions are compared with.
   *
   * @throws AuditIntegrityException when the recorded JSON does not read as a plan's block
   */
  public PlanDocument.Block decision() {
    try {
      return Json.mapper().readValue(decisionJson, PlanDocument.Block.class);
    } catch (JsonProcessingException e) {
      throw new AuditIntegrityException("block " + blockId + ": the recorded decision cannot be"
          + " read back; run 'rimeward audit verify'");
    }
  }
}
