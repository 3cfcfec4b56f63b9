package org.rimeward.io;

import java.util.ArrayList;
import java.util.List;

/**
 * Every problem found in one input, collected so the person fixes them all in one go instead of
 * one per run. Each is {@code file:line: what is wrong and what to write}. {@link #throwIfAny()}
 * turns them into one {@link BadInputException}, one problem per line.
 */
public final class Problems {
  /** More than this many are summarised: past a few dozen the file is likely the wrong one. */
  static final int MAX_SHOWN = 25;

  private final String label;
  private final List<String> all = new ArrayList<>();

  /** Problems of the file named {@code label} in messages. */
  public Problems(String label) {
    this.label = label;
  }

  public String label() {
    return label;
  }

  /** A problem at {@code line} of the file (0 or less: the file as a whole). */
  public void add(int line, String message) {
    all.add((line > 0 ? label + ":" + line : label) + ": " + message);
  }

  /** A problem already written with its place, such as a {@link BadInputException}'s message. */
  public void addWritten(String message) {
    all.add(message);
  }

  public boolean isEmpty() {
    return all.isEmpty();
  }

  public int size() {
    return all.size();
  }

  public List<String> all() {
    return List.copyOf(all);
  }

  /** Throws the problems found so far, if any. */
  public void throwIfAny() {
    if (all.isEmpty()) {
      return;
    }
    List<String> shown = new ArrayList<>(all.subList(0, Math.min(all.size(), MAX_SHOWN)));
    if (all.size() > MAX_SHOWN) {
      shown.add(label + ": ... and " + (all.size() - MAX_SHOWN) + " more problems; is this the"
          + " right file?");
    }
    throw new BadInputException(String.join(System.lineSeparator(), shown));
  }
}
