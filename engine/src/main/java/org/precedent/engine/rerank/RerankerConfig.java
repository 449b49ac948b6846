package org.precedent.engine.rerank;

import org.precedent.engine.rerank.net.NetworkSettings;

/**
 * Sizes and training settings of one reranker. Kept as {@code config.properties} beside a saved model
 * and a training run's checkpoints, one line per component ({@link PropertiesRecords}).
 *
 * @param embedding         token embedding width
 * @param hidden            LSTM width of encoder and decoder (and of the attention projections)
 * @param maxQuestionTokens question tokens kept; longer questions keep their first tokens
 * @param maxAnswerTokens   answer tokens kept (before the end token)
 * @param vocabCap          most vocabulary entries; the output softmax is this wide, so it dominates cost
 * @param minCount          rarer tokens become unknown
 * @param batchSize         pairs per training step
 * @param learningRate      Adam step size
 * @param maxEpochs         upper bound on passes over the training split
 * @param patience          epochs without a better validation loss before stopping
 * @param clipNorm          L2 norm above which each layer's gradient is scaled down
 * @param seed              seeds weights, the validation split and every epoch's shuffle
 * @param validationShare   share of pairs held out for early stopping and for choosing the anti-LM weight
 * @param unconditionalShare share of pairs shown once more per epoch with an empty question, so the same
 *                          network also learns P(answer) for the anti-LM term
 * @param selfNormalization weight alpha of the (log Z)^2 penalty the output layer is trained with
 *                          ({@link org.precedent.engine.rerank.net.SelfNormalizedLoss}); above 0 the
 *                          version scores each answer token by its logit alone. 0: plain softmax, exact
 *                          scores (every version made before the setting existed)
 */
public record RerankerConfig(int embedding, int hidden, int maxQuestionTokens, int maxAnswerTokens, int vocabCap,
    int minCount, int batchSize, double learningRate, int maxEpochs, int patience, double clipNorm, long seed,
    double validationShare, double unconditionalShare, double selfNormalization) {

  public RerankerConfig {
    positive("embedding", embedding);
    positive("hidden", hidden);
    positive("maxQuestionTokens", maxQuestionTokens);
    positive("maxAnswerTokens", maxAnswerTokens);
    positive("batchSize", batchSize);
    positive("maxEpochs", maxEpochs);
    positive("patience", patience);
    positive("minCount", minCount);
    if (vocabCap < 5) {
      throw new IllegalArgumentException("vocabCap must be at least 5, was " + vocabCap);
    }
    if (!(learningRate > 0) || !(clipNorm > 0)) {
      throw new IllegalArgumentException("learningRate and clipNorm must be positive");
    }
    if (!(validationShare > 0 && validationShare < 1)) {
      throw new IllegalArgumentException("validationShare must be in (0, 1), was " + validationShare);
    }
    if (!(unconditionalShare >= 0 && unconditionalShare <= 1)) {
      throw new IllegalArgumentException("unconditionalShare must be in [0, 1], was " + unconditionalShare);
    }
    if (!(selfNormalization >= 0) || Double.isInfinite(selfNormalization)) {
      throw new IllegalArgumentException("selfNormalization must be 0 or more, was " + selfNormalization);
    }
  }

  /**
   * Defaults for a help desk's few thousand tickets on a two-core CPU, all measured on this
   * project's machine on the demo's tickets (not from a published source). The output layer over the
   * vocabulary takes most of the time, hence the cap of 4000 words and a width of 128. Adam's step
   * 5e-3 reached in 3 epochs the validation loss that 2e-3 reached in 12. At most 4 epochs: on
   * the demo, 4 epochs instead of 6 took two thirds of the time and kept the held-out top-1 of the
   * reranker alone (0.950 against 0.954), of the cascade (0.993) and of the fused system (0.994),
   * and the cascade's coverage at 95% precision (0.940 against 0.942). Batches of 32: 64 or 128
   * pairs gave 10 to 17% more target tokens per second but a validation loss after one epoch of
   * 4.6 and 5.3 nats per token against 2.8; 16 pairs reached a lower validation loss in 3 epochs
   * but a held-out top-1 of the reranker alone of 0.930. Training runs on one ND4J thread (the
   * {@code precedent} script's {@code OMP_NUM_THREADS=1}): two threads gave 0.4 to 0.5 times the
   * tokens per second on the 2-core machine. {@code ./precedent train} prints each figure.
   */
  public static RerankerConfig defaults() {
    return new RerankerConfig(64, 128, 48, 48, 4000, 2, 32, 5e-3, 4, 3, 5.0, 42L, 0.1, 0.1, 0.0);
  }

  public RerankerConfig withSizes(int embedding, int hidden) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withEpochs(int maxEpochs, int patience) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withBatchSize(int batchSize) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withVocabulary(int vocabCap, int minCount) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withSeed(long seed) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withLearningRate(double learningRate) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  public RerankerConfig withMaxTokens(int maxQuestionTokens, int maxAnswerTokens) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, selfNormalization);
  }

  /** The same with the output layer trained self-normalised at weight {@code alpha} (0: plain softmax). */
  public RerankerConfig withSelfNormalization(double alpha) {
    return new RerankerConfig(embedding, hidden, maxQuestionTokens, maxAnswerTokens, vocabCap, minCount, batchSize,
        learningRate, maxEpochs, patience, clipNorm, seed, validationShare, unconditionalShare, alpha);
  }

  /** The key of {@link #selfNormalization} in {@code config.properties}. */
  public static final String SELF_NORMALIZATION = "selfNormalization";

  /**
   * A configuration read from a version's or a checkpoint's properties, strictly as {@link
   * PropertiesRecords#toRecord} reads, except that a file written before {@link #selfNormalization}
   * existed (no such key) reads as 0: those networks were trained with plain softmax and keep their
   * exact scores.
   */
  public static RerankerConfig fromProperties(java.util.Properties properties, java.nio.file.Path file) {
    java.util.Properties copy = new java.util.Properties();
    copy.putAll(properties);
    copy.putIfAbsent(SELF_NORMALIZATION, "0.0");
    return PropertiesRecords.toRecord(copy, RerankerConfig.class, file);
  }

  /** What the network is built from: its sizes, the weight seed, Adam's step and the clipping norm. */
  public NetworkSettings network(int vocabularySize) {
    return new NetworkSettings(embedding, hidden, vocabularySize, seed, learningRate, clipNorm, selfNormalization);
  }

  private static void positive(String name, int value) {
    if (value <= 0) {
      throw new IllegalArgumentException(name + " must be positive, was " + value);
    }
  }
}
