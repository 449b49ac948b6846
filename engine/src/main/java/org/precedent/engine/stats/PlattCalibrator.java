package org.precedent.engine.stats;

/**
 * Platt's sigmoid, P(right | score f) = 1 / (1 + exp(a * f + b)). The sign convention is Platt's
 * (1999): a is negative when higher scores mean more likely right.
 *
 * @param a slope, finite
 * @param b offset, finite
 */
public record PlattCalibrator(double a, double b) {
  public PlattCalibrator {
    Checks.finite(a, "Platt slope a");
    Checks.finite(b, "Platt offset b");
  }

  /** Calibrated probability for a finite score. */
  public double calibrate(double score) {
    Checks.finite(score, "score");
    // 1 / (1 + e^u) is the logistic function of -u.
    return Sigmoid.logistic(-(a * score + b));
  }
}
