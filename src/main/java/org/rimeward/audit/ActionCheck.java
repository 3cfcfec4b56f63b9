package org.rimeward.audit;

import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.Optional;
import org.rimeward.plan.PlanDocument;

/**
 * Whether what the crew did contradicts the block's latest plan. It warns and never refuses: the
 * people in the field see what the plan cannot, and the record must show what they did.
 */
public final class ActionCheck {
  private static final DateTimeFormatter CLOCK = DateTimeFormatter.ofPattern("HH:mm", Locale.ROOT);

  private ActionCheck() {}

  /** The warning for {@code kind} done at {@code at}, given the block's recorded decision. */
  public static Optional<String> warning(CrewAction.Kind kind, Instant at, RecordedBlock advised,
      ZoneId zone) {
    PlanDocument.Block decision = advised.decision();
    Optional<PlanDocument.Action> found = decision.actions().stream()
        // A sprinkling run the rules advise against, or one granted no water, is shown to the
        // manager with its times but is not advice to sprinkle.
        .filter(a -> kind.sprinkling() ? a instanceof PlanDocument.Sprinkle sp && sp.isAdvised()
            && sp.waterGranted() : a instanceof PlanDocument.Cover)
        .reduce((first, second) -> second);
    if (found.isEmpty()) {
      return kind.starts() ? Optional.of("the plan advised no " + (kind.sprinkling()
          ? "sprinkling" : "covers") + " on " + advised.blockId() + " tonight") : Optional.empty();
    }
    PlanDocument.Action action = found.get();
    String when = CLOCK.format(at.atZone(zone));
    return switch (kind) {
      case SPRINKLING_ON -> instant(action.begins()).filter(at::isAfter).map(s -> "sprinklers on at "
          + when + ", after the start the plan gives (" + CLOCK.format(s.atZone(zone)) + ")");
      case SPRINKLING_OFF -> instant(action.ends()).filter(at::isBefore).map(s -> "sprinklers off at "
          + when + ", before the stop condition is met (the plan gives " + CLOCK.format(s.atZone(zone))
          + "): iced buds whose wet bulb is still below the threshold can cool below the air as"
          + " the ice evaporates");
      case COVERS_ON -> instant(((PlanDocument.Cover) action).deployBy()).filter(at::isAfter)
          .map(s -> "covers on at " + when + ", after the plan's deadline ("
              + CLOCK.format(s.atZone(zone)) + "): the ground has already lost the day's heat they"
              + " were meant to keep");
      case COVERS_OFF -> instant(action.ends()).filter(at::isBefore).map(s -> "covers off at "
          + when + " with the air still below the target: the plan keeps them on until "
          + CLOCK.format(s.atZone(zone)));
    };
  }

  private static Optional<Instant> instant(OffsetDateTime t) {
    return Optional.ofNullable(t).map(OffsetDateTime::toInstant);
  }
}
