package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.precedent.engine.measure.Calibration;
import org.precedent.engine.measure.Discrimination;
import org.precedent.engine.measure.ScoredAnswer;
import org.precedent.engine.measure.SelectivePrediction;
import org.precedent.engine.measure.ThresholdRecommendation;
import org.precedent.engine.measure.ThresholdRow;

class EvaluationReportsTest {
  private static final double EPS = 1e-12;

  @Test
  void reportNumbersMatchHandCountsAndTheMeasuresLibrary() {
    EvaluationReport report = Fixtures.report("hand set", Fixtures.sixTickets("A"));
    Measures m = report.systems().get(0).measures();
    assertEquals(6, report.tickets());
    assertEquals(5, report.inScopeTickets());
    // By hand, in-scope ranks are 1, 2, 1, absent, 5 (out-of-scope t5 has nothing to rank).
    // Top-1 = 2/5; MRR = (1 + 1/2 + 1 + 0 + 1/5) / 5 (TREC-8 QA reading: absent counts 0,
    // Voorhees 1999); recall@5 = recall@20 = 4/5.
    assertEquals(0.4, m.top1(), EPS);
    assertEquals(0.4, m.recallAt1(), EPS);
    assertEquals(2.7 / 5, m.meanReciprocalRank(), EPS);
    assertEquals(0.8, m.recallAt5(), EPS);
    assertEquals(0.8, m.recallAt20(), EPS);
    // Replies right for t1 and t3 only; t5 (out of scope) counts as a wrong reply.
    // Brier (1950), one-outcome form: (0.1^2 + 0.8^2 + 0.3^2 + 0.4^2 + 0.6^2 + 0.2^2) / 6 = 1.30 / 6.
    assertEquals(1.30 / 6, m.brierScore(), 1e-12);
    // ECE (Guo et al. 2017) with 15 bins: every confidence sits alone in its bin, so ECE is the
    // mean |right - confidence| = (0.1 + 0.8 + 0.3 + 0.4 + 0.6 + 0.2) / 6 = 0.4.
    assertEquals(0.4, m.expectedCalibrationError(), 1e-12);
    // AUROC as the Mann-Whitney pair share (Hanley and McNeil 1982): right {0.9, 0.7} against
    // wrong {0.8, 0.6, 0.4, 0.2}: 0.9 wins 4 pairs, 0.7 wins 3, so 7/8.
    assertEquals(7.0 / 8, m.auroc(), EPS);
    // AURC (Geifman, Uziel and El-Yaniv 2019): mean prefix risk, order R W R W W W:
    // (0 + 1/2 + 1/3 + 2/4 + 3/5 + 4/6) / 6.
    assertEquals((0 + 0.5 + 1.0 / 3 + 0.5 + 0.6 + 4.0 / 6) / 6, m.aurc(), 1e-12);
    // Only the single most confident reply reaches 90% precision: coverage 1/6.
    assertEquals(1.0 / 6, m.coverageAt90(), EPS);

    // And the same numbers as the measures library computes on the same answers.
    List<ScoredAnswer> scored = Fixtures.sixTickets("A").tickets().stream().map(EvaluatedTicket::scored).toList();
    assertEquals(Calibration.brierScore(scored), m.brierScore(), 0.0);
    assertEquals(Discrimination.auroc(scored), m.auroc(), 0.0);
    assertEquals(SelectivePrediction.aurc(scored), m.aurc(), 0.0);
    assertEquals(SelectivePrediction.riskCoverageCurve(scored), report.systems().get(0).riskCoverage());
    assertEquals(Calibration.reliabilityDiagram(scored, 15), report.systems().get(0).reliability());
  }

  @Test
  void thresholdTableRunsFromZeroToOneInHundredthsWithWilsonInterval() {
    List<ThresholdRow> rows = Fixtures.report("hand set", Fixtures.sixTickets("A")).systems().get(0).thresholds();
    assertEquals(101, rows.size());
    assertEquals(0.0, rows.get(0).threshold(), 0.0);
    assertEquals(1.0, rows.get(100).threshold(), 0.0);
    // At 0.50, by hand: t1, t2, t3, t5 answered (4 of 6), 2 right; 2 wrong per 6 tickets = 333.3 per 1,000.
    ThresholdRow half = rows.get(50);
    assertEquals(0.5, half.threshold(), 0.0);
    assertEquals(4, half.answered());
    assertEquals(0.5, half.precision(), EPS);
    assertEquals(1000.0 / 3, half.wrongPerThousand(), 1e-9);
    // Wilson (1927) score interval for 2 of 4 at z = 1.96, worked by hand from the formula:
    // (0.5 + z^2/8 -+ z sqrt(1/16 + z^2/64)) / (1 + z^2/4) = (0.1500, 0.8500).
    assertEquals(0.1500, half.precisionLower(), 1e-4);
    assertEquals(0.8500, half.precisionUpper(), 1e-4);
  }

