package org.precedent.engine.rerank;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Semaphore;
import org.precedent.engine.rerank.net.InferencePass;
import org.precedent.engine.rerank.net.PairCodec;

/**
 * Scores candidate answers to a question with a trained reranker.
 *
 * <p>Scoring runs on {@link InferencePass}, a plain-Java forward pass over the trained network's
 * parameters that gives DL4J's log-likelihoods (checked against DL4J in {@code InferencePassTest}):
 * the question is encoded once and shared by all the candidates. The anti-LM term of Li et al. 2016 ("A Diversity-Promoting Objective Function for Neural
 * Conversation Models", NAACL) needs log P(answer) as well; this project has no separate language model,
 * so P(answer) is the same network's probability of the answer given an EMPTY question (the end token
 * alone). Training shows each epoch a share of pairs with their question emptied, so that input means
 * "no question" to the network rather than being out of its experience. That term is computed when
 * the answer is not in the cache yet; the cache is keyed by answer text, since P(answer) does not
 * depend on the question. With lambda 0 it is skipped.
 *
 * <p>The inference pass is immutable and shared by every thread; the scorer only bounds how many
 * passes run at once ({@link #copiesFor}, by default one per processor, each pass being one
 * thread's arithmetic), so that more callers wait rather than share the cores and all finish late.
 * The weights are read when the scorer is made: a network trained further afterwards needs a new
 * scorer.
 */
public final class Scorer {

  private static final int LANGUAGE_MODEL_CACHE = 50_000;

  private final RerankerModel model;
  private final PairCodec codec;
  private final InferencePass pass;
  private final Semaphore running;
  private final int copies;
  private final Map<String, Double> answerLogProb = Collections.synchronizedMap(
      new LinkedHashMap<>(256, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<String, Double> eldest) {
          return size() > LANGUAGE_MODEL_CACHE;
        }
      });

  /** A scorer that runs {@link #copiesFor} passes at once: one per processor, by default. */
  public Scorer(RerankerModel model) {
    this(model, copiesFor(Runtime.getRuntime().availableProcessors()));
  }

  /**
   * @param copies how many passes may run at once (the name is from when each needed its own copy
   *               of the DL4J network); at least 1
   */
  public Scorer(RerankerModel model, int copies) {
    if (copies < 1) {
      throw new IllegalArgumentException("copies of the network must be at least 1, was " + copies);
    }
    this.model = model;
    this.codec = model.codec();
    this.copies = copies;
    this.pass = InferencePass.of(model.network());
    this.running = new Semaphore(copies, true);
  }

  /** The system property that sets how many scoring passes run at once. */
  public static final String COPIES_PROPERTY = "precedent.reranker.copies";

  /**
   * Copies for a machine with {@code processors}: the system property {@value #COPIES_PROPERTY}
   * when set, else one per processor (each pass is one native thread; the launcher sets one OpenMP
   * thread per operation).
   */
  public static int copiesFor(int processors) {
    String configured = System.getProperty(COPIES_PROPERTY);
    if (configured == null || configured.isBlank()) {
      return Math.max(1, processors);
    }
    try {
      int n = Integer.parseInt(configured.strip());
      if (n >= 1) {
        return n;
      }
    } catch (NumberFormatException e) {
      // refused below, saying which setting
    }
    throw new IllegalArgumentException("-D" + COPIES_PROPERTY + " must be a whole number of at "
        + "least 1, was '" + configured + "'");
  }

  /** How many passes may run at once. */
  public int copies() {
    return copies;
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
    double[] logLikelihoods;
    double[] answerLm = new double[answers.size()];
    acquire();
    try {
      List<int[]> ids = new ArrayList<>(answers.size());
      for (PairCodec.Encoded a : encodedAnswers) {
        ids.add(a.ids());
      }
      logLikelihoods = pass.logLikelihoods(pass.encode(q.ids()), ids);
      if (lambda > 0) {
        Map<String, Integer> uncached = new LinkedHashMap<>();
        for (int i = 0; i < answers.size(); i++) {
          Double cached = answerLogProb.get(answers.get(i));
          if (cached != null) {
            answerLm[i] = cached;
          } else {
            uncached.putIfAbsent(answers.get(i), i);
          }
        }
        if (!uncached.isEmpty()) {
          // P(answer): the same network given the empty question, for the answers not cached yet
          List<int[]> lmIds = new ArrayList<>();
          uncached.values().forEach(i -> lmIds.add(ids.get(i)));
          double[] lm = pass.logLikelihoods(pass.encode(codec.emptyQuestion().ids()), lmIds);
          Map<String, Double> fresh = new HashMap<>();
          int k = 0;
          for (String a : uncached.keySet()) {
            fresh.put(a, lm[k]);
            answerLogProb.put(a, lm[k++]);
          }
          for (int i = 0; i < answers.size(); i++) {
            answerLm[i] = fresh.getOrDefault(answers.get(i), answerLm[i]);
          }
        }
      }
    } finally {
      running.release();
    }
    List<AnswerScore> scores = new ArrayList<>(answers.size());
    for (int i = 0; i < answers.size(); i++) {
      double ll = logLikelihoods[i];
      int tokens = encodedAnswers.get(i).ids().length + 1;
      scores.add(new AnswerScore(ll, tokens, ll / tokens, ll - lambda * answerLm[i], q.truncated(),
          encodedAnswers.get(i).truncated()));
    }
    return List.copyOf(scores);
  }

  private void acquire() {
    try {
      running.acquire();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while waiting for the reranker", e);
    }
  }
}
