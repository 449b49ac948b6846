package org.precedent.engine.measure;

import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/** Shared argument checks and orderings, so every measure rejects bad input the same way. */
final class Inputs {
  private Inputs() {}

  /** Copies the list (rejecting null elements) and refuses an empty one, naming the measure. */
  static <T> List<T> nonEmpty(List<T> items, String measure) {
    Objects.requireNonNull(items, measure + ": input list is null");
    if (items.isEmpty()) {
      throw new IllegalArgumentException(measure + " needs at least one item; the input list is empty");
    }
    return List.copyOf(items);
  }

  /** Checks a probability-like parameter that must lie strictly inside (0, 1). */
  static double open01(double value, String name) {
    if (!(value > 0.0 && value < 1.0)) {
      throw new IllegalArgumentException(name + " must lie strictly between 0 and 1; got " + value);
    }
    return value;
  }

  /** Checks a value that must lie in [0, 1], NaN excluded. */
  static double closed01(double value, String name) {
    if (!(value >= 0.0 && value <= 1.0)) {
      throw new IllegalArgumentException(name + " must lie in [0, 1]; got " + value);
    }
    return value;
  }

  /** The answers ordered by confidence, highest first; ties keep their input order. */
  static JudgedAnswer[] byConfidenceDescending(List<JudgedAnswer> answers) {
    JudgedAnswer[] sorted = answers.toArray(new JudgedAnswer[0]);
    Arrays.sort(sorted, (a, b) -> Double.compare(b.confidence(), a.confidence()));
    return sorted;
  }
}
