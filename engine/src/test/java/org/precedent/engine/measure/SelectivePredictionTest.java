package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class SelectivePredictionTest {
  private static final double EPS = 1e-12;

  private static JudgedAnswer a(double confidence, boolean correct) {
    return new JudgedAnswer(confidence, correct);
  }

  /** Confidences 0.9 .. 0.5, outcomes right, wrong, right, right, wrong; given out of order. */
  private static List<JudgedAnswer> fiveAnswers() {
    return List.of(a(0.6, true), a(0.9, true), a(0.5, false), a(0.8, false), a(0.7, true));
  }

  @Test
  void aurcIsTheMeanRiskOverThePrefixSets() {
    // Geifman, Uziel and El-Yaniv (2019), discrete AURC = (1/n) sum_{i=1..n} risk(top i).
    // Hand-computed: prefix risks 0, 1/2, 1/3, 1/4, 2/5; sum = 89/60; AURC = 89/300.
    assertEquals(89.0 / 300.0, SelectivePrediction.aurc(fiveAnswers()), EPS);
  }

  @Test
  void aurcAveragesOverTheOrdersOfTiedAnswers() {
    // Two tied answers at 0.9 (one right, one wrong), then a wrong one at 0.5. Plain formula for each
    // order, by hand: right-first 0, 1/2, 2/3 -> 7/18; wrong-first 1, 1/2, 2/3 -> 13/18. Mean = 5/9.
    List<JudgedAnswer> rightFirst = List.of(a(0.9, true), a(0.9, false), a(0.5, false));
    List<JudgedAnswer> wrongFirst = List.of(a(0.9, false), a(0.9, true), a(0.5, false));
    assertEquals(5.0 / 9.0, SelectivePrediction.aurc(rightFirst), EPS);
    assertEquals(5.0 / 9.0, SelectivePrediction.aurc(wrongFirst), EPS);
  }

  @Test
  void aurcOfAPerfectRankingApproachesTheOptimalAurcFormula() {
    // Geifman, Uziel and El-Yaniv (2019): for error rate r and a confidence ranking every right answer
    // above every wrong one, AURC* ~= r + (1 - r) ln(1 - r) (from memory). The discrete sum differs
    // from that integral by O(1/n); n = 10,000 and r = 0.2 give 0.021485...
    List<JudgedAnswer> answers = new ArrayList<>();
    int n = 10_000;
    for (int i = 0; i < n; i++) {
      answers.add(a(1.0 - (double) i / n, i < 8_000));
    }
    double r = 0.2;
    assertEquals(r + (1 - r) * Math.log(1 - r), SelectivePrediction.aurc(answers), 1e-3);
  }

  @Test
  void riskCoverageCurveHasOnePointPerDistinctConfidence() {
    // Hand-computed from fiveAnswers(): thresholds 0.9..0.5 accept 1..5 answers.
    List<RiskCoveragePoint> curve = SelectivePrediction.riskCoverageCurve(fiveAnswers());
    double[] thresholds = {0.9, 0.8, 0.7, 0.6, 0.5};
    double[] risks = {0.0, 1.0 / 2, 1.0 / 3, 1.0 / 4, 2.0 / 5};
    assertEquals(5, curve.size());
    for (int i = 0; i < 5; i++) {
      assertEquals(thresholds[i], curve.get(i).threshold(), EPS);
      assertEquals(i + 1, curve.get(i).accepted());
      assertEquals((i + 1) / 5.0, curve.get(i).coverage(), EPS);
      assertEquals(risks[i], curve.get(i).risk(), EPS);
    }
  }

  @Test
  void tiedConfidencesFormASinglePointOfTheCurve() {
    // A threshold cannot split answers of equal confidence (hand-checked).
    List<RiskCoveragePoint> curve = SelectivePrediction.riskCoverageCurve(
        List.of(a(0.9, false), a(0.9, true), a(0.5, false)));
    assertEquals(2, curve.size());
    assertEquals(2, curve.get(0).accepted());
    assertEquals(0.5, curve.get(0).risk(), EPS);
  }

  @Test
  void coverageAtTargetPrecisionOnAHandBuiltRanking() {
    // 100 answers, confidence (101 - i)/100 at position i: 1..20 right, 21 wrong, 22..50 right,
    // 51..60 wrong, 61..100 right. Precision of the top k, by hand: k <= 20 -> 1; k = 50 -> 49/50;
    // k = 51 -> 49/51 = 0.961; k = 52 -> 0.942; k = 54 -> 0.907; k = 55 -> 0.891; k = 100 -> 0.89.
    // So 99% -> coverage 0.20, 95% -> 0.51, 90% -> 0.54 (the "precision >= target" reading is the
    // project's, common practice without a single source).
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 1; i <= 100; i++) {
      boolean wrong = i == 21 || (i >= 51 && i <= 60);
      answers.add(a((101 - i) / 100.0, !wrong));
    }
    assertEquals(0.20, SelectivePrediction.coverageAtPrecision(answers, 0.99), EPS);
    assertEquals(0.51, SelectivePrediction.coverageAtPrecision(answers, 0.95), EPS);
    assertEquals(0.54, SelectivePrediction.coverageAtPrecision(answers, 0.90), EPS);
  }

  @Test
  void coverageIsZeroWhenEvenTheMostConfidentAnswerIsWrong() {
    List<JudgedAnswer> answers = List.of(a(0.99, false), a(0.5, true), a(0.4, true));
    assertEquals(0.0, SelectivePrediction.coverageAtPrecision(answers, 0.9), EPS);
  }

  @Test
  void rejectsEmptyInput() {
    assertThrows(IllegalArgumentException.class, () -> SelectivePrediction.aurc(List.of()));
    assertThrows(IllegalArgumentException.class, () -> SelectivePrediction.riskCoverageCurve(List.of()));
    assertThrows(IllegalArgumentException.class,
        () -> SelectivePrediction.coverageAtPrecision(List.of(), 0.9));
  }
}
