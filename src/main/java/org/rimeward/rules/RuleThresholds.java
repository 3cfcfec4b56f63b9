package org.rimeward.rules;

import java.time.ZoneOffset;
import java.util.List;
import org.rimeward.io.BadInputException;
import org.rimeward.rules.facts.Thresholds;

/**
 * The thresholds a rule book sets (rule THRESHOLDS in {@code policy/thresholds.drl}), read by
 * running it on no facts: for the commands and layers that judge by the rule files' numbers
 * without planning a night ({@code calc rate}, the night watch, the site's minimum model), so
 * that no threshold is written a second time in Java.
 */
public final class RuleThresholds {
  private RuleThresholds() {}

  public static Thresholds of(RuleBook book) {
    List<Thresholds> found = book.run(List.of(), ZoneOffset.UTC).all(Thresholds.class);
    if (found.size() != 1) {
      throw new BadInputException(book.folder() + ": the rule files set " + (found.isEmpty()
          ? "no thresholds" : found.size() + " sets of thresholds") + " (rule THRESHOLDS in"
          + " policy/thresholds.drl); restore that rule or pass --rules with a folder that has it");
    }
    return found.get(0);
  }
}
