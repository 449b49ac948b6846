package org.precedent.engine.decide;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.EvaluationReports;
import org.precedent.engine.evaluate.HeldOutRuns;
import org.precedent.engine.evaluate.SystemReport;
import org.precedent.engine.evaluate.SystemRun;
import org.precedent.engine.evaluate.Measures;
import org.precedent.engine.fusion.FusionQuestion;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.measure.Calibration;
import org.precedent.engine.measure.JudgedAnswer;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.engine.rerank.ClincDomain;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.embed.SentenceEncoder;
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
 * measure the systems side by side, without and with the dense leg.
 */
@Tag("slow")
class ClincBankingDecisionTest {
  @TempDir
  Path tmp;

  @Test
  void fusionBeatsBm25AndItsConfidenceIsCalibrated() throws Exception {
    Result r = run(Optional.empty());
    var bm25 = r.measures(ScoringSystem.BM25);
    var fused = r.measures(ScoringSystem.FUSED);
    // Fused top-1 must beat BM25's: that is the point of the reranker and fusion.
    assertTrue(fused.top1() > bm25.top1(), "fused " + fused.top1() + " vs BM25 " + bm25.top1());
    assertCalibrated(r);
    assertTrue(fused.coverageAt95() >= bm25.coverageAt95(), "coverage at 95% precision");
  }

  /** In-scope test queries of the banking domain (15 intents, 30 each; Larson et al. 2019). */
  private static final int IN_SCOPE = 450;
  /** Test queries measured: the in-scope ones and the first 300 out-of-scope test queries. */
  private static final int MEASURED = IN_SCOPE + 300;

  /**
   * With the dense leg (bge-small-en-v1.5, frozen). Floors are what this test measured on
   * 2026-12-03 (fused and the cascade 0.976, dense alone 0.971 in-scope top-1; the cascade reranked
   * 37.7% of questions) less two binomial standard errors of that share on the questions it counts
   * (resampling noise, about 95% of draws), so that noise alone does not fail it while a lost point
   * does. The published line on CLINC150 is BERT's 96.2% in-scope accuracy over all 150 intents
   * (Larson et al. 2019, Table 2).
   */
  @Test
  void theDenseLegLiftsFusionAndStaysCalibrated() throws Exception {
    Result r = run(Optional.of(SentenceEncoder.BGE_SMALL_EN_V15_Q));
    var bm25 = r.measures(ScoringSystem.BM25);
    var dense = r.measures(ScoringSystem.DENSE);
    var fused = r.measures(ScoringSystem.FUSED);
    var withoutReranker = r.measures(ScoringSystem.FUSED_WITHOUT_RERANKER);
    double inScopeFused = r.inScopeTop1(ScoringSystem.FUSED);
    double inScopeDense = r.inScopeTop1(ScoringSystem.DENSE);
    double inScopeCascade = r.inScopeTop1(ScoringSystem.CASCADE);
    System.out.printf(Locale.ROOT, "CLINC150 banking with the dense leg: in-scope top-1 fused "
        + "%.3f, cascade %.3f, dense alone %.3f, BM25 alone %.3f, fused without reranker %.3f%n",
        inScopeFused, inScopeCascade, inScopeDense, r.inScopeTop1(ScoringSystem.BM25),
        r.inScopeTop1(ScoringSystem.FUSED_WITHOUT_RERANKER));
    assertTrue(dense.top1() > bm25.top1(), "dense " + dense.top1() + " vs BM25 " + bm25.top1());
    assertTrue(fused.top1() >= bm25.top1(), "fused " + fused.top1() + " vs BM25 " + bm25.top1());
    // Measured 0.976 on 2026-12-03, less two binomial standard errors on 450 queries.
    assertTrue(inScopeFused >= below(0.976, IN_SCOPE), "in-scope fused top-1 " + inScopeFused);
    // Measured 0.976 on 2026-12-03 (the deciding system), the same margin.
    assertTrue(inScopeCascade >= below(0.976, IN_SCOPE), "in-scope cascade top-1 "
        + inScopeCascade);
    // Measured 0.971 on 2026-12-03, the same margin.
    assertTrue(inScopeDense >= below(0.971, IN_SCOPE), "in-scope dense top-1 " + inScopeDense);
    assertTrue(fused.auroc() >= bm25.auroc(), "fused AUROC " + fused.auroc() + " vs BM25 "
        + bm25.auroc());
    assertTrue(withoutReranker.top1() > 0, "fused without the reranker is measured");
    assertCalibrated(r);

    // The cascade, which decides by default, runs the reranker only where BM25, the dense leg and
    // their fusion disagree: it must keep fused top-1 within a point (common practice, no source:
    // about the noise of 1,300 questions) for a fraction of the reranker's runs.
    var cascade = r.measures(ScoringSystem.CASCADE);
    double runs = r.report().systems().stream()
        .filter(s -> s.name().equals(ScoringSystem.CASCADE.label())).findFirst().orElseThrow()
        .rerankerRuns();
    System.out.printf(Locale.ROOT, "cascade: top-1 %.3f (fused %.3f), reranker run for %.1f%% of "
        + "questions, ECE %.3f%n", cascade.top1(), fused.top1(), 100 * runs,
        cascade.expectedCalibrationError());
    assertTrue(cascade.top1() >= fused.top1() - 0.01, "cascade " + cascade.top1() + " vs fused "
        + fused.top1());
    // Measured 0.377 on 2026-12-03, plus two binomial standard errors on the 750 questions.
    assertTrue(runs > 0 && runs <= 0.377 + (0.377 - below(0.377, MEASURED)), "reranker runs "
        + runs);
    assertTrue(cascade.expectedCalibrationError() <= consistencyNoise(r.run(ScoringSystem.CASCADE)
        .tickets().stream().map(t -> t.scored()).toList(), 1000, 0.95) + 0.05, "cascade ECE");
    assertTrue(r.sameAsDecisions(), "a decision runs the reranker and ranks as the evaluation "
        + "of the cascade does");
  }

