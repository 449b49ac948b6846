package org.precedent.engine.rerank;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.precedent.engine.rerank.net.EncodedBatch;
import org.precedent.engine.rerank.net.PairCodec;
import org.precedent.engine.rerank.net.Seq2SeqReranker;

class ScorerTest {

  private final RerankerModel model = TinyModel.get().model();
  private final String question = "how do I reset my password?";

  @Test
  void emptyCandidateListGivesEmptyResult() {
    assertTrue(new Scorer(model).score(question, List.of()).isEmpty());
  }

  /**
   * The scorer's log-likelihood must equal a sum of log-softmax values computed here from the layer before
   * the softmax: logits = x W + b, then log-softmax with the max subtracted (the standard stable form:
   * log p_k = z_k - m - log sum_j exp(z_j - m)), in double precision.
   */
  @Test
  void logLikelihoodIsTheSumOfPerTokenLogSoftmax() {
    String answer = TinyData.ANSWERS.get(0);
    AnswerScore score = new Scorer(model.withAntiLmLambda(0)).score(question, List.of(answer)).get(0);

    PairCodec codec = model.codec();
    PairCodec.Encoded a = codec.answer(answer);
    EncodedBatch batch = new EncodedBatch(List.of(codec.question(question)), List.of(a));
    ComputationGraph graph = model.network();
    graph.setLayerMaskArrays(batch.inputMasks(), null);
    Map<String, INDArray> activations = graph.feedForward(batch.inputs(), false);
    graph.clearLayerMaskArrays();
    INDArray x = activations.get("decoderAndContext"); // [1, 2H, T]
    INDArray w = graph.getLayer(Seq2SeqReranker.OUTPUT).getParam("W"); // [2H, V]
    INDArray b = graph.getLayer(Seq2SeqReranker.OUTPUT).getParam("b").reshape(-1); // [V]
    int steps = batch.targetCount(0);
    int width = (int) w.size(0);
    int vocab = (int) w.size(1);
    double expected = 0;
    for (int t = 0; t < steps; t++) {
      double[] logits = new double[vocab];
      double max = Double.NEGATIVE_INFINITY;
      for (int k = 0; k < vocab; k++) {
        double z = b.getDouble(k);
        for (int j = 0; j < width; j++) {
          z += x.getDouble(0, j, t) * w.getDouble(j, k);
        }
        logits[k] = z;
        max = Math.max(max, z);
      }
      double sumExp = 0;
      for (double z : logits) {
        sumExp += Math.exp(z - max);
      }
      expected += logits[batch.target(0, t)] - max - Math.log(sumExp);
    }
    assertEquals(a.ids().length + 1, score.tokens(), "answer tokens plus the end token");
    assertEquals(expected, score.logLikelihood(), 1e-4 * Math.max(1, Math.abs(expected)));
    assertEquals(score.logLikelihood() / score.tokens(), score.perTokenLogLikelihood(), 1e-12);
  }

  /** Padding a candidate to a longer one's length, or batching it with other rows, must not move its score. */
  @Test
  void paddingAndBatchCompanyDoNotChangeAScore() {
    Scorer scorer = new Scorer(model.withAntiLmLambda(0));
    String shortAnswer = "Refunds reach your account within five working days.";
    double alone = scorer.score(question, List.of(shortAnswer)).get(0).logLikelihood();
    String longAnswer = String.join(" ", Collections.nCopies(6, TinyData.ANSWERS.get(4)));
    List<AnswerScore> padded = scorer.score(question, List.of(longAnswer, shortAnswer, TinyData.ANSWERS.get(1)));
    assertEquals(alone, padded.get(1).logLikelihood(), 1e-4);

    // With lambda > 0 the empty-question rows share the batch, so this question is padded on the encoder side.
    Scorer withLm = new Scorer(model.withAntiLmLambda(0.5));
    assertEquals(alone, withLm.score(question, List.of(shortAnswer, longAnswer)).get(0).logLikelihood(), 1e-4);
  }

