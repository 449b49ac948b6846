package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class CalibrationTest {
  private static final double EPS = 1e-12;

  private static JudgedAnswer a(double confidence, boolean correct) {
    return new JudgedAnswer(confidence, correct);
  }

  @Test
  void brierScoreIsTheMeanSquaredGapToTheOutcome() {
    // Brier (1950), binary form: mean of (f - o)^2. Hand-computed:
    // (0.9-1)^2 + (0.6-0)^2 + (0.2-0)^2 + (0.7-1)^2 = 0.01 + 0.36 + 0.04 + 0.09 = 0.50; / 4 = 0.125.
    List<JudgedAnswer> answers = List.of(a(0.9, true), a(0.6, false), a(0.2, false), a(0.7, true));
    assertEquals(0.125, Calibration.brierScore(answers), EPS);
  }

  @Test
  void brierScoreIsHalfOfBriersOriginalTwoOutcomeSum() {
    // Brier (1950) defines P = (1/n) sum_j sum_i (f_ij - E_ij)^2 over all outcome classes i. With the
    // classes "right" (forecast f) and "wrong" (forecast 1 - f), computed here straight from that formula.
    List<JudgedAnswer> answers = List.of(a(0.3, true), a(0.85, true), a(0.55, false), a(0.05, false), a(1.0, true));
    double original = 0.0;
    for (JudgedAnswer s : answers) {
      double eRight = s.correct() ? 1 : 0;
      double eWrong = 1 - eRight;
      original += Math.pow(s.confidence() - eRight, 2) + Math.pow((1 - s.confidence()) - eWrong, 2);
    }
    original /= answers.size();
    assertEquals(original / 2, Calibration.brierScore(answers), EPS);
  }

  @Test
  void brierScoreOfAConstantHalfIsAQuarter() {
    // Reference value of the uninformative forecast 0.5: (0.5)^2 whatever the outcome (follows from
    // the definition; common practice as a baseline, no single source).
    assertEquals(0.25, Calibration.brierScore(List.of(a(0.5, true), a(0.5, false), a(0.5, false))), EPS);
  }

  @Test
  void expectedCalibrationErrorMatchesAHandComputedSet() {
    // Guo et al. (2017), "On Calibration of Modern Neural Networks", eq. (3): ECE = sum_m |B_m|/n *
    // |acc(B_m) - conf(B_m)| with 15 bins I_m = ((m-1)/15, m/15]. Hand-computed, n = 5:
    //   bin (14/15, 1]:     0.95 right, 0.95 wrong -> conf 0.95, acc 0.5 -> 2 * 0.45 = 0.90
    //   bin (7/15, 8/15]:   0.50 right, 0.52 right -> conf 0.51, acc 1.0 -> 2 * 0.49 = 0.98
    //   bin (1/15, 2/15]:   0.10 wrong             -> conf 0.10, acc 0.0 -> 1 * 0.10 = 0.10
    // ECE = (0.90 + 0.98 + 0.10) / 5 = 0.396.
    List<JudgedAnswer> answers =
        List.of(a(0.95, true), a(0.95, false), a(0.50, true), a(0.52, true), a(0.10, false));
    assertEquals(0.396, Calibration.expectedCalibrationError(answers), 1e-12);
  }

  @Test
  void expectedCalibrationErrorWithOneBinIsTheGapBetweenMeanConfidenceAndAccuracy() {
    // Guo et al. (2017) eq. (3) with M = 1: |accuracy - mean confidence|. Hand-computed:
    // mean confidence (0.9 + 0.8 + 0.4) / 3 = 0.7, accuracy 1/3, gap 0.3666...
    List<JudgedAnswer> answers = List.of(a(0.9, true), a(0.8, false), a(0.4, false));
    assertEquals(0.7 - 1.0 / 3.0, Calibration.expectedCalibrationError(answers, 1), EPS);
  }

  @Test
  void perfectlyCalibratedAnswersHaveNoCalibrationError() {
    // Definition of calibration, Guo et al. (2017) section 2: P(right | confidence = p) = p.
    // Ten answers at 0.7 of which seven are right, and five at 0.2 of which one is right.
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 10; i++) {
      answers.add(a(0.7, i < 7));
    }
    for (int i = 0; i < 5; i++) {
      answers.add(a(0.2, i < 1));
    }
    assertEquals(0.0, Calibration.expectedCalibrationError(answers), 1e-12);
  }

  @Test
  void reliabilityDiagramUsesRightClosedBinsAndKeepsEmptyOnes() {
    // Bins ((m-1)/M, m/M] as in Guo et al. (2017) section 3: an edge value belongs to the lower bin;
    // 0 has no lower bin and goes to the first. Hand-checked with M = 15.
    List<JudgedAnswer> answers =
        List.of(a(0.0, false), a(2.0 / 15, true), a(2.0 / 15 + 1e-9, false), a(1.0, true));
    List<ReliabilityBin> bins = Calibration.reliabilityDiagram(answers, 15);
    assertEquals(15, bins.size());
    assertEquals(1, bins.get(0).count());
    assertEquals(1, bins.get(1).count());
    assertEquals(1.0, bins.get(1).accuracy(), EPS);
    assertEquals(1, bins.get(2).count());
    assertEquals(0.0, bins.get(2).accuracy(), EPS);
    assertEquals(1, bins.get(14).count());
    assertEquals(14.0 / 15, bins.get(14).lower(), EPS);
    assertEquals(1.0, bins.get(14).upper(), EPS);
    assertEquals(0, bins.get(7).count());
    assertTrue(Double.isNaN(bins.get(7).meanConfidence()));
    assertTrue(Double.isNaN(bins.get(7).accuracy()));
  }

  @Test
  void everyEdgeValueLandsInTheBinItClosesForAllBinCounts() {
    // Property of the right-closed bins of Guo et al. (2017): m/M lies in bin m (1-based), i.e.
    // index m-1, whatever rounding c*M suffers.
    for (int bins = 1; bins <= 40; bins++) {
      for (int m = 1; m <= bins; m++) {
        assertEquals(m - 1, Calibration.binOf((double) m / bins, bins), "edge " + m + "/" + bins);
      }
    }
  }

  @Test
  void rejectsEmptyInputAndNonPositiveBinCount() {
    assertThrows(IllegalArgumentException.class, () -> Calibration.brierScore(List.of()));
    assertThrows(IllegalArgumentException.class, () -> Calibration.expectedCalibrationError(List.of()));
    assertThrows(IllegalArgumentException.class,
        () -> Calibration.reliabilityDiagram(List.of(a(0.5, true)), 0));
  }
}
