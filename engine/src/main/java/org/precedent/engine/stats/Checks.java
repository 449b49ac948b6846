package org.precedent.engine.stats;

/** Argument checks shared by the fitters, so every refusal names what was wrong and where. */
final class Checks {
  private Checks() {}

  static void finite(double value, String what) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException(what + " must be finite; got " + value);
    }
  }

  static void finite(double[] values, String what) {
    if (values == null) {
      throw new IllegalArgumentException(what + " must not be null");
    }
    for (int i = 0; i < values.length; i++) {
      if (!Double.isFinite(values[i])) {
        throw new IllegalArgumentException(what + "[" + i + "] must be finite; got " + values[i]);
      }
    }
  }

  /** Scores and labels for a calibrator: non-empty, same length, finite scores. */
  static void scoresAndLabels(double[] scores, boolean[] labels) {
    if (scores == null || labels == null) {
      throw new IllegalArgumentException("scores and labels must not be null");
    }
    if (scores.length == 0) {
      throw new IllegalArgumentException("cannot calibrate on no examples");
    }
    if (scores.length != labels.length) {
      throw new IllegalArgumentException(
          scores.length + " scores but " + labels.length + " labels; they must pair up");
    }
    finite(scores, "score");
  }
}
