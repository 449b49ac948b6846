package org.precedent.engine.stats;

import java.util.Arrays;
import java.util.List;

/**
 * Binary logistic regression with an L2 penalty on the weights, fitted by Newton's method with step
 * halving (see {@link PenalisedNewton}). It maximises
 *
 * <pre>(1 / W) sum_i w_i log P(y_i | x_i) - (lambda / 2) sum_j beta_j^2,    W = sum_i w_i,</pre>
 *
 * where the log-likelihood is averaged, so one lambda means the same at any sample size (the scaling
 * glmnet uses: Friedman, Hastie and Tibshirani 2010, J. Stat. Software 33(1)). Features are
 * standardised internally to weighted mean 0 and population standard deviation 1, so the penalty
 * treats a feature measured in milliseconds no differently from one in seconds; the bias is not
 * penalised, so the fitted mean probability matches the observed rate whatever lambda is.
 *
 * <p>With only one class present the intercept-only maximum lies at infinite log-odds. The fit then
 * refuses rather than clip the rate: a combiner trained without a single right (or wrong) answer
 * knows nothing about what separates them, and a confidence near 0 or 1 from it would be trusted by
 * the reply threshold.
 */
public final class LogisticRegression {
  /**
   * Default penalty on the standardised weights. A small ridge of this size is common practice (not
   * from a specific source): it keeps the fit finite on separable data and barely moves well-determined
   * weights.
   */
  public static final double DEFAULT_LAMBDA = 1e-2;
  /** Stop when no parameter moves more than this, relative to the largest parameter plus one. */
  public static final double DEFAULT_TOLERANCE = 1e-10;
  /** Newton converges in a handful of steps when it converges; many more means separable data. */
  public static final int DEFAULT_MAX_ITERATIONS = 100;

  /** A constant feature is one whose spread is this small relative to its size. */
  private static final double CONSTANT_SPREAD = 1e-12;

  private LogisticRegression() {}

  /** Fits with {@link #DEFAULT_LAMBDA}, unit example weights and default stopping rules. */
  public static LogisticModel fit(List<String> names, double[][] x, boolean[] y) {
    return fit(names, x, y, DEFAULT_LAMBDA);
  }

  /** Fits with unit example weights and default stopping rules. */
  public static LogisticModel fit(List<String> names, double[][] x, boolean[] y, double lambda) {
    return fit(names, x, y, null, lambda, DEFAULT_TOLERANCE, DEFAULT_MAX_ITERATIONS);
  }

  /**
   * Fits the model.
   *
   * @param names one name per column of {@code x}
   * @param x one row per example, all rows as long as {@code names}, finite
   * @param y outcome per example; both classes must carry positive weight
   * @param exampleWeights non-negative finite weight per example (null: all 1); a weight of 2 counts
   *     an example as if it appeared twice
   * @param lambda L2 penalty on the standardised weights, {@code >= 0}
   * @throws IllegalArgumentException for empty or ragged data, non-finite values, or a single class
   * @throws IllegalStateException when the weights are not determined: with lambda 0 (or nearly), the
   *     classes are separable or features are collinear, or Newton's method does not converge
   */
  public static LogisticModel fit(List<String> names, double[][] x, boolean[] y, double[] exampleWeights,
      double lambda, double tolerance, int maxIterations) {
    return fitWithTrace(names, x, y, exampleWeights, lambda, tolerance, maxIterations).model();
  }

  /** The model and the objective after each accepted Newton step, for tests of the ascent guarantee. */
  record Fit(LogisticModel model, List<Double> objectiveTrace) {}

