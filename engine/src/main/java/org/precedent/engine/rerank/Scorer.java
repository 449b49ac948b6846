package org.precedent.engine.rerank;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.precedent.engine.rerank.net.EncodedBatch;
import org.precedent.engine.rerank.net.LogLikelihoods;
import org.precedent.engine.rerank.net.PairCodec;

/**
 * Scores candidate answers to a question with a trained reranker.
 *
 * <p>All candidates go through the network in ONE batched forward pass: the question is repeated once per
 * candidate. The anti-LM term of Li et al. 2016 ("A Diversity-Promoting Objective Function for Neural
 * Conversation Models", NAACL) needs log P(answer) as well; this project has no separate language model,
 * so P(answer) is the same network's probability of the answer given an EMPTY question (the end token
 * alone). Training shows each epoch a share of pairs with their question emptied, so that input means
 * "no question" to the network rather than being out of its experience. Those rows join the same forward
 * pass when the answer is not in the cache yet; the cache is keyed by answer text, since P(answer) does
 * not depend on the question. With lambda 0 they are skipped.
 */
public final class Scorer {

  private static final int LANGUAGE_MODEL_CACHE = 50_000;

  private final RerankerModel model;
  private final PairCodec codec;
  private final Map<String, Double> answerLogProb = Collections.synchronizedMap(
      new LinkedHashMap<>(256, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<String, Double> eldest) {
          return size() > LANGUAGE_MODEL_CACHE;
        }
      });

  public Scorer(RerankerModel model) {
    this.model = model;
    this.codec = model.codec();
  }

  public RerankerModel model() {
    return model;
  }

  /**
   * Scores each answer as a reply to the question, in the order given. An empty list gives an empty result.
   */
  public List<AnswerScore> score(String question, List<String> answers) {
    if (answers.isEmpty()) {
      return List.of();
    }
    double lambda = model.antiLmLambda();
    PairCodec.Encoded q = codec.question(question);
    List<PairCodec.Encoded> encodedAnswers = new ArrayList<>(answers.size());
    for (String a : answers) {
      encodedAnswers.add(codec.answer(a));
    }
    List<PairCodec.Encoded> questions = new ArrayList<>(Collections.nCopies(answers.size(), q));
    List<PairCodec.Encoded> rowAnswers = new ArrayList<>(encodedAnswers);
    Map<String, Double> answerLm = new java.util.HashMap<>();
    Map<String, Integer> lmRows = new LinkedHashMap<>();
    if (lambda > 0) {
      for (int i = 0; i < answers.size(); i++) {
        String a = answers.get(i);
        Double cached = answerLogProb.get(a);
        if (cached != null) {
          answerLm.put(a, cached);
        } else if (!lmRows.containsKey(a)) {
          lmRows.put(a, questions.size());
          questions.add(codec.emptyQuestion());
          rowAnswers.add(encodedAnswers.get(i));
        }
      }
    }
    EncodedBatch batch = new EncodedBatch(questions, rowAnswers);
    double[] logLikelihoods;
    synchronized (model.network()) {
      INDArray output = LogLikelihoods.forward(model.network(), batch);
      logLikelihoods = LogLikelihoods.perRow(output, batch);
    }
    lmRows.forEach((answer, row) -> {
      answerLm.put(answer, logLikelihoods[row]);
      answerLogProb.put(answer, logLikelihoods[row]);
    });
    List<AnswerScore> scores = new ArrayList<>(answers.size());
    for (int i = 0; i < answers.size(); i++) {
      double ll = logLikelihoods[i];
      int tokens = batch.targetCount(i);
      double lm = lambda > 0 ? answerLm.get(answers.get(i)) : 0;
      scores.add(new AnswerScore(ll, tokens, ll / tokens, ll - lambda * lm, q.truncated(),
          encodedAnswers.get(i).truncated()));
    }
    return List.copyOf(scores);
  }
}
