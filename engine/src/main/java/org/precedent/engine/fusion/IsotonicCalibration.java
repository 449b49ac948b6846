package org.precedent.engine.fusion;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * Isotonic calibration (Zadrozny and Elkan 2002, "Transforming Classifier Scores into Accurate
 * Multiclass Probability Estimates", KDD): the non-decreasing function of the score closest to the
 * 0/1 outcomes in squared error, found by the pool-adjacent-violators algorithm (Barlow, Bartholomew,
 * Bremner and Brunk 1972, "Statistical Inference under Order Restrictions"). Unlike Platt's sigmoid
 * it assumes no shape beyond monotonicity, so it needs more data; it is kept for comparison.
 *
 * <p>Examples with equal scores are pooled before PAV, since one score must map to one probability.
 */
public final class IsotonicCalibration {
  private IsotonicCalibration() {}

  /**
   * Fits the calibrator; see {@link IsotonicCalibrator} for how scores between blocks are mapped.
   *
   * @throws IllegalArgumentException for no examples, unequal lengths or non-finite scores
   */
  public static IsotonicCalibrator fit(double[] scores, boolean[] labels) {
    Checks.scoresAndLabels(scores, labels);
    Integer[] order = new Integer[scores.length];
    for (int i = 0; i < order.length; i++) {
      order[i] = i;
    }
    Arrays.sort(order, Comparator.comparingDouble(i -> scores[i]));
    // Distinct scores in increasing order, each with its rate of right answers and its count.
    List<double[]> tied = new ArrayList<>();
    for (int i : order) {
      double[] lastTie = tied.isEmpty() ? null : tied.get(tied.size() - 1);
      if (lastTie != null && lastTie[0] == scores[i]) {
        lastTie[1] += labels[i] ? 1 : 0;
        lastTie[2] += 1;
      } else {
        tied.add(new double[] {scores[i], labels[i] ? 1 : 0, 1});
      }
    }
    int m = tied.size();
    double[] x = new double[m];
    double[] y = new double[m];
    double[] w = new double[m];
    for (int k = 0; k < m; k++) {
      x[k] = tied.get(k)[0];
      w[k] = tied.get(k)[2];
      y[k] = tied.get(k)[1] / w[k];
    }
    double[] fitted = poolAdjacentViolators(y, w);
    List<Double> thresholds = new ArrayList<>();
    List<Double> values = new ArrayList<>();
    for (int start = 0; start < m; ) {
      int end = start;
      while (end + 1 < m && fitted[end + 1] == fitted[start]) {
        end++;
      }
      // The ends of a block of equal fitted values; its inner points add nothing to the map.
      thresholds.add(x[start]);
      values.add(clip(fitted[start]));
      if (end > start) {
        thresholds.add(x[end]);
        values.add(clip(fitted[start]));
      }
      start = end + 1;
    }
    return new IsotonicCalibrator(
        thresholds.stream().mapToDouble(Double::doubleValue).toArray(),
        values.stream().mapToDouble(Double::doubleValue).toArray());
  }

  /**
   * Weighted least-squares non-decreasing fit to {@code y} in the given order: keep a stack of
   * blocks, and whenever the newest block's mean falls below the one before it, merge the two into
   * their weighted mean, until the stack is non-decreasing again. Returns one fitted value per input.
   */
  static double[] poolAdjacentViolators(double[] y, double[] w) {
    Checks.finite(y, "value");
    Checks.finite(w, "weight");
    if (y.length != w.length) {
      throw new IllegalArgumentException(y.length + " values but " + w.length + " weights");
    }
    for (int i = 0; i < w.length; i++) {
      if (!(w[i] > 0)) {
        throw new IllegalArgumentException("weight " + i + " must be positive; got " + w[i]);
      }
    }
    int n = y.length;
    double[] mean = new double[n];
    double[] weight = new double[n];
    int[] size = new int[n];
    int blocks = 0;
    for (int i = 0; i < n; i++) {
      mean[blocks] = y[i];
      weight[blocks] = w[i];
      size[blocks] = 1;
      blocks++;
      while (blocks > 1 && mean[blocks - 2] > mean[blocks - 1]) {
        int a = blocks - 2;
        int b = blocks - 1;
        double total = weight[a] + weight[b];
        mean[a] = (weight[a] * mean[a] + weight[b] * mean[b]) / total;
        weight[a] = total;
        size[a] += size[b];
        blocks--;
      }
    }
    double[] fitted = new double[n];
    int i = 0;
    for (int block = 0; block < blocks; block++) {
      for (int k = 0; k < size[block]; k++) {
        fitted[i++] = mean[block];
      }
    }
    return fitted;
  }

  // Block means of 0/1 outcomes lie in [0, 1]; rounding in the weighted mean could step just outside.
  private static double clip(double p) {
    return Math.min(1.0, Math.max(0.0, p));
  }
}
