package org.precedent.engine.stats;

/**
 * Fits Platt's sigmoid (J. Platt, 1999, "Probabilistic Outputs for Support Vector Machines and
 * Comparisons to Regularized Likelihood Methods") by the algorithm of H.-T. Lin, C.-J. Lin and R. C.
 * Weng (2007), "A note on Platt's probabilistic outputs for support vector machines", Machine
 * Learning 68, Algorithm 1 (their pseudo-code, followed step by step here).
 *
 * <p>It minimises the cross-entropy F(A, B) = sum_i [-t_i log p_i - (1 - t_i) log(1 - p_i)] with
 * p_i = 1 / (1 + exp(A f_i + B)), against Platt's smoothed targets t+ = (N+ + 1) / (N+ + 2) for right
 * answers and t- = 1 / (N- + 2) for wrong ones. The smoothing keeps A and B finite even when the
 * scores separate the classes or only one class is present. Lin, Lin and Weng replace Platt's
 * Levenberg-Marquardt loop with Newton's method on a Hessian nudged by sigma I, a backtracking line
 * search with a sufficient-decrease test, and an evaluation of F that cannot overflow.
 */
public final class PlattScaling {
  // Constants of Lin, Lin and Weng (2007), Algorithm 1.
  private static final int MAX_ITERATIONS = 100;
  private static final double MIN_STEP = 1e-10;
  private static final double SIGMA = 1e-12;
  private static final double GRADIENT_TOLERANCE = 1e-5;
  private static final double SUFFICIENT_DECREASE = 1e-4;

  private PlattScaling() {}

  /**
   * Fits the sigmoid to scores and whether each scored answer was right.
   *
   * @throws IllegalArgumentException for no examples, unequal lengths or non-finite scores
   */
  public static PlattCalibrator fit(double[] scores, boolean[] labels) {
    Checks.scoresAndLabels(scores, labels);
    double[] f = scores.clone();
    double[] t = targets(labels);
    int n = f.length;
    int prior1 = 0;
    for (boolean label : labels) {
      prior1 += label ? 1 : 0;
    }
    int prior0 = n - prior1;
    // Initial point of Algorithm 1: A = 0, B = log((N- + 1) / (N+ + 1)).
    double a = 0.0;
    double b = Math.log((prior0 + 1.0) / (prior1 + 1.0));
    double fval = objective(f, t, a, b);
    for (int iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
      // Gradient and Hessian; the Hessian is H' = H + sigma I to keep it strictly positive definite.
      double h11 = SIGMA;
      double h22 = SIGMA;
      double h21 = 0.0;
      double g1 = 0.0;
      double g2 = 0.0;
      for (int i = 0; i < n; i++) {
        double fApB = f[i] * a + b;
        double p;
        double q;
        if (fApB >= 0) {
          p = Math.exp(-fApB) / (1.0 + Math.exp(-fApB));
          q = 1.0 / (1.0 + Math.exp(-fApB));
        } else {
          p = 1.0 / (1.0 + Math.exp(fApB));
          q = Math.exp(fApB) / (1.0 + Math.exp(fApB));
        }
        double d2 = p * q;
        h11 += f[i] * f[i] * d2;
        h22 += d2;
        h21 += f[i] * d2;
        double d1 = t[i] - p;
        g1 += f[i] * d1;
        g2 += d1;
      }
      if (Math.abs(g1) < GRADIENT_TOLERANCE && Math.abs(g2) < GRADIENT_TOLERANCE) {
        break;
      }
      // Newton direction -inv(H') g, by the 2 x 2 inverse.
      double det = h11 * h22 - h21 * h21;
      double dA = -(h22 * g1 - h21 * g2) / det;
      double dB = -(-h21 * g1 + h11 * g2) / det;
      double gd = g1 * dA + g2 * dB;
      double stepSize = 1.0;
      while (stepSize >= MIN_STEP) {
        double newA = a + stepSize * dA;
        double newB = b + stepSize * dB;
        double newF = objective(f, t, newA, newB);
        if (newF < fval + SUFFICIENT_DECREASE * stepSize * gd) {
          a = newA;
          b = newB;
          fval = newF;
          break;
        }
        stepSize /= 2.0;
      }
      if (stepSize < MIN_STEP) {
        // The paper reports "line search fails" and stops; the current point is the best found.
        break;
      }
    }
    return new PlattCalibrator(a, b);
  }

  /** Platt's smoothed targets: (N+ + 1) / (N+ + 2) for each right answer, 1 / (N- + 2) for each wrong. */
  static double[] targets(boolean[] labels) {
    int positives = 0;
    for (boolean label : labels) {
      positives += label ? 1 : 0;
    }
    int negatives = labels.length - positives;
    double hi = (positives + 1.0) / (positives + 2.0);
    double lo = 1.0 / (negatives + 2.0);
    double[] t = new double[labels.length];
    for (int i = 0; i < t.length; i++) {
      t[i] = labels[i] ? hi : lo;
    }
    return t;
  }

  /**
   * F(A, B) in the overflow-free form of Lin, Lin and Weng (2007): with u = A f + B, the term is
   * t u + log(1 + e^-u) when u >= 0 and (t - 1) u + log(1 + e^u) otherwise (log1p here: the same
   * value, without the rounding of 1 + a tiny number).
   */
  private static double objective(double[] f, double[] t, double a, double b) {
    double value = 0.0;
    for (int i = 0; i < f.length; i++) {
      double fApB = f[i] * a + b;
      if (fApB >= 0) {
        value += t[i] * fApB + Math.log1p(Math.exp(-fApB));
      } else {
        value += (t[i] - 1) * fApB + Math.log1p(Math.exp(fApB));
      }
    }
    return value;
  }
}
