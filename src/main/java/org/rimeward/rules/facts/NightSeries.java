package org.rimeward.rules.facts;

import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.Map;
import java.util.Objects;
import java.util.List;

/**
 * One block's night, step by step: the values the physics computed for each forecast step.
 * Rules ask it questions (when does a value first fall to a threshold, what is the largest value
 * between two moments); the thresholds themselves are the rules' business. Between steps values
 * are taken as linear in time, and crossing moments are given to the minute, rounded to the safe
 * side (a start earlier, a stop later).
 */
public final class NightSeries {
  private final long[] epochSeconds;
  private final int[] lines;
  private final Map<Measure, double[]> values;

  public NightSeries(long[] epochSeconds, int[] lines, Map<Measure, double[]> values) {
    Objects.requireNonNull(epochSeconds, "epochSeconds");
    if (epochSeconds.length == 0) {
      throw new IllegalArgumentException("a night series needs at least one step");
    }
    for (int i = 1; i < epochSeconds.length; i++) {
      if (epochSeconds[i] <= epochSeconds[i - 1]) {
        throw new IllegalArgumentException("night series steps must be in time order");
      }
    }
    if (lines.length != epochSeconds.length) {
      throw new IllegalArgumentException("one line number per step is required");
    }
    EnumMap<Measure, double[]> copy = new EnumMap<>(Measure.class);
    for (Measure m : Measure.values()) {
      double[] v = values.get(m);
      if (v == null || v.length != epochSeconds.length) {
        throw new IllegalArgumentException("night series needs " + epochSeconds.length
            + " values of " + m);
      }
      copy.put(m, v.clone());
    }
    this.epochSeconds = epochSeconds.clone();
    this.lines = lines.clone();
    this.values = copy;
  }

  public int size() {
    return epochSeconds.length;
  }

  public Instant start() {
    return Instant.ofEpochSecond(epochSeconds[0]);
  }

  public Instant end() {
    return Instant.ofEpochSecond(epochSeconds[epochSeconds.length - 1]);
  }

  public Instant timeAt(int i) {
    return Instant.ofEpochSecond(epochSeconds[i]);
  }

  public double valueAt(Measure m, int i) {
    return values.get(m)[i];
  }

  public int lineAt(int i) {
    return lines[i];
  }

  /**
   * The first moment the value falls to {@code threshold} or below, rounded down to the minute.
   * Answers are lists of none or one, so that rules can match on them with {@code from}.
   */
  public List<Moment> firstAtOrBelow(Measure m, double threshold) {
    double[] v = values.get(m);
    if (v[0] <= threshold) {
      return List.of(new Moment(start(), v[0], true, lines[0]));
    }
    for (int i = 1; i < v.length; i++) {
      if (v[i] <= threshold) {
        double f = (v[i - 1] - threshold) / (v[i - 1] - v[i]);
        long t = epochSeconds[i - 1] + Math.round(f * (epochSeconds[i] - epochSeconds[i - 1]));
        Instant at = Instant.ofEpochSecond(t).truncatedTo(ChronoUnit.MINUTES);
        return List.of(new Moment(at, threshold, false, lines[i]));
      }
    }
    return List.of();
  }

  /**
   * The first moment at or after {@code notBefore} from which the value stays at or above
   * {@code threshold} to the end of the series, rounded up to the minute; empty if it never does.
   */
  public List<Moment> firstStaysAtOrAbove(Measure m, double threshold, Instant notBefore) {
    double[] v = values.get(m);
    long nb = notBefore.getEpochSecond();
    int last = v.length - 1;
    if (v[last] < threshold || epochSeconds[last] < nb) {
      return List.of();
    }
    int i = last;
    while (i > 0 && v[i - 1] >= threshold && epochSeconds[i - 1] >= nb) {
      i--;
    }
    // Steps i..last are at or above. If step i-1 is below, the value crosses between i-1 and i;
    // if it is at or above too, the walk stopped only because i-1 is before notBefore, and the
    // value holds from notBefore on (both ends of that interval are at or above, linear between).
    long t = epochSeconds[i];
    if (i > 0 && v[i - 1] < threshold) {
      double f = (threshold - v[i - 1]) / (v[i] - v[i - 1]);
      t = epochSeconds[i - 1] + Math.round(f * (epochSeconds[i] - epochSeconds[i - 1]));
    } else if (i > 0) {
      t = nb;
    }
    if (t < nb) {
      t = nb;
    }
    Instant at = Instant.ofEpochSecond(t);
    if (at.truncatedTo(ChronoUnit.MINUTES).isBefore(at)) {
      at = at.truncatedTo(ChronoUnit.MINUTES).plus(1, ChronoUnit.MINUTES);
    }
    return List.of(new Moment(at, Math.max(threshold, valueAtTime(m, at)), false, lines[i]));
  }

