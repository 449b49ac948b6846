package org.precedent.engine.rerank.net;

import org.deeplearning4j.nn.graph.ComputationGraph;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.api.ops.impl.transforms.custom.SoftMax;
import org.nd4j.linalg.factory.Nd4j;

/**
 * Log-likelihoods of the target tokens of a batch, read from the network's softmax output.
 *
 * <p>The output layer already applies softmax, so log P(token) is the log of the output value at the
 * target id. Summing logs of the softmax (rather than multiplying probabilities) keeps the sum finite
 * for long answers; a probability that underflowed to 0 in float is floored at {@link #MIN_PROBABILITY}
 * (smallest normal float, log ~ -87.3) so one impossible token gives a very low, finite score instead of
 * negative infinity. DL4J's own per-example scoring is not used: it failed on this graph with a
 * workspace error, and reading the output also gives per-token values.
 */
public final class LogLikelihoods {

  public static final double MIN_PROBABILITY = Float.MIN_NORMAL;

  private LogLikelihoods() {}

  /**
   * One forward pass, inference mode; returns the probabilities [rows, vocabulary, steps]. A
   * self-normalised network outputs logits; they are normalised here by the exact softmax over the
   * vocabulary (ND4J's, the op the plain network's output layer applies), so this stays the
   * reference for both kinds.
   */
  public static INDArray forward(ComputationGraph graph, EncodedBatch batch) {
    INDArray out = graph.output(false, batch.inputs(), batch.inputMasks())[0];
    if (Seq2SeqReranker.selfNormalization(graph) > 0) {
      Nd4j.getExecutioner().exec(new SoftMax(out, out, 1));
    }
    return out;
  }

  /** Sum over each row's target tokens (answer tokens and the end token) of log P(token). */
  public static double[] perRow(INDArray output, EncodedBatch batch) {
    double[] sums = new double[batch.rows()];
    for (int r = 0; r < batch.rows(); r++) {
      double sum = 0;
      for (int t = 0; t < batch.targetCount(r); t++) {
        sum += logOf(output.getDouble(r, batch.target(r, t), t));
      }
      sums[r] = sum;
    }
    return sums;
  }

  public static double logOf(double probability) {
    return Math.log(Math.max(probability, MIN_PROBABILITY));
  }
}
