package org.precedent.engine.measure;

import java.util.Arrays;
import java.util.List;

/**
 * Whether confidence separates right answers from wrong ones, whatever its scale.
 *
 * <p>Calibration asks whether the numbers are honest; discrimination asks whether they are useful for
 * ranking. A threshold can only work if right answers tend to score above wrong ones.
 */
public final class Discrimination {
  private Discrimination() {}

  /**
   * Area under the ROC curve of confidence, with right answers as the positive class: the chance that
   * a randomly picked right answer scored higher than a randomly picked wrong one, a tie counting 1/2.
   *
   * <p>Computed as the Mann-Whitney U statistic divided by (right x wrong) (Hanley and McNeil 1982),
   * using mid-ranks for tied confidences, which is what gives a tie half a win.
   *
   * @return the area in [0, 1], or NaN when every answer is right or every answer is wrong: with one
   *     class missing there is no pair to compare, so the area is undefined rather than 0 or 1
   */
  public static double auroc(List<JudgedAnswer> answers) {
    List<JudgedAnswer> all = Inputs.nonEmpty(answers, "AUROC");
    JudgedAnswer[] sorted = all.toArray(new JudgedAnswer[0]);
    Arrays.sort(sorted, (a, b) -> Double.compare(a.confidence(), b.confidence()));
    int n = sorted.length;
    long right = 0;
    double rankSumOfRight = 0.0;
    int start = 0;
    while (start < n) {
      int end = start;
      while (end + 1 < n && sorted[end + 1].confidence() == sorted[start].confidence()) {
        end++;
      }
      // Ranks start..end (0-based) become 1-based start+1..end+1; each tied item gets their mean.
      double midRank = (start + end) / 2.0 + 1.0;
      for (int i = start; i <= end; i++) {
        if (sorted[i].correct()) {
          right++;
          rankSumOfRight += midRank;
        }
      }
      start = end + 1;
    }
    long wrong = n - right;
    if (right == 0 || wrong == 0) {
      return Double.NaN;
    }
    double u = rankSumOfRight - right * (right + 1) / 2.0;
    return u / ((double) right * wrong);
  }
}