  /** The value at a moment, linear between steps; the end values outside the series. */
  public double valueAtTime(Measure m, Instant at) {
    double[] v = values.get(m);
    long t = at.getEpochSecond();
    if (t <= epochSeconds[0]) {
      return v[0];
    }
    for (int i = 1; i < v.length; i++) {
      if (t <= epochSeconds[i]) {
        double f = (double) (t - epochSeconds[i - 1]) / (epochSeconds[i] - epochSeconds[i - 1]);
        return v[i - 1] + f * (v[i] - v[i - 1]);
      }
    }
    return v[v.length - 1];
  }

  /** The largest value at the steps between two moments, and at the two moments themselves. */
  public double max(Measure m, Instant from, Instant to) {
    return extreme(m, from, to, Math::max);
  }

  /** The smallest value at the steps between two moments, and at the two moments themselves. */
  public double min(Measure m, Instant from, Instant to) {
    return extreme(m, from, to, Math::min);
  }

  private double extreme(Measure m, Instant from, Instant to, java.util.function.DoubleBinaryOperator pick) {
    double best = pick.applyAsDouble(valueAtTime(m, from), valueAtTime(m, to));
    double[] v = values.get(m);
    for (int i = 0; i < epochSeconds.length; i++) {
      Instant t = timeAt(i);
      if (!t.isBefore(from) && !t.isAfter(to)) {
        best = pick.applyAsDouble(best, v[i]);
      }
    }
    return best;
  }

  /**
   * The largest value known (not NaN) at the steps between two moments and at the two moments
   * themselves, with its moment; empty when none is known.
   */
  public List<Moment> maxKnown(Measure m, Instant from, Instant to) {
    double[] v = values.get(m);
    Moment best = null;
    for (Instant end : new Instant[] {from, to}) {
      double e = valueAtTime(m, end);
      if (!Double.isNaN(e) && (best == null || e > best.value())) {
        best = new Moment(end, e, false, lineAtOrAfter(end));
      }
    }
    for (int i = 0; i < v.length; i++) {
      Instant t = timeAt(i);
      if (!t.isBefore(from) && !t.isAfter(to) && !Double.isNaN(v[i])
          && (best == null || v[i] > best.value())) {
        best = new Moment(t, v[i], false, lines[i]);
      }
    }
    return best == null ? List.of() : List.of(best);
  }

  /**
   * The first step between two moments (both included) whose value is unknown (NaN); empty if
   * none. Steps outside the interval do not count, though a value at one of the moments is read
   * between a step inside and one outside: {@link #maxKnown} leaves such a value out.
   */
  public List<Moment> firstUnknown(Measure m, Instant from, Instant to) {
    double[] v = values.get(m);
    for (int i = 0; i < v.length; i++) {
      if (!timeAt(i).isBefore(from) && !timeAt(i).isAfter(to) && Double.isNaN(v[i])) {
        return List.of(new Moment(timeAt(i), v[i], i == 0, lines[i]));
      }
    }
    return List.of();
  }

  /**
   * The largest value of {@code m} at the steps of an interval where {@code condition} is below
   * {@code below}, with its step: the step in progress at {@code from} and the steps up to
   * {@code to}. Empty when no such step has the condition.
   */
  public List<Moment> maxWhereBelow(Measure m, Instant from, Instant to, Measure condition,
      double below) {
    double[] v = values.get(m);
    double[] c = values.get(condition);
    int first = 0;
    for (int i = 0; i < v.length; i++) {
      if (!timeAt(i).isAfter(from)) {
        first = i;
      }
    }
    Moment best = null;
    for (int i = first; i < v.length && !timeAt(i).isAfter(to); i++) {
      if (c[i] < below && (best == null || v[i] > best.value())) {
        best = new Moment(timeAt(i), v[i], false, lines[i]);
      }
    }
    return best == null ? List.of() : List.of(best);
  }

  /** As {@link #firstStaysAtOrAbove}, the moment alone; null when the value never stays there. */
  public Instant firstStaysAtOrAboveAt(Measure m, double threshold, Instant notBefore) {
    List<Moment> found = firstStaysAtOrAbove(m, threshold, notBefore);
    return found.isEmpty() ? null : found.get(0).at();
  }

  private int lineAtOrAfter(Instant t) {
    for (int i = 0; i < epochSeconds.length; i++) {
      if (!timeAt(i).isBefore(t)) {
        return lines[i];
      }
    }
    return lines[lines.length - 1];
  }

  /** The step where the value is smallest (the first such step). */
  public int indexOfMin(Measure m) {
    double[] v = values.get(m);
    int best = 0;
    for (int i = 1; i < v.length; i++) {
      if (v[i] < v[best]) {
        best = i;
      }
    }
    return best;
  }

  @Override
  public String toString() {
    return "NightSeries[" + start() + ".." + end() + ", " + size() + " steps, min air "
        + Arrays.stream(values.get(Measure.AIR_C)).min().orElse(Double.NaN) + " C]";
  }
}