  @Test
  void antiLmSubtractsLambdaTimesTheEmptyQuestionLikelihood() {
    String answer = TinyData.ANSWERS.get(2);
    double lambda = 0.3;
    AnswerScore s = new Scorer(model.withAntiLmLambda(lambda)).score(question, List.of(answer)).get(0);
    double unconditional = new Scorer(model.withAntiLmLambda(0)).score("", List.of(answer)).get(0).logLikelihood();
    assertEquals(s.logLikelihood() - lambda * unconditional, s.antiLm(), 1e-4);
    // Asked again, P(answer) comes from the cache and must be the same.
    AnswerScore again = new Scorer(model.withAntiLmLambda(lambda)).score(question, List.of(answer, answer)).get(1);
    assertEquals(s.antiLm(), again.antiLm(), 1e-4);
  }

  @Test
  void longQuestionKeepsItsFirstTokensAndIsFlagged() {
    int max = model.config().maxQuestionTokens();
    List<String> words = new ArrayList<>();
    for (int i = 0; i < max + 10; i++) {
      words.add(i % 2 == 0 ? "password" : "card");
    }
    String longQuestion = String.join(" ", words);
    String firstN = String.join(" ", words.subList(0, max));
    Scorer scorer = new Scorer(model.withAntiLmLambda(0));
    AnswerScore cut = scorer.score(longQuestion, List.of(TinyData.ANSWERS.get(0))).get(0);
    AnswerScore exact = scorer.score(firstN, List.of(TinyData.ANSWERS.get(0))).get(0);
    assertTrue(cut.questionTruncated());
    assertFalse(exact.questionTruncated());
    assertEquals(exact.logLikelihood(), cut.logLikelihood(), 1e-6);
  }

  @Test
  void longAnswerIsCutToTheLimitAndFlagged() {
    int max = model.config().maxAnswerTokens();
    String longAnswer = String.join(" ", Collections.nCopies(max + 5, "refund"));
    AnswerScore s = new Scorer(model).score(question, List.of(longAnswer)).get(0);
    assertTrue(s.answerTruncated());
    assertEquals(max + 1, s.tokens(), "the kept tokens plus the end token");
  }

  @Test
  void trainedModelPrefersTheAnswerItWasTaughtForAQuestion() {
    List<AnswerScore> scores = new Scorer(model).score("I forgot my password", TinyData.ANSWERS);
    int best = 0;
    for (int i = 1; i < scores.size(); i++) {
      if (scores.get(i).antiLm() > scores.get(best).antiLm()) {
        best = i;
      }
    }
    assertEquals(0, best, "scores: " + scores);
  }

  @Test
  void passesOnSeveralCopiesAtOnceScoreAsOnePassAlone() throws Exception {
    List<String> answers = TinyData.ANSWERS.subList(0, 4);
    List<AnswerScore> alone = new Scorer(model, 1).score(question, answers);
    Scorer shared = new Scorer(model, 3);
    assertEquals(3, shared.copies());
    java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(3);
    try {
      List<java.util.concurrent.Future<List<AnswerScore>>> runs = new ArrayList<>();
      for (int i = 0; i < 24; i++) {
        runs.add(pool.submit(() -> shared.score(question, answers)));
      }
      for (java.util.concurrent.Future<List<AnswerScore>> run : runs) {
        List<AnswerScore> got = run.get();
        for (int i = 0; i < answers.size(); i++) {
          // The same weights and the same arithmetic: equal to float rounding (common practice).
          assertEquals(alone.get(i).logLikelihood(), got.get(i).logLikelihood(), 1e-4);
        }
      }
    } finally {
      pool.shutdownNow();
    }
  }

  @Test
  void aCopyCountBelowOneOrNotANumberIsRefusedNamingTheSetting() {
    assertThrows(IllegalArgumentException.class, () -> new Scorer(model, 0));
    String before = System.getProperty(Scorer.COPIES_PROPERTY);
    try {
      System.setProperty(Scorer.COPIES_PROPERTY, "two");
      IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
          () -> Scorer.copiesFor(2));
      assertTrue(e.getMessage().contains(Scorer.COPIES_PROPERTY) && e.getMessage().contains("'two'"),
          e.getMessage());
      System.setProperty(Scorer.COPIES_PROPERTY, "3");
      assertEquals(3, Scorer.copiesFor(2));
      System.clearProperty(Scorer.COPIES_PROPERTY);
      assertEquals(2, Scorer.copiesFor(2));
    } finally {
      if (before == null) {
        System.clearProperty(Scorer.COPIES_PROPERTY);
      } else {
        System.setProperty(Scorer.COPIES_PROPERTY, before);
      }
    }
  }
}
