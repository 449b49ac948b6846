package org.precedent.engine.rerank;

import java.util.Objects;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.precedent.engine.rerank.net.PairCodec;
import org.precedent.engine.rerank.net.Seq2SeqReranker;
import org.precedent.engine.rerank.tokens.Tokenizer;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * A trained reranker: network, vocabulary, settings and the anti-LM weight chosen on validation data.
 *
 * <p>The network is mutable DL4J state and not safe for concurrent use; {@link Scorer} gives each pass
 * that runs at once its own copy.
 */
public final class RerankerModel {

  private final ComputationGraph network;
  private final Vocabulary vocabulary;
  private final RerankerConfig config;
  private final double antiLmLambda;

  /**
   * @throws ModelLoadException when the vocabulary's size is not the network's embedding size: such a pair
   *     would map every token to the wrong row
   */
  public RerankerModel(ComputationGraph network, Vocabulary vocabulary, RerankerConfig config, double antiLmLambda) {
    this.network = Objects.requireNonNull(network, "network");
    this.vocabulary = Objects.requireNonNull(vocabulary, "vocabulary");
    this.config = Objects.requireNonNull(config, "config");
    if (!(antiLmLambda >= 0 && antiLmLambda <= 1)) {
      throw new IllegalArgumentException("anti-LM lambda must be in [0, 1], was " + antiLmLambda);
    }
    this.antiLmLambda = antiLmLambda;
    long expected = Seq2SeqReranker.vocabularySize(network);
    if (expected != vocabulary.size()) {
      throw new ModelLoadException("vocabulary has " + vocabulary.size() + " tokens but the model's embedding has "
          + expected + " rows: the vocabulary file belongs to a different model");
    }
  }

  /** The same model with another anti-LM weight (shares the network). */
  public RerankerModel withAntiLmLambda(double lambda) {
    return new RerankerModel(network, vocabulary, config, lambda);
  }

  /** The DL4J network, for training, saving and diagnostics. */
  public ComputationGraph network() {
    return network;
  }

  public Vocabulary vocabulary() {
    return vocabulary;
  }

  public RerankerConfig config() {
    return config;
  }

  public double antiLmLambda() {
    return antiLmLambda;
  }

  /** Text to ids with this model's limits. */
  public PairCodec codec() {
    return new PairCodec(new Tokenizer(), vocabulary, config.maxQuestionTokens(), config.maxAnswerTokens());
  }
}
