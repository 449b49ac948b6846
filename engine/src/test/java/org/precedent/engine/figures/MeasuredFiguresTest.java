package org.precedent.engine.figures;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.evaluate.EvaluatedTicket;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.EvaluationReports;
import org.precedent.engine.evaluate.SystemRun;
import org.precedent.engine.rerank.ComputeThreads;
import org.precedent.engine.rerank.TrainingMetrics;

/** A small report, its figures worked out by hand. */
class MeasuredFiguresTest {

  /**
   * 300 in-scope tickets: 250 right at rank 1 with confidence 0.600..0.849, 50 wrong (right answer
   * at rank 2) with confidence 0.100..0.149. Top-1 = 250/300, MRR = (250 + 50/2)/300 = 0.91667.
   */
  private static SystemRun separable(String name) {
    List<EvaluatedTicket> tickets = new ArrayList<>();
    for (int i = 0; i < 250; i++) {
      tickets.add(new EvaluatedTicket("r" + i, "bins", true, 1, 0.6 + i / 1000.0));
    }
    for (int i = 0; i < 50; i++) {
      tickets.add(new EvaluatedTicket("w" + i, "bins", true, 2, 0.1 + i / 1000.0));
    }
    return new SystemRun(name, tickets);
  }

  /** The same tickets, but a wrong answer is the most confident: no threshold is guaranteed. */
  private static SystemRun confidentlyWrong(String name) {
    List<EvaluatedTicket> tickets = new ArrayList<>(separable(name).tickets());
    for (int i = 0; i < 50; i++) {
      tickets.set(250 + i, new EvaluatedTicket("w" + i, "bins", true, 2, 0.95 + i / 1000.0));
    }
    return new SystemRun(name, tickets);
  }

  @Test
  void eachSystemsFiguresUnderItsName() {
    EvaluationReport report = EvaluationReports.build("small", List.of(
        confidentlyWrong(ScoringSystem.BM25.label()), separable(ScoringSystem.RERANKER.label()),
        separable(ScoringSystem.FUSED.label())), 0.95, OptionalDouble.empty(),
        Instant.parse("2026-01-01T00:00:00Z"));
    Map<String, Double> f = MeasuredFigures.of(report);

    assertEquals(300.0, f.get("heldout.tickets"));
    assertEquals(300.0, f.get("heldout.in_scope"));
    assertEquals(250 / 300.0, f.get("fused.top1"), 1e-12);
    assertEquals((250 + 50 / 2.0) / 300, f.get("fused.mrr"), 1e-12);
    assertEquals(1.0, f.get("fused.recall10"));
    // The 250 right answers and the 13 most confident wrong ones keep 250/263 = 95.06% >= 95%;
    // a 14th wrong one gives 250/264 = 94.7%. Coverage at 95% precision: 263/300.
    assertEquals(263 / 300.0, f.get("fused.coverage95"), 1e-12);
    // The guarantee is the report's (its search is tested with the measures); here only its place.
    var guaranteed = report.systems().get(2).recommendation();
    assertTrue(guaranteed.repliesAutomatically());
    assertEquals(guaranteed.threshold(), f.get("fused.threshold"));
    assertEquals(guaranteed.coverage(), f.get("fused.threshold_coverage"));
    assertEquals(guaranteed.empiricalPrecision(), f.get("fused.threshold_precision"));
    assertEquals(guaranteed.precisionLowerBound(), f.get("fused.threshold_lower_bound"));
    // The search tries the top ceil(300 k / 9) answers (K = ceil(log2 300) = 9): 234 of them (k = 7)
    // are all right; 267 (k = 8) hold 17 wrong, 93.6% right, which cannot certify 95%.
    assertEquals(234 / 300.0, f.get("fused.threshold_coverage"), 1e-12);
    // BM25's 50 most confident answers are all wrong: nothing can be guaranteed.
    assertTrue(f.get("bm25.threshold").isNaN());
    assertTrue(f.get("bm25.threshold_coverage").isNaN());
    assertEquals(report.systems().get(0).measures().auroc(), f.get("bm25.auroc"));
    // These tickets do not say whether the reranker ran: none counts as reranked.
    assertEquals(0.0, f.get("fused.reranker_runs"));
    assertEquals(3 * 12 + 2, f.size());
  }

  @Test
  void trainingFiguresLeaveOutTheWallClock() {
    TrainingMetrics t = new TrainingMetrics(0.05, 0.026, 6, 1_328_000, 380, 0.2, 0.975, 2316, 257, 2030,
        new ComputeThreads(1, 1, 1));
    assertEquals(Map.of("training.pairs", 2316.0, "training.validation_pairs", 257.0, "training.epochs", 6.0,
        "training.validation_loss", 0.026, "training.anti_lm_lambda", 0.2, "training.validation_top1", 0.975,
        "training.vocabulary", 2030.0), MeasuredFigures.of(t));
  }

  @Test
  void savedFiguresReadBackWithUndefinedOnesAsNaN(@TempDir Path dir) throws IOException {
    MeasuredFigures m = new MeasuredFigures(Map.of("computeThreads", "1 thread"),
        Map.of("fused.top1", 0.9852398523985239, "bm25.threshold", Double.NaN));
    Path file = dir.resolve("figures.json");
    m.save(file);
    MeasuredFigures back = MeasuredFigures.load(file);
    assertEquals(m.measuredWith(), back.measuredWith());
    assertEquals(0.9852398523985239, back.figures().get("fused.top1"));
    assertTrue(back.figures().get("bm25.threshold").isNaN());
  }
}