  /**
   * @param sameAsDecisions whether the service's path (retrieve, then the reranker only where the
   *                        legs disagree) gave the same answer and confidence as the cascade
   *                        ranked from every score, on a sample of questions
   */
  private record Result(EvaluationReport report, List<SystemRun> runs, boolean sameAsDecisions) {
    Measures measures(ScoringSystem system) {
      return report.systems().stream().filter(s -> s.name().equals(system.label())).findFirst()
          .orElseThrow(() -> new AssertionError("no " + system.label() + " in the report"))
          .measures();
    }

    SystemRun run(ScoringSystem system) {
      return runs.stream().filter(s -> s.name().equals(system.label())).findFirst().orElseThrow();
    }

    /** Top-1 over in-scope questions only, as Larson et al. report in-scope accuracy. */
    double inScopeTop1(ScoringSystem system) {
      var inScope = run(system).tickets().stream().filter(t -> t.inScope()).toList();
      return inScope.stream().filter(t -> t.rankOfRight() == 1).count() / (double) inScope.size();
    }
  }

  /**
   * Calibration, bounded by its own sampling noise rather than by a figure seen once: the ECE a
   * perfectly calibrated model would show on these very confidences, found by drawing each outcome
   * from its own confidence ("consistency resampling", Broecker and Smith 2007), 95th percentile of
   * 1,000 draws. The fused ECE may exceed that noise by at most 0.05, the product's calibration
   * target (DEVELOPERS.md).
   */
  private static void assertCalibrated(Result r) {
    var fused = r.measures(ScoringSystem.FUSED);
    List<JudgedAnswer> scored = r.run(ScoringSystem.FUSED).tickets().stream()
        .map(t -> t.scored()).toList();
    double noise = consistencyNoise(scored, 1000, 0.95);
    System.out.printf(Locale.ROOT, "fused ECE %.3f; 95%% of a calibrated model's ECE on these "
        + "confidences is below %.3f%n", fused.expectedCalibrationError(), noise);
    assertTrue(fused.expectedCalibrationError() <= noise + 0.05,
        "ECE " + fused.expectedCalibrationError() + " against noise " + noise);
  }

  private Result run(Optional<SentenceEncoder.Model> encoder) throws Exception {
    ClincDomain banking = ClincDomain.load("banking");
    StringBuilder csv = new StringBuilder("text,intent\n");
    for (TrainingPair p : banking.train()) {
      csv.append('"').append(p.question().replace("\"", "\"\"")).append("\",")
          .append(p.answer().replace(' ', '_')).append('\n');
    }
    Path train = Files.writeString(tmp.resolve("banking-train.csv"), csv);
    DataDir data = new DataDir(tmp.resolve("data"));
    new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard()).withEncoder(encoder)
        .ingest(train,
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
      return new Result(report, runs, sameAsDecisions(active.pipeline(), test));
    }
  }

  /** Decisions against the evaluation's ranking, every 13th question (a spread sample). */
  private static boolean sameAsDecisions(Pipeline pipeline, List<HeldOutRuns.HeldOutQuestion> qs) {
    ScoringSystem system = pipeline.decisionSystem();
    for (int i = 0; i < qs.size(); i += 13) {
      String q = qs.get(i).question();
      var ranked = pipeline.rank(system, pipeline.candidates(q, null));
      Decision d = pipeline.decideCleaned(q, null);
      String best = ranked.candidates().isEmpty() ? null
          : ranked.candidates().get(0).candidate().group().id();
      if (!java.util.Objects.equals(best, d.answerGroup())
          || Math.abs(ranked.confidence() - d.confidence()) > 1e-12) {
        System.out.println("differs on '" + q + "': " + best + " " + ranked.confidence()
            + " against " + d.answerGroup() + " " + d.confidence());
        return false;
      }
    }
    return true;
  }

  /**
   * A share measured on {@code n} questions less two binomial standard errors (about the 95% range
   * of resampling noise; normal approximation).
   */
  static double below(double measured, int n) {
    return measured - 2 * Math.sqrt(measured * (1 - measured) / n);
  }

  /** The {@code quantile} of ECE over {@code draws} outcome sets drawn from the confidences. */
  static double consistencyNoise(List<JudgedAnswer> scored, int draws, double quantile) {
    java.util.Random random = new java.util.Random(20071); // fixed seed: the bound is reproducible
    double[] ece = new double[draws];
    for (int d = 0; d < draws; d++) {
      List<JudgedAnswer> drawn = scored.stream().map(a -> new JudgedAnswer(a.confidence(),
          random.nextDouble() < a.confidence())).toList();
      ece[d] = Calibration.expectedCalibrationError(drawn);
    }
    java.util.Arrays.sort(ece);
    return ece[(int) Math.ceil(quantile * draws) - 1];
  }

  private static String clean(String q) {
    return TextCleaner.standard().cleanQuestion(q);
  }
}
