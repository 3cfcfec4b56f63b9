package org.rimeward.weather;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * The night's forecast: steps in strictly increasing time order, as read from {@code file}.
 * Whether the steps are close enough together over the night is the planner's check, helped by
 * {@link #covers} and {@link #maxGapWithin}.
 *
 * @param format the format the file was recognised as
 * @param coarse where the source gave one value for longer than an hour and the reader spread it
 * @param notes what a manager should know about how the file was read (a converted time zone,
 *     the distance to the forecast point), in plain words
 */
public record Forecast(Path file, ForecastFormat format, List<ForecastStep> steps,
    List<CoarseSpan> coarse, List<String> notes) {
  public Forecast {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(format, "format");
    steps = List.copyOf(steps);
    coarse = List.copyOf(coarse);
    notes = List.copyOf(notes);
    if (steps.isEmpty()) {
      throw new IllegalArgumentException("forecast " + file + " has no steps");
    }
    for (int i = 1; i < steps.size(); i++) {
      if (!steps.get(i).time().isAfter(steps.get(i - 1).time())) {
        throw new IllegalArgumentException("forecast steps must be in increasing time order: "
            + steps.get(i).time() + " follows " + steps.get(i - 1).time());
      }
    }
  }

  /** A forecast read from Rimeward's CSV, or built in code. */
  public Forecast(Path file, List<ForecastStep> steps) {
    this(file, ForecastFormat.CSV, steps, List.of(), List.of());
  }

  public Instant start() {
    return steps.get(0).time();
  }

  public Instant end() {
    return steps.get(steps.size() - 1).time();
  }

  /** Whether a step lies at or before {@code from} and another at or after {@code to}. */
  public boolean covers(Instant from, Instant to) {
    checkWindow(from, to);
    return !start().isAfter(from) && !end().isBefore(to);
  }

  /**
   * The longest time between consecutive steps that a value inside [{@code from}, {@code to}]
   * would be interpolated across: the steps inside the window plus the one at or before
   * {@code from} and the one at or after {@code to}. A part of the window the forecast does not
   * reach counts in full as a gap (from {@code from} to the first step, or from the last step to
   * {@code to}), so an uncovered window never looks well sampled.
   */
  public Duration maxGapWithin(Instant from, Instant to) {
    checkWindow(from, to);
    List<Instant> points = new ArrayList<>();
    ForecastStep before = null;
    ForecastStep after = null;
    for (ForecastStep s : steps) {
      if (!s.time().isAfter(from)) {
        before = s;
      }
      if (after == null && !s.time().isBefore(to)) {
        after = s;
      }
    }
    points.add(before != null ? before.time() : from);
    for (ForecastStep s : steps) {
      if (s.time().isAfter(from) && s.time().isBefore(to)) {
        points.add(s.time());
      }
    }
    points.add(after != null ? after.time() : to);
    Duration max = Duration.ZERO;
    for (int i = 1; i < points.size(); i++) {
      Duration d = Duration.between(points.get(i - 1), points.get(i));
      if (d.compareTo(max) > 0) {
        max = d;
      }
    }
    return max;
  }

  /** The steps with {@code from ≤ time ≤ to}, in time order. */
  public List<ForecastStep> stepsBetween(Instant from, Instant to) {
    checkWindow(from, to);
    return steps.stream().filter(s -> !s.time().isBefore(from) && !s.time().isAfter(to)).toList();
  }

  private static void checkWindow(Instant from, Instant to) {
    Objects.requireNonNull(from, "from");
    Objects.requireNonNull(to, "to");
    if (to.isBefore(from)) {
      throw new IllegalArgumentException("window ends (" + to + ") before it starts (" + from + ")");
    }
  }
}
