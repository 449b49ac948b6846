package org.precedent.engine.stats;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Newton's method (iteratively reweighted least squares, Hastie, Tibshirani and Friedman, "The
 * Elements of Statistical Learning", 2nd ed., section 4.4.1) for the penalised objective
 *
 * <pre>F(b, beta) = sum_i w_i log P(y_i | z_i) - (lambda / 2) |beta|^2,    sum_i w_i = 1,</pre>
 *
 * over standardised features z. Plain Newton can overshoot and lower F when the start is far from the
 * optimum; each step is therefore halved until F does not decrease, which keeps the sequence of F
 * values non-decreasing (the guarantee the caller relies on).
 */
final class PenalisedNewton {
  /** Enough halvings to shrink any step below the spacing of doubles near the parameters. */
  private static final int MAX_HALVINGS = 60;

  private PenalisedNewton() {}

  /** Parameters (index 0 the bias, then one weight per feature) and F after each accepted step. */
  record Solution(double[] theta, List<Double> objectiveTrace, int iterations) {}

  /**
   * Smallest acceptable Cholesky pivot (before the square root) of the information matrix at the
   * optimum. Standardised columns with weights summing to 1 give diagonal entries of 1/4 at p = 1/2,
   * so 1e-10 is ten orders of magnitude below an ordinary curvature; below it the curvature has
   * vanished (probabilities rounded to 0 or 1 along some direction) or two features coincide.
   */
  private static final double MIN_PIVOT = 1e-10;

  /**
   * Maximises F from the intercept-only optimum.
   *
   * @param ignored features that are constant (their z column is all 0): excluded from the check
   *     that the optimum is determined, since their weight is fixed at 0 by a zero gradient
   */
  static Solution solve(double[][] z, boolean[] ignored, boolean[] y, double[] w, double lambda,
      double tolerance, int maxIterations) {
    int d = z[0].length;
    double[] theta = new double[d + 1];
    // Start from the intercept-only optimum: the weighted rate of positives (both classes are present).
    double rate = 0;
    for (int i = 0; i < z.length; i++) {
      rate += y[i] ? w[i] : 0;
    }
    theta[0] = Math.log(rate / (1 - rate));
    double f = objective(z, y, w, lambda, theta);
    List<Double> trace = new ArrayList<>();
    trace.add(f);
    for (int iteration = 1; iteration <= maxIterations; iteration++) {
      double[] gradient = new double[d + 1];
      double[][] information = derivatives(z, y, w, lambda, theta, gradient);
      double[] step = SymmetricSolver.solve(information, gradient);
      double scale = 1.0;
      double[] candidate = null;
      double fCandidate = Double.NaN;
      for (int h = 0; h <= MAX_HALVINGS; h++, scale /= 2) {
        double[] trial = theta.clone();
        for (int a = 0; a <= d; a++) {
          trial[a] += scale * step[a];
        }
        double fTrial = objective(z, y, w, lambda, trial);
        if (fTrial >= f) {
          candidate = trial;
          fCandidate = fTrial;
          break;
        }
      }
      if (candidate == null) {
        // No fraction of an ascent direction raises F in this arithmetic: theta is the optimum to
        // within rounding.
        return determined(z, ignored, y, w, lambda, new Solution(theta, trace, iteration));
      }
      double moved = 0;
      double size = 0;
      for (int a = 0; a <= d; a++) {
        moved = Math.max(moved, Math.abs(candidate[a] - theta[a]));
        size = Math.max(size, Math.abs(candidate[a]));
      }
      theta = candidate;
      f = fCandidate;
      trace.add(f);
      if (moved <= tolerance * (1 + size)) {
        return determined(z, ignored, y, w, lambda, new Solution(theta, trace, iteration));
      }
    }
    throw new IllegalStateException("logistic regression did not converge in " + maxIterations
        + " Newton steps; with lambda = 0 this happens when the classes are (quasi-)separable, so the weights"
        + " grow without bound. Use a positive lambda.");
  }

  /**
   * Refuses an optimum whose information matrix is singular. Without a penalty, separable classes
   * drive the weights up until the fitted probabilities round to exactly 0 or 1; gradient and
   * curvature then vanish in floating point and Newton seems to stop, at a point that is no maximum.
   */
  private static Solution determined(
      double[][] z, boolean[] ignored, boolean[] y, double[] w, double lambda, Solution solution) {
    double[][] information = derivatives(z, y, w, lambda, solution.theta(), new double[z[0].length + 1]);
    int[] kept = IntStream.rangeClosed(0, z[0].length)
        .filter(a -> a == 0 || !ignored[a - 1])
        .toArray();
    double[][] reduced = new double[kept.length][kept.length];
    for (int a = 0; a < kept.length; a++) {
      for (int b = 0; b <= a; b++) {
        reduced[a][b] = information[kept[a]][kept[b]];
      }
    }
    if (!SymmetricSolver.positiveDefinite(reduced, MIN_PIVOT)) {
      throw new IllegalStateException("logistic regression weights are not determined: the curvature of"
          + " the likelihood vanishes at the fit, because the classes are (quasi-)separable (probabilities"
          + " of 0 or 1) or features are collinear. Use a positive lambda.");
    }
    return solution;
  }

  /** Information matrix (lower triangle) of -F at theta; fills {@code gradient} with the gradient of F. */
  private static double[][] derivatives(
      double[][] z, boolean[] y, double[] w, double lambda, double[] theta, double[] gradient) {
    int d = gradient.length - 1;
    double[][] information = new double[d + 1][d + 1];
    for (int i = 0; i < z.length; i++) {
      double p = Sigmoid.logistic(eta(z[i], theta));
      double residual = w[i] * ((y[i] ? 1 : 0) - p);
      double curvature = w[i] * p * (1 - p);
      for (int a = 0; a <= d; a++) {
        double za = a == 0 ? 1 : z[i][a - 1];
        gradient[a] += residual * za;
        for (int b = 0; b <= a; b++) {
          information[a][b] += curvature * za * (b == 0 ? 1 : z[i][b - 1]);
        }
      }
    }
    for (int a = 1; a <= d; a++) {
      gradient[a] -= lambda * theta[a];
      information[a][a] += lambda;
    }
    return information;
  }

  static double objective(double[][] z, boolean[] y, double[] w, double lambda, double[] theta) {
    double f = 0;
    for (int i = 0; i < z.length; i++) {
      if (w[i] > 0) {
        f += w[i] * Sigmoid.logLikelihood(y[i], eta(z[i], theta));
      }
    }
    double norm = 0;
    for (int a = 1; a < theta.length; a++) {
      norm += theta[a] * theta[a];
    }
    return f - 0.5 * lambda * norm;
  }

  private static double eta(double[] zi, double[] theta) {
    double eta = theta[0];
    for (int j = 0; j < zi.length; j++) {
      eta += theta[j + 1] * zi[j];
    }
    return eta;
  }
}
