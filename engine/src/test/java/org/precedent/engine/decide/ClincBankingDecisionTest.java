package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.EvaluationReports;
import org.precedent.engine.evaluate.HeldOutRuns;
import org.precedent.engine.evaluate.SystemReport;
import org.precedent.engine.evaluate.SystemRun;
import org.precedent.engine.fusion.FusionQuestion;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.engine.rerank.ClincDomain;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * The whole decision on the banking domain of CLINC150 (Larson et al. 2019): the train split is
 * ingested as labelled tickets and trains the reranker; fusion and calibration are fitted on the
 * val split plus the out-of-scope val queries; the test split plus the out-of-scope test queries
 * measure the three systems.
 */
@Tag("slow")
class ClincBankingDecisionTest {
  @TempDir
  Path tmp;

  @Test
  void fusionBeatsBm25AndItsConfidenceIsCalibrated() throws Exception {
    ClincDomain banking = ClincDomain.load("banking");
    StringBuilder csv = new StringBuilder("text,intent\n");
    for (TrainingPair p : banking.train()) {
      csv.append('"').append(p.question().replace("\"", "\"\"")).append("\",")
          .append(p.answer().replace(' ', '_')).append('\n');
    }
    Path train = Files.writeString(tmp.resolve("banking-train.csv"), csv);
    DataDir data = new DataDir(tmp.resolve("data"));
    new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard()).ingest(train,
        ExportFormat.CSV, ColumnMapping.of(Map.of("question", "text", "label", "intent")),
        Progress.silent(), Progress.silent());

    List<FusionQuestion> fusion = new ArrayList<>();
    int n = 0;
    for (TrainingPair p : banking.validation()) {
      fusion.add(new FusionQuestion("val-" + n++, clean(p.question()),
          p.answer().replace(' ', '_'), false));
    }
    for (String q : ClincDomain.outOfScope("oos_val")) {
      fusion.add(new FusionQuestion("val-" + n++, clean(q), null, false));
    }
    List<HeldOutRuns.HeldOutQuestion> test = new ArrayList<>();
    for (TrainingPair p : banking.test()) {
      test.add(new HeldOutRuns.HeldOutQuestion("test-" + n++, clean(p.question()), "banking",
          p.answer().replace(' ', '_')));
    }
    for (String q : ClincDomain.outOfScope("oos_test").subList(0, 300)) {
      test.add(new HeldOutRuns.HeldOutQuestion("test-" + n++, clean(q), "out of scope", null));
    }

    Knowledge knowledge = Knowledge.open(data).orElseThrow();
    // CLINC150 answers are 2 to 4 words: with the default step of 5e-3 training stops early
    // at a higher validation loss (0.120 against 0.099 at 2e-3, measured), so the smaller step.
    TrainingReport trained = new TeamModelTrainer(data, RerankerConfig.defaults()
        .withEpochs(10, 2).withLearningRate(2e-3)).train(knowledge, banking.train(), fusion,
        false);
    System.out.println(trained.summary());
    try (InForce active = InForce.open(data)) {
      List<SystemRun> runs = HeldOutRuns.modelAlone(active.pipeline(), test,
          Progress.silent());
      EvaluationReport report = EvaluationReports.build("CLINC150 banking test", runs, 0.95);
      for (SystemReport s : report.systems()) {
        var m = s.measures();
        System.out.printf(Locale.ROOT, "CLINC150 banking, %-15s top-1 %.3f  MRR %.3f  ECE %.3f  "
                + "Brier %.3f  AUROC %.3f  AURC %.3f  coverage@95%% %.3f%n", s.name(), m.top1(),
            m.meanReciprocalRank(), m.expectedCalibrationError(), m.brierScore(), m.auroc(),
            m.aurc(), m.coverageAt95());
      }
      var bm25 = report.systems().get(0).measures();
      var fused = report.systems().get(2).measures();
      // Floors: fused top-1 must beat BM25's (the point of the reranker and fusion); calibration
      // error within 0.08 on 750 questions (ECE's own sampling noise at this size is a few
      // points; the product target of 0.05 is reported, not asserted, here).
      assertTrue(fused.top1() > bm25.top1(), "fused " + fused.top1() + " vs BM25 " + bm25.top1());
      assertTrue(fused.expectedCalibrationError() <= 0.08, "ECE " + fused.expectedCalibrationError());
      assertTrue(fused.coverageAt95() >= bm25.coverageAt95(), "coverage at 95% precision");
    }
  }

  private static String clean(String q) {
    return TextCleaner.standard().cleanQuestion(q);
  }
}
