package org.precedent.engine.measure;

import java.util.ArrayList;
import java.util.List;

/**
 * Whether a confidence of 0.8 really means "right 8 times out of 10".
 *
 * <p>Managers set the reply threshold on the confidence scale, so a confidence that over- or
 * under-states the chance of being right moves the real error rate away from the one they chose.
 */
public final class Calibration {
  /** Bin count for the expected calibration error, as used by Guo et al. (2017). */
  public static final int DEFAULT_BINS = 15;

  private Calibration() {}

  /**
   * Brier score for a binary outcome: the mean of (confidence - outcome)^2, where outcome is 1 for a
   * right answer and 0 for a wrong one. Lower is better; 0.25 is what a constant 0.5 earns.
   *
   * <p>Brier (1950) sums the squared error over both outcomes, which for two outcomes is exactly twice
   * this value. The one-outcome form is kept because it stays on the same [0, 1] scale as confidence.
   */
  public static double brierScore(List<JudgedAnswer> answers) {
    List<JudgedAnswer> all = Inputs.nonEmpty(answers, "Brier score");
    double sum = 0.0;
    for (JudgedAnswer a : all) {
      double diff = a.confidence() - (a.correct() ? 1.0 : 0.0);
      sum += diff * diff;
    }
    return sum / all.size();
  }

  /** Expected calibration error with {@value #DEFAULT_BINS} equal-width bins. */
  public static double expectedCalibrationError(List<JudgedAnswer> answers) {
    return expectedCalibrationError(answers, DEFAULT_BINS);
  }

  /**
   * Expected calibration error (Guo et al. 2017): sum over bins of (bin count / total) times
   * |accuracy - mean confidence|, with equal-width bins ((m-1)/M, m/M].
   */
  public static double expectedCalibrationError(List<JudgedAnswer> answers, int bins) {
    List<ReliabilityBin> diagram = reliabilityDiagram(answers, bins);
    long total = 0;
    double weighted = 0.0;
    for (ReliabilityBin bin : diagram) {
      total += bin.count();
      weighted += bin.count() * bin.gap();
    }
    return weighted / total;
  }

  /**
   * The bins of a reliability diagram, lowest first, empty bins included so that a plot shows where
   * the system never ventures.
   */
  public static List<ReliabilityBin> reliabilityDiagram(List<JudgedAnswer> answers, int bins) {
    if (bins < 1) {
      throw new IllegalArgumentException("a reliability diagram needs at least one bin; got " + bins);
    }
    List<JudgedAnswer> all = Inputs.nonEmpty(answers, "reliability diagram");
    int[] count = new int[bins];
    int[] right = new int[bins];
    double[] confidenceSum = new double[bins];
    for (JudgedAnswer a : all) {
      int m = binOf(a.confidence(), bins);
      count[m]++;
      confidenceSum[m] += a.confidence();
      if (a.correct()) {
        right[m]++;
      }
    }
    List<ReliabilityBin> out = new ArrayList<>(bins);
    for (int m = 0; m < bins; m++) {
      double lower = (double) m / bins;
      double upper = (double) (m + 1) / bins;
      if (count[m] == 0) {
        out.add(new ReliabilityBin(lower, upper, 0, Double.NaN, Double.NaN));
      } else {
        // Clamp guards against a sum of confidences rounding a hair past 1.
        double meanConfidence = Math.min(1.0, confidenceSum[m] / count[m]);
        out.add(new ReliabilityBin(lower, upper, count[m], meanConfidence, (double) right[m] / count[m]));
      }
    }
    return List.copyOf(out);
  }

  /**
   * Index of the bin ((m)/M, (m+1)/M] holding {@code c}. The product c*M can round across an edge, so
   * the first guess is corrected against the very edge values the diagram reports.
   */
  static int binOf(double c, int bins) {
    int m = (int) Math.ceil(c * bins) - 1;
    m = Math.max(0, Math.min(bins - 1, m));
    while (m > 0 && c <= (double) m / bins) {
      m--;
    }
    while (m < bins - 1 && c > (double) (m + 1) / bins) {
      m++;
    }
    return m;
  }
}
