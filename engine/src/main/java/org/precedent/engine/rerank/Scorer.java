package org.precedent.engine.rerank;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import org.deeplearning4j.nn.graph.ComputationGraph;
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
 *
 * <p>A DL4J network holds the state of its last pass and is not safe to share between threads, so
 * the scorer keeps copies of it (the same weights), one per pass that may run at once: {@link
 * #copiesFor} by default one per processor, as each pass runs on one native thread. A pass takes an
 * idle copy, or waits for one; a single copy serialises every pass, as one lock did before.
 */
public final class Scorer {

  private static final int LANGUAGE_MODEL_CACHE = 50_000;

  private final RerankerModel model;
  private final PairCodec codec;
  private final BlockingQueue<ComputationGraph> idle;
  private final int copies;
  private final Map<String, Double> answerLogProb = Collections.synchronizedMap(
      new LinkedHashMap<>(256, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<String, Double> eldest) {
          return size() > LANGUAGE_MODEL_CACHE;
        }
      });

  /** A scorer with {@link #copiesFor} copies of the network: one per processor, by default. */
  public Scorer(RerankerModel model) {
    this(model, copiesFor(Runtime.getRuntime().availableProcessors()));
  }

  /**
   * @param copies how many passes may run at once, each on its own copy of the network (the
   *               model's own network is the first); at least 1
   */
  public Scorer(RerankerModel model, int copies) {
    if (copies < 1) {
      throw new IllegalArgumentException("copies of the network must be at least 1, was " + copies);
    }
    this.model = model;
    this.codec = model.codec();
    this.copies = copies;
    this.idle = new ArrayBlockingQueue<>(copies);
    idle.add(model.network());
    for (int i = 1; i < copies; i++) {
      idle.add(copyOf(model.network()));
    }
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
    ComputationGraph network = take();
    try {
      INDArray output = LogLikelihoods.forward(network, batch);
      logLikelihoods = LogLikelihoods.perRow(output, batch);
    } finally {
      idle.add(network);
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

  /**
   * The same configuration and weights, without the training state: {@code clone()} also copies
   * the updater, which the attention layer's parameters have none of once loaded for scoring.
   * Made before any pass runs, so the weights are read while nothing else uses the network.
   */
  private static ComputationGraph copyOf(ComputationGraph network) {
    ComputationGraph copy = new ComputationGraph(network.getConfiguration().clone());
    copy.init(network.params().dup(), false);
    return copy;
  }

  private ComputationGraph take() {
    try {
      return idle.take();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while waiting for the reranker", e);
    }
  }
}