  @Test
  void categoryTableUsesMeasuredThresholdWhenTooFewTicketsForAGuarantee() {
    SystemReport a = Fixtures.report("hand set", Fixtures.sixTickets("A")).systems().get(0);
    // 6 tickets cannot certify 95%: even all right, 0.95^m <= 0.05/3 needs m >= 80 (Clopper-Pearson
    // bound for m successes in m trials is alpha^(1/m); Clopper and Pearson 1934).
    assertEquals(ThresholdRecommendation.Status.TOO_FEW, a.recommendation().status());
    assertEquals(80, a.recommendation().minimalSampleNeeded());
    // Measured precision reaches 95% only at threshold 0.9 (t1 alone).
    assertEquals(CategoryTable.Basis.MEASURED, a.categories().basis());
    assertEquals(0.9, a.categories().threshold(), 0.0);
    CategoryRow billing = a.categories().rows().get(0);
    CategoryRow login = a.categories().rows().get(1);
    assertEquals("billing", billing.category());
    // billing: t1, t2, t6 all in scope, top-1 1/3; at 0.9 only t1 answered, right.
    assertEquals(3, billing.tickets());
    assertEquals(1.0 / 3, billing.top1(), EPS);
    assertEquals(1, billing.answered());
    assertEquals(1.0, billing.precision(), EPS);
    // login: t3, t4 in scope (top-1 1/2), t5 out of scope; nothing reaches 0.9.
    assertEquals(2, login.inScope());
    assertEquals(0.5, login.top1(), EPS);
    assertEquals(0, login.answered());
    assertTrue(Double.isNaN(login.precision()));
  }

  @Test
  void categoryTableUsesTheGivenThresholdWhenOneIsNamed() {
    EvaluationReport report = EvaluationReports.build("hand set", List.of(Fixtures.sixTickets("A")), 0.95,
        OptionalDouble.of(0.5), Fixtures.CREATED);
    CategoryTable table = report.systems().get(0).categories();
    assertEquals(CategoryTable.Basis.GIVEN, table.basis());
    // At 0.5 by hand: billing answers t1 (right), t2 (wrong); login answers t3 (right), t5 (wrong).
    for (CategoryRow row : table.rows()) {
      assertEquals(2.0 / 3, row.coverage(), EPS);
      assertEquals(0.5, row.precision(), EPS);
    }
  }

  @Test
  void categoryTableUsesTheGuaranteedThresholdWhenOneIsCertified() {
    SystemReport s = Fixtures.report("separable", Fixtures.separable("S", "all")).systems().get(0);
    ThresholdRecommendation r = s.recommendation();
    assertEquals(ThresholdRecommendation.Status.OK, r.status());
    assertEquals(CategoryTable.Basis.RECOMMENDED, s.categories().basis());
    assertEquals(r.threshold(), s.categories().threshold(), 0.0);
    // One category holding every ticket must repeat the overall coverage and precision.
    assertEquals(r.coverage(), s.categories().rows().get(0).coverage(), EPS);
    assertEquals(r.empiricalPrecision(), s.categories().rows().get(0).precision(), EPS);
  }

  @Test
  void refusesSystemsEvaluatedOnDifferentTickets() {
    SystemRun other = new SystemRun("B", List.of(new EvaluatedTicket("x", "billing", true, 1, 0.5)));
    assertThrows(IllegalArgumentException.class, () -> Fixtures.report("d", Fixtures.sixTickets("A"), other));
    assertThrows(IllegalArgumentException.class,
        () -> Fixtures.report("d", Fixtures.sixTickets("A"), Fixtures.sixTickets("A")));
  }

  @Test
  void refusesARankedOutOfScopeTicketAndADuplicateTicket() {
    assertThrows(IllegalArgumentException.class, () -> new EvaluatedTicket("t", "c", false, 1, 0.5));
    EvaluatedTicket t = new EvaluatedTicket("t", "c", true, 1, 0.5);
    assertThrows(IllegalArgumentException.class, () -> new SystemRun("A", List.of(t, t)));
  }
}
