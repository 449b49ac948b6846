package org.precedent.engine.rerank.net;

/**
 * What building the network needs to know, and no more: its sizes and the settings fixed into it when
 * it is made (the weight seed, Adam's step size, the gradient clipping norm). A reranker's whole
 * configuration, with its batch sizes and epochs, lives above this package and hands these down, so
 * the network does not depend on the code that uses it.
 *
 * @param embedding      token embedding width
 * @param hidden         LSTM width of encoder and decoder (and of the attention projections)
 * @param vocabularySize entries of the vocabulary, special tokens included: the output softmax's width
 * @param seed           seeds the initial weights
 * @param learningRate   Adam step size
 * @param clipNorm       L2 norm above which each layer's gradient is scaled down
 * @param selfNormalization weight of the output layer's (log Z)^2 penalty ({@link SelfNormalizedLoss});
 *                       0 is plain softmax cross-entropy
 */
public record NetworkSettings(int embedding, int hidden, int vocabularySize, long seed, double learningRate,
    double clipNorm, double selfNormalization) {

  public NetworkSettings {
    if (embedding <= 0 || hidden <= 0 || vocabularySize <= 0) {
      throw new IllegalArgumentException("network sizes must be positive; got embedding " + embedding
          + ", hidden " + hidden + ", vocabulary " + vocabularySize);
    }
    if (!(learningRate > 0) || !(clipNorm > 0)) {
      throw new IllegalArgumentException("learningRate and clipNorm must be positive; got " + learningRate
          + " and " + clipNorm);
    }
    if (!(selfNormalization >= 0) || Double.isInfinite(selfNormalization)) {
      throw new IllegalArgumentException("selfNormalization must be 0 or more; got " + selfNormalization);
    }
  }
}
