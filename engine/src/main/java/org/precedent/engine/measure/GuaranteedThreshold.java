package org.precedent.engine.measure;

import java.util.Arrays;
import java.util.List;

/**
 * Picks the reply threshold with the greatest coverage whose precision is guaranteed, with high
 * probability, to reach a target. The bound is SGR's (Selection with Guaranteed Risk; Geifman and
 * El-Yaniv 2017), stated here for precision = 1 - risk: the one-sided Clopper-Pearson lower bound
 * on the precision of the answers accepted, at delta split over the thresholds tried (Bonferroni).
 *
 * <p>Which thresholds are tried differs from SGR. SGR binary-searches the answers sorted by
 * confidence, which assumes precision falls as coverage grows: one failed probe sends it to higher
 * thresholds for good. A well-ranked model is often sure and wrong on a few answers at the very
 * top, and then SGR's first probe fails although a far larger coverage would certify. So the same
 * budget, K = ceil(log2 n) thresholds at delta / K each, is spent on a grid fixed before any label
 * is looked at: accept the k/K most confident answers, for k = 1..K, and keep the largest that
 * certifies. A union bound over a finite set of candidate thresholds chosen without the labels is
 * valid whatever the shape of the precision curve (Angelopoulos, Bates, Candes, Jordan and Lei
 * 2021, "Learn then Test", Bonferroni correction). The price is resolution: the certified coverage
 * is a multiple of 1/K of the answers (ties in confidence can only add to it).
 */
public final class GuaranteedThreshold {
  /** Default target precision for automatic replies. */
  public static final double DEFAULT_TARGET_PRECISION = 0.95;
  /** Default allowed probability that the guarantee fails. */
  public static final double DEFAULT_DELTA = 0.05;

  private GuaranteedThreshold() {}

  /** {@link #recommend(List, double, double)} with target 0.95 and delta 0.05. */
  public static ThresholdRecommendation recommend(List<JudgedAnswer> heldOut) {
    return recommend(heldOut, DEFAULT_TARGET_PRECISION, DEFAULT_DELTA);
  }

  /**
   * Recommends a threshold whose precision is at least {@code targetPrecision} with probability at
   * least 1 - {@code delta}, provided the held-out answers are a fair sample of future tickets.
   */
  public static ThresholdRecommendation recommend(
      List<JudgedAnswer> heldOut, double targetPrecision, double delta) {
    Inputs.open01(targetPrecision, "target precision");
    Inputs.open01(delta, "delta");
    List<JudgedAnswer> all = Inputs.nonEmpty(heldOut, "threshold recommendation");
    int n = all.size();
    double[] confidence = new double[n];
    boolean[] correct = new boolean[n];
    JudgedAnswer[] ascending = all.toArray(new JudgedAnswer[0]);
    Arrays.sort(ascending, (a, b) -> Double.compare(a.confidence(), b.confidence()));
    for (int i = 0; i < n; i++) {
      confidence[i] = ascending[i].confidence();
      correct[i] = ascending[i].correct();
    }
    // rightFrom[i] = right answers among positions i..n-1 (all answers at or above position i).
    int[] rightFrom = new int[n + 1];
    for (int i = n - 1; i >= 0; i--) {
      rightFrom[i] = rightFrom[i + 1] + (correct[i] ? 1 : 0);
    }

    int steps = searchSteps(n);
    double correctedDelta = delta / steps;
    int minimal = minimalSample(targetPrecision, correctedDelta);

    int bestStart = -1;
    double bestBound = Double.NaN;
    for (int k = 1; k <= steps; k++) {
      // The k/K most confident answers, and every answer as confident as the least of them.
      int wanted = (int) Math.ceil((double) n * k / steps);
      int start = firstWithSameConfidence(confidence, n - wanted);
      int accepted = n - start;
      double bound = Proportions.clopperPearsonLower(rightFrom[start], accepted, correctedDelta);
      if (bound >= targetPrecision && (bestStart < 0 || start < bestStart)) {
        bestStart = start;
        bestBound = bound;
      }
    }
    int tried = steps;

    if (bestStart >= 0) {
      int accepted = n - bestStart;
      return new ThresholdRecommendation(ThresholdRecommendation.Status.OK, named(confidence, bestStart),
          (double) accepted / n, (double) rightFrom[bestStart] / accepted, bestBound, n, tried,
          targetPrecision, correctedDelta, minimal);
    }
    ThresholdRecommendation.Status status = n < minimal
        ? ThresholdRecommendation.Status.TOO_FEW
        : ThresholdRecommendation.Status.NOT_CERTIFIED;
    return new ThresholdRecommendation(status, Double.POSITIVE_INFINITY, 0.0, Double.NaN, Double.NaN,
        n, tried, targetPrecision, correctedDelta, minimal);
  }

  /**
   * The certified threshold by its shortest name ({@link ThresholdDecimals#naming}): it replies to
   * the same held-out answers, so the bound computed for the probed confidence is the bound for it.
   */
  private static double named(double[] ascending, int start) {
    return ThresholdDecimals.naming(ascending[start],
        start > 0 ? ascending[start - 1] : Double.NEGATIVE_INFINITY);
  }

  /** ceil(log2 n), at least 1: the number of thresholds tried, and the Bonferroni divisor. */
  static int searchSteps(int n) {
    return n <= 2 ? 1 : 32 - Integer.numberOfLeadingZeros(n - 1);
  }

  /**
   * Smallest m with delta^(1/m) >= target: m all-right answers give a Clopper-Pearson lower bound of
   * exactly delta^(1/m), so fewer can never certify the target.
   */
  static int minimalSample(double target, double delta) {
    double estimate = Math.ceil(Math.log(delta) / Math.log(target));
    if (estimate >= Integer.MAX_VALUE) {
      throw new IllegalArgumentException("target precision " + target + " needs an impractically large sample");
    }
    int m = Math.max(1, (int) estimate);
    // The logarithms can round across an integer; settle on the exact boundary.
    while (Math.pow(delta, 1.0 / m) < target) {
      m++;
    }
    while (m > 1 && Math.pow(delta, 1.0 / (m - 1)) >= target) {
      m--;
    }
    return m;
  }

  private static int firstWithSameConfidence(double[] ascending, int index) {
    int i = index;
    while (i > 0 && ascending[i - 1] == ascending[index]) {
      i--;
    }
    return i;
  }
}
