package org.precedent.engine.measure;

/**
 * One bar of a reliability diagram: the answers whose confidence fell in {@code (lower, upper]}
 * (the first bin also takes confidence exactly 0).
 *
 * @param lower          lower edge of the bin
 * @param upper          upper edge of the bin
 * @param count          how many answers fell in the bin
 * @param meanConfidence mean confidence of those answers; NaN when the bin is empty, since there is
 *                       nothing to average and a made-up value would draw a false bar
 * @param accuracy       share of those answers that were right; NaN when the bin is empty
 */
public record ReliabilityBin(double lower, double upper, int count, double meanConfidence, double accuracy) {
  public ReliabilityBin {
    Inputs.closed01(lower, "bin lower edge");
    Inputs.closed01(upper, "bin upper edge");
    if (!(lower < upper)) {
      throw new IllegalArgumentException("bin lower edge " + lower + " is not below upper edge " + upper);
    }
    if (count < 0) {
      throw new IllegalArgumentException("bin count is negative: " + count);
    }
    if (count == 0) {
      if (!Double.isNaN(meanConfidence) || !Double.isNaN(accuracy)) {
        throw new IllegalArgumentException("an empty bin has no mean confidence or accuracy; both must be NaN");
      }
    } else {
      Inputs.closed01(meanConfidence, "bin mean confidence");
      Inputs.closed01(accuracy, "bin accuracy");
    }
  }

  /** The gap a calibrated system would not have; 0 for an empty bin, which weighs nothing. */
  public double gap() {
    return count == 0 ? 0.0 : Math.abs(accuracy - meanConfidence);
  }
}
