package org.precedent.engine.measure;

import java.util.ArrayList;
import java.util.List;

/**
 * The trade-off a reply threshold makes: raising it answers fewer tickets (coverage) with fewer
 * mistakes among them (risk). Managers pick the threshold from this curve.
 */
public final class SelectivePrediction {
  private SelectivePrediction() {}

  /**
   * The risk-coverage curve: one point per distinct confidence, from the highest (strictest
   * threshold, lowest coverage) down to the lowest (everything answered). Answers with equal
   * confidence are accepted or refused together, as a threshold cannot split them.
   */
  public static List<RiskCoveragePoint> riskCoverageCurve(List<JudgedAnswer> answers) {
    JudgedAnswer[] sorted = Inputs.byConfidenceDescending(Inputs.nonEmpty(answers, "risk-coverage curve"));
    int n = sorted.length;
    List<RiskCoveragePoint> curve = new ArrayList<>();
    int wrong = 0;
    int i = 0;
    while (i < n) {
      double threshold = sorted[i].confidence();
      while (i < n && sorted[i].confidence() == threshold) {
        if (!sorted[i].correct()) {
          wrong++;
        }
        i++;
      }
      curve.add(new RiskCoveragePoint(threshold, i, wrong, (double) i / n, (double) wrong / i));
    }
    return List.copyOf(curve);
  }

  /**
   * Area under the risk-coverage curve in the discrete form of Geifman, Uziel and El-Yaniv (2019):
   * with answers sorted by confidence, highest first, AURC = (1/n) * sum over i = 1..n of
   * risk(top i), where risk(top i) is the error rate among the first i answers. Lower is better.
   *
   * <p>With tied confidences "the first i" depends on an arbitrary order, so each risk(top i) is
   * replaced by its mean over all orders of the tied answers: inside a tie group the expected error
   * count grows linearly. Without ties this is exactly the plain formula; with ties the result no
   * longer depends on input order.
   */
  public static double aurc(List<JudgedAnswer> answers) {
    JudgedAnswer[] sorted = Inputs.byConfidenceDescending(Inputs.nonEmpty(answers, "AURC"));
    int n = sorted.length;
    double sumOfRisks = 0.0;
    int before = 0;
    int wrongBefore = 0;
    while (before < n) {
      int end = before;
      int groupWrong = 0;
      while (end < n && sorted[end].confidence() == sorted[before].confidence()) {
        if (!sorted[end].correct()) {
          groupWrong++;
        }
        end++;
      }
      int size = end - before;
      for (int taken = 1; taken <= size; taken++) {
        double expectedWrong = wrongBefore + (double) taken * groupWrong / size;
        sumOfRisks += expectedWrong / (before + taken);
      }
      wrongBefore += groupWrong;
      before = end;
    }
    return sumOfRisks / n;
  }

  /**
   * The largest coverage any threshold reaches while keeping precision (1 - risk) at or above
   * {@code targetPrecision}; 0 when no threshold does. This is the empirical value on the given data,
   * with no allowance for sampling error; see {@link GuaranteedThreshold} for one with a guarantee.
   */
  public static double coverageAtPrecision(List<JudgedAnswer> answers, double targetPrecision) {
    Inputs.closed01(targetPrecision, "target precision");
    double best = 0.0;
    for (RiskCoveragePoint p : riskCoverageCurve(answers)) {
      if (p.precision() >= targetPrecision) {
        best = Math.max(best, p.coverage());
      }
    }
    return best;
  }
}
