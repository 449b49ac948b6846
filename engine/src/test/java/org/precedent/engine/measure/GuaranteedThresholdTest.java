package org.precedent.engine.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

class GuaranteedThresholdTest {

  private static void add(List<JudgedAnswer> to, int count, double confidence, int right) {
    for (int i = 0; i < count; i++) {
      to.add(new JudgedAnswer(confidence, i < right));
    }
  }

  @Test
  void certifiesTheAllRightGroupAndNothingBelowIt() {
    // By construction: 500 right answers at 0.9, 500 wrong at 0.5. Any threshold at 0.5 accepts
    // precision 0.5; at 0.9 it accepts exactly the 500 right ones. n = 1000, so SGR (Geifman and
    // El-Yaniv 2017, Algorithm 1) runs ceil(log2 1000) = 10 steps at delta/10 = 0.005, and the
    // Clopper-Pearson bound for 500/500 is 0.005^(1/500) (Clopper and Pearson 1934, x = n case).
    List<JudgedAnswer> answers = new ArrayList<>();
    add(answers, 500, 0.9, 500);
    add(answers, 500, 0.5, 0);
    Collections.shuffle(answers, new Random(1));
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(0.9, r.threshold());
    assertEquals(0.5, r.coverage(), 1e-12);
    assertEquals(1.0, r.empiricalPrecision(), 1e-12);
    assertEquals(0.005, r.correctedDelta(), 1e-15);
    assertEquals(Math.pow(0.005, 1.0 / 500), r.precisionLowerBound(), 1e-12);
    assertEquals(1000, r.sampleSize());
    assertTrue(r.thresholdsTried() >= 1 && r.thresholdsTried() <= 10);
    assertTrue(r.repliesAutomatically());
  }

