package org.precedent.engine.evaluate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.precedent.engine.measure.Calibration;
import org.precedent.engine.measure.Discrimination;
import org.precedent.engine.measure.JudgedAnswer;
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
    List<JudgedAnswer> scored = Fixtures.sixTickets("A").tickets().stream().map(EvaluatedTicket::scored).toList();
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
  void serviceFiguresCountWhatTheSafetyGateHandsOffAsHandedOff() {
    // Invented tickets, worked by hand: (confidence, reply right, safety gate hands it off).
    //   a 0.95 right -     bins      d 0.85 right gated  safety
    //   b 0.90 right gated bins      e 0.60 wrong -      safety
    //   c 0.80 wrong -     bins      f 0.30 right -      safety
    SystemRun run = new SystemRun("A", List.of(
        new EvaluatedTicket("a", "bins", true, 1, 0.95, false),
        new EvaluatedTicket("b", "bins", true, 1, 0.90, true),
        new EvaluatedTicket("c", "bins", true, 2, 0.80, false),
        new EvaluatedTicket("d", "safety", true, 1, 0.85, true),
        new EvaluatedTicket("e", "safety", false, 0, 0.60, false),
        new EvaluatedTicket("f", "safety", true, 1, 0.30, false)));
    SystemReport s = EvaluationReports.build("gate", List.of(run), 0.95, OptionalDouble.of(0.75),
        Fixtures.CREATED).systems().get(0);
    assertEquals(2, s.safetyHandOffs());

    // At 0.75 confidence alone answers a, b, c, d (4 of 6, 3 right). In service b and d go to a
    // person: a and c are answered, 2 of 6 = 1/3, one right = 1/2, one wrong per 6 tickets
    // = 166.7 per 1,000; the gate handed off the 2 that confidence alone would have answered.
    ThresholdRow model = s.thresholds().get(75);
    assertEquals(4, model.answered());
    ServiceRow at75 = service(s, 0.75);
    assertEquals(2, at75.answered());
    assertEquals(1.0 / 3, at75.answeredShare(), EPS);
    assertEquals(0.5, at75.precision(), EPS);
    assertEquals(1000.0 / 6, at75.wrongPerThousand(), 1e-9);
    assertEquals(2, at75.safetyHandOffs());
    // At 0.50: a, c, e answered (3 of 6), only a right: 1/3; wrong 2 per 6 = 333.3 per 1,000.
    // Wilson (1927) for 1 of 3 at z = 1.96, by hand: centre (1/3 + z^2/6) / (1 + z^2/3) = 0.4269,
    // half-width z sqrt(2/27 + z^2/36) / (1 + z^2/3) = 0.3654, so (0.0615, 0.7923).
    ServiceRow at50 = service(s, 0.5);
    assertEquals(3, at50.answered());
    assertEquals(1.0 / 3, at50.precision(), EPS);
    assertEquals(1000.0 / 3, at50.wrongPerThousand(), 1e-9);
    assertEquals(0.0615, at50.precisionLower(), 1e-4);
    assertEquals(0.7923, at50.precisionUpper(), 1e-4);
    assertEquals(2, at50.safetyHandOffs());
    // Above every confidence nothing is answered and the gate has nothing to stop.
    ServiceRow at96 = service(s, 0.96);
    assertEquals(0, at96.answered());
    assertTrue(Double.isNaN(at96.precision()));
    assertEquals(0, at96.safetyHandOffs());
    // Every observed confidence is a row too, so each step of the curve can be chosen.
    for (double c : new double[] {0.95, 0.9, 0.85, 0.8, 0.6, 0.3}) {
      assertEquals(c, service(s, c).threshold(), 0.0);
    }
    for (int i = 1; i < s.service().size(); i++) {
      assertTrue(s.service().get(i - 1).threshold() < s.service().get(i).threshold());
    }

    // By category at the given 0.75: bins answers a and c (2 of 3, one right), the gate stops b;
    // safety answers nothing in service (d stopped), where confidence alone answered d.
    CategoryRow bins = s.categories().rows().get(0);
    assertEquals("bins", bins.category());
    assertEquals(3, bins.answered());
    assertEquals(2, bins.serviceAnswered());
    assertEquals(2.0 / 3, bins.serviceCoverage(), EPS);
    assertEquals(0.5, bins.servicePrecision(), EPS);
    assertEquals(1, bins.safetyHandOffs());
    CategoryRow safety = s.categories().rows().get(1);
    assertEquals(1, safety.answered());
    assertEquals(0, safety.serviceAnswered());
    assertEquals(0.0, safety.serviceCoverage(), EPS);
    assertTrue(Double.isNaN(safety.servicePrecision()));
    assertEquals(1, safety.safetyHandOffs());
  }

  private static ServiceRow service(SystemReport s, double threshold) {
    return s.service().stream().filter(r -> r.threshold() == threshold).findFirst()
        .orElseThrow(() -> new AssertionError("no service row at " + threshold));
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
