package org.precedent.engine.measure;

/**
 * What one reply threshold would have done on held-out tickets.
 *
 * @param threshold        reply automatically when confidence >= this value
 * @param answered         how many tickets would have been answered automatically
 * @param answeredShare    answered / all tickets
 * @param precision        share of automatic replies that were right; NaN when nothing was answered
 * @param precisionLower   lower limit of the 95% Wilson interval for the precision; NaN when nothing
 *                         was answered
 * @param precisionUpper   upper limit of that interval; NaN when nothing was answered
 * @param wrongPerThousand expected wrong automatic replies per 1,000 incoming tickets
 */
public record ThresholdRow(
    double threshold,
    int answered,
    double answeredShare,
    double precision,
    double precisionLower,
    double precisionUpper,
    double wrongPerThousand) {
  public ThresholdRow {
    Inputs.closed01(threshold, "threshold");
    if (answered < 0) {
      throw new IllegalArgumentException("answered count is negative: " + answered);
    }
    Inputs.closed01(answeredShare, "answered share");
    if (answered == 0) {
      if (!Double.isNaN(precision) || !Double.isNaN(precisionLower) || !Double.isNaN(precisionUpper)) {
        throw new IllegalArgumentException("with nothing answered, precision and its interval must be NaN");
      }
    } else {
      Inputs.closed01(precision, "precision");
      new Interval(precisionLower, precisionUpper); // checks 0 <= lower <= upper <= 1
    }
    if (!(wrongPerThousand >= 0.0 && wrongPerThousand <= 1000.0)) {
      throw new IllegalArgumentException("wrong replies per 1,000 must lie in [0, 1000]; got " + wrongPerThousand);
    }
  }
}