  @Test
  void certifiesAGroupWithAFewErrorsWhenItsBoundClearsTheTarget() {
    // By construction: 300 at 0.9 with 297 right (99%), 300 at 0.6 with 240 right, 400 wrong at 0.2.
    // Accepting down to 0.6 gives 537/600 = 0.895 < 0.95, so no bound there can reach 0.95; the answer
    // is 0.9 if 297/300 certifies. The bound is checked against the binomial tail summed directly:
    // P(X >= 297; 300, L) = 0.005 (Clopper and Pearson 1934).
    List<JudgedAnswer> answers = new ArrayList<>();
    add(answers, 300, 0.9, 297);
    add(answers, 300, 0.6, 240);
    add(answers, 400, 0.2, 0);
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers, 0.95, 0.05);
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(0.9, r.threshold());
    assertEquals(0.3, r.coverage(), 1e-12);
    assertEquals(0.99, r.empiricalPrecision(), 1e-12);
    assertEquals(0.005, BinomialTail.atLeast(297, 300, r.precisionLowerBound()), 1e-10);
    assertTrue(r.precisionLowerBound() >= 0.95);
  }

  @Test
  void findsTheLargestGridCoverageBelowTheExactBoundaryOnAPerfectlySortedSet() {
    // By construction: 1000 distinct confidences, top 700 right, bottom 300 wrong. Accepting 700 + j
    // certifies 95% exactly when P(X >= 700; 700 + j, 0.95) <= 0.005 (the lower bound is >= 0.95 iff
    // the tail at 0.95 is at most alpha, Clopper and Pearson 1934). The largest such j is found here by
    // direct binomial summation; the grid tries the top 100, 200, ..., 1000 answers (K = 10), so it
    // lands on the largest multiple of 100 at or below 700 + j.
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 1000; i++) {
      answers.add(new JudgedAnswer(1.0 - i / 1000.0, i < 700));
    }
    int j = 0;
    while (BinomialTail.atLeast(700, 700 + j + 1, 0.95) <= 0.005) {
      j++;
    }
    assertTrue(j > 0 && j < 100, "the boundary should lie among the first wrong answers");
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(0.7, r.coverage(), 1e-12);
    assertEquals(1.0 - 699 / 1000.0, r.threshold(), 1e-12);
    assertEquals(1.0, r.empiricalPrecision(), 1e-12);
    assertEquals(10, r.thresholdsTried());
  }

  @Test
  void certifiesALargeCoverageWhenTheMostConfidentAnswersHoldAFewWrongOnes() {
    // By construction: 600 answers; the 12 most confident are wrong (a model sure and mistaken), the
    // next 468 right, the last 120 wrong. Precision is not monotone in coverage: the top half, 288
    // right of 300, does not certify 95% at delta / 10 = 0.005 (its binomial tail at 0.95 exceeds
    // 0.005; Clopper and Pearson 1934), so a binary search that starts there (SGR, Geifman and
    // El-Yaniv 2017) would only look at higher thresholds and fail. The top 480 (468 right) do
    // certify, and the grid tries them (k = 8 of K = 10): a union bound over thresholds fixed
    // before the labels holds for any curve (Angelopoulos et al. 2021, Learn then Test).
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 600; i++) {
      answers.add(new JudgedAnswer(1.0 - i / 1000.0, i >= 12 && i < 480));
    }
    assertTrue(BinomialTail.atLeast(288, 300, 0.95) > 0.005, "the top half must not certify");
    assertTrue(BinomialTail.atLeast(468, 480, 0.95) <= 0.005, "the top 480 must certify");
    assertTrue(BinomialTail.atLeast(468, 540, 0.95) > 0.005, "the top 540 must not certify");
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(0.8, r.coverage(), 1e-12);
    assertEquals(468.0 / 480, r.empiricalPrecision(), 1e-12);
  }

  @Test
  void namesTheCertifiedThresholdByTheShortestDecimalThatRepliesToTheSameAnswers() {
    // By construction: 200 right at 0.99604178, 100 wrong at 0.5. Certifying needs the 200 alone
    // (the Clopper-Pearson bound of 200/200 at 0.05/9 is 0.00556^(1/200) = 0.974). Any threshold in
    // (0.5, 0.99604178] accepts exactly those 200; the shortest decimal there within 0.001 of the
    // certified confidence is 0.996.
    List<JudgedAnswer> answers = new ArrayList<>();
    add(answers, 200, 0.99604178, 200);
    add(answers, 100, 0.5, 0);
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(0.996, r.threshold());
    assertEquals(200.0 / 300, r.coverage(), 1e-12);
    assertTrue(r.explanation().contains("confidence >= 0.996:"), r.explanation());
  }

  @Test
  void saysTooFewWhenEvenAnAllRightSampleCannotCertify() {
    // 20 answers, all right. ceil(log2 20) = 5, corrected delta 0.01. The all-right bound
    // 0.01^(1/m) (Clopper and Pearson 1934) first reaches 0.95 at m = 90 (ln 0.01 / ln 0.95 = 89.78).
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 20; i++) {
      answers.add(new JudgedAnswer(0.5 + i / 100.0, true));
    }
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.TOO_FEW, r.status());
    assertEquals(90, r.minimalSampleNeeded());
    assertTrue(Math.pow(0.01, 1.0 / 90) >= 0.95 && Math.pow(0.01, 1.0 / 89) < 0.95);
    assertEquals(Double.POSITIVE_INFINITY, r.threshold());
    assertEquals(0.0, r.coverage());
    assertFalse(r.repliesAutomatically());
    assertTrue(r.explanation().contains("at least 90 right answers"), r.explanation());
  }

  @Test
  void saysNotCertifiedWhenTheConfidentAnswersAreTooOftenWrong() {
    // By construction every prefix has precision <= 0.5 (alternating right and wrong from the top),
    // with n = 400 above the 104 needed at delta 0.05/9, so the reason is errors, not sample size.
    List<JudgedAnswer> answers = new ArrayList<>();
    for (int i = 0; i < 400; i++) {
      answers.add(new JudgedAnswer(1.0 - i / 400.0, i % 2 == 1));
    }
    ThresholdRecommendation r = GuaranteedThreshold.recommend(answers);
    assertEquals(ThresholdRecommendation.Status.NOT_CERTIFIED, r.status());
    assertTrue(r.sampleSize() >= r.minimalSampleNeeded());
    assertTrue(Double.isNaN(r.precisionLowerBound()));
  }

  @Test
  void neverTriesMoreThanCeilLog2NThresholds() {
    // As SGR's binary search (Geifman and El-Yaniv 2017), ceil(log2 n) thresholds; delta is split over them.
    Random random = new Random(3);
    for (int n : new int[] {1, 2, 3, 5, 8, 9, 100, 1023, 1024, 1025}) {
      List<JudgedAnswer> answers = new ArrayList<>();
      for (int i = 0; i < n; i++) {
        double confidence = random.nextDouble();
        answers.add(new JudgedAnswer(confidence, random.nextDouble() < confidence));
      }
      int expectedSteps = Math.max(1, (int) Math.ceil(Math.log(n) / Math.log(2) - 1e-12));
      ThresholdRecommendation r = GuaranteedThreshold.recommend(answers, 0.6, 0.1);
      assertTrue(r.thresholdsTried() <= expectedSteps, "n=" + n);
      assertEquals(0.1 / expectedSteps, r.correctedDelta(), 1e-15, "n=" + n);
    }
  }

  @Test
  void defaultsAreNinetyFivePercentPrecisionAtDeltaFivePercent() {
    List<JudgedAnswer> answers = new ArrayList<>();
    add(answers, 200, 0.95, 199);
    add(answers, 100, 0.4, 50);
    assertEquals(GuaranteedThreshold.recommend(answers, 0.95, 0.05), GuaranteedThreshold.recommend(answers));
  }

  @Test
  void rejectsEmptyInputAndParametersOutsideTheOpenUnitInterval() {
    List<JudgedAnswer> one = List.of(new JudgedAnswer(0.5, true));
    IllegalArgumentException e =
        assertThrows(IllegalArgumentException.class, () -> GuaranteedThreshold.recommend(List.of()));
    assertTrue(e.getMessage().contains("empty"));
    assertThrows(IllegalArgumentException.class, () -> GuaranteedThreshold.recommend(one, 1.0, 0.05));
    assertThrows(IllegalArgumentException.class, () -> GuaranteedThreshold.recommend(one, 0.95, 0.0));
    assertThrows(IllegalArgumentException.class, () -> GuaranteedThreshold.recommend(one, Double.NaN, 0.05));
  }
}