  static Fit fitWithTrace(List<String> names, double[][] x, boolean[] y, double[] exampleWeights,
      double lambda, double tolerance, int maxIterations) {
    double[] w = validate(names, x, y, exampleWeights);
    if (!(lambda >= 0) || Double.isInfinite(lambda)) {
      throw new IllegalArgumentException("lambda must be finite and >= 0; got " + lambda);
    }
    if (!(tolerance > 0) || Double.isInfinite(tolerance)) {
      throw new IllegalArgumentException("tolerance must be finite and positive; got " + tolerance);
    }
    if (maxIterations < 1) {
      throw new IllegalArgumentException("maxIterations must be at least 1; got " + maxIterations);
    }
    int n = x.length;
    int d = names.size();
    double[] mean = new double[d];
    double[] std = new double[d];
    boolean[] constant = new boolean[d];
    for (int j = 0; j < d; j++) {
      for (int i = 0; i < n; i++) {
        mean[j] += w[i] * x[i][j];
      }
      double variance = 0;
      for (int i = 0; i < n; i++) {
        variance += w[i] * (x[i][j] - mean[j]) * (x[i][j] - mean[j]);
      }
      double spread = Math.sqrt(variance);
      // A constant carries no information and would divide by zero; scale 1 leaves it near 0.
      constant[j] = !(spread > CONSTANT_SPREAD * (1 + Math.abs(mean[j])));
      std[j] = constant[j] ? 1.0 : spread;
    }
    double[][] z = new double[n][d];
    for (int i = 0; i < n; i++) {
      for (int j = 0; j < d; j++) {
        // Exactly 0 for a constant feature (not rounding residue), so its weight stays exactly 0.
        z[i][j] = constant[j] ? 0.0 : (x[i][j] - mean[j]) / std[j];
      }
    }
    PenalisedNewton.Solution solution =
        PenalisedNewton.solve(z, constant, y, w, lambda, tolerance, maxIterations);
    double[] theta = solution.theta();
    LogisticModel model =
        new LogisticModel(names, mean, std, Arrays.copyOfRange(theta, 1, theta.length), theta[0], lambda);
    return new Fit(model, List.copyOf(solution.objectiveTrace()));
  }

  /** Checks the inputs and returns the example weights normalised to sum 1. */
  private static double[] validate(List<String> names, double[][] x, boolean[] y, double[] exampleWeights) {
    if (names == null || x == null || y == null) {
      throw new IllegalArgumentException("names, features and outcomes must not be null");
    }
    if (x.length == 0) {
      throw new IllegalArgumentException("cannot fit a logistic regression to no examples");
    }
    if (y.length != x.length) {
      throw new IllegalArgumentException(x.length + " feature rows but " + y.length + " outcomes");
    }
    for (int i = 0; i < x.length; i++) {
      if (x[i] == null || x[i].length != names.size()) {
        throw new IllegalArgumentException("row " + i + " has " + (x[i] == null ? "no" : x[i].length)
            + " features; expected " + names.size() + " " + names);
      }
      for (int j = 0; j < x[i].length; j++) {
        if (!Double.isFinite(x[i][j])) {
          throw new IllegalArgumentException(
              "feature " + names.get(j) + " of row " + i + " must be finite; got " + x[i][j]);
        }
      }
    }
    double[] w = new double[x.length];
    if (exampleWeights == null) {
      Arrays.fill(w, 1.0);
    } else {
      if (exampleWeights.length != x.length) {
        throw new IllegalArgumentException(x.length + " examples but " + exampleWeights.length + " weights");
      }
      Checks.finite(exampleWeights, "example weight");
      for (int i = 0; i < w.length; i++) {
        if (exampleWeights[i] < 0) {
          throw new IllegalArgumentException("example weight " + i + " is negative: " + exampleWeights[i]);
        }
        w[i] = exampleWeights[i];
      }
    }
    double positive = 0;
    double negative = 0;
    for (int i = 0; i < w.length; i++) {
      positive += y[i] ? w[i] : 0;
      negative += y[i] ? 0 : w[i];
    }
    double total = positive + negative;
    if (!(positive > 0) || !(negative > 0)) {
      throw new IllegalArgumentException("logistic regression needs both outcomes with positive weight; got "
          + (positive > 0 ? "only positives" : "only negatives") + " (see class comment for why this refuses)");
    }
    for (int i = 0; i < w.length; i++) {
      w[i] /= total;
    }
    return w;
  }
}
