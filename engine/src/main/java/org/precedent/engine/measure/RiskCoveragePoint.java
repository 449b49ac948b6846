package org.precedent.engine.measure;

/**
 * One operating point of the reply threshold: answer automatically when confidence >= threshold.
 *
 * @param threshold the confidence threshold (one of the observed confidences)
 * @param accepted  how many answers the threshold lets through
 * @param wrong     how many of those were wrong (out-of-scope tickets answered count as wrong)
 * @param coverage  accepted / all answers
 * @param risk      wrong / accepted: the error rate a customer meets among automatic replies
 */
public record RiskCoveragePoint(double threshold, int accepted, int wrong, double coverage, double risk) {
  public RiskCoveragePoint {
    Inputs.closed01(threshold, "threshold");
    if (accepted < 1) {
      throw new IllegalArgumentException("an operating point accepts at least one answer; got " + accepted);
    }
    if (wrong < 0 || wrong > accepted) {
      throw new IllegalArgumentException("wrong count " + wrong + " is not within 0.." + accepted);
    }
    Inputs.closed01(coverage, "coverage");
    Inputs.closed01(risk, "risk");
  }

  /** Share of accepted answers that were right, computed from the counts to avoid 1 - risk rounding. */
  public double precision() {
    return (double) (accepted - wrong) / accepted;
  }
}
