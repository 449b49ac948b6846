package org.precedent.engine.rerank.net;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.deeplearning4j.nn.conf.ComputationGraphConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.graph.AttentionVertex;
import org.deeplearning4j.nn.conf.layers.ActivationLayer;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * DL4J's {@link AttentionVertex} (as used by the reranker, here without the learned projections) against
 * scaled dot-product attention worked by hand: out_q = sum_k softmax_k(q . k_k / sqrt(d)) v_k
 * (Vaswani et al. 2017, "Attention Is All You Need", eq. 1), including a masked key, which must get
 * weight zero.
 */
class AttentionFormulaTest {

  private static final int D = 3;
  private static final int KEYS = 4;
  private static final int QUERIES = 2;

  private final double[][] q = {{0.2, -0.4, 0.9}, {1.1, 0.3, -0.5}};
  private final double[][] k = {{0.5, 0.1, -0.2}, {-0.3, 0.8, 0.4}, {0.9, -0.6, 0.0}, {0.1, 0.2, 0.3}};
  private final double[][] v = {{1.0, 0.0, 2.0}, {0.0, 1.0, -1.0}, {0.5, 0.5, 0.5}, {-2.0, 3.0, 1.0}};

  @Test
  void matchesSoftmaxOfScaledDotProducts() {
    check(KEYS);
  }

  @Test
  void maskedKeysGetNoWeight() {
    check(KEYS - 1);
  }

  private void check(int realKeys) {
    ComputationGraphConfiguration conf = new NeuralNetConfiguration.Builder().dataType(DataType.DOUBLE)
        .graphBuilder()
        .addInputs("q", "k", "v")
        .addVertex("attention", new AttentionVertex.Builder().nInQueries(D).nInKeys(D).nInValues(D).nOut(D)
            .nHeads(1).projectInput(false).build(), "q", "k", "v")
        .addLayer("out", new ActivationLayer.Builder().activation(Activation.IDENTITY).build(), "attention")
        .setOutputs("out")
        .build();
    ComputationGraph graph = new ComputationGraph(conf);
    graph.init();

    INDArray keyMask = Nd4j.ones(DataType.DOUBLE, 1, KEYS);
    for (int j = realKeys; j < KEYS; j++) {
      keyMask.putScalar(0, j, 0);
    }
    INDArray out = graph.output(false, new INDArray[] {layout(q), layout(k), layout(v)},
        new INDArray[] {null, keyMask, keyMask})[0]; // [1, D, QUERIES]

    for (int a = 0; a < QUERIES; a++) {
      double[] scores = new double[realKeys];
      double max = Double.NEGATIVE_INFINITY;
      for (int j = 0; j < realKeys; j++) {
        double dot = 0;
        for (int f = 0; f < D; f++) {
          dot += q[a][f] * k[j][f];
        }
        scores[j] = dot / Math.sqrt(D);
        max = Math.max(max, scores[j]);
      }
      double sum = 0;
      for (int j = 0; j < realKeys; j++) {
        scores[j] = Math.exp(scores[j] - max);
        sum += scores[j];
      }
      for (int f = 0; f < D; f++) {
        double expected = 0;
        for (int j = 0; j < realKeys; j++) {
          expected += scores[j] / sum * v[j][f];
        }
        assertEquals(expected, out.getDouble(0, f, a), 1e-9, "query " + a + " feature " + f);
      }
    }
  }

  /** Rows of vectors to DL4J's recurrent layout [batch 1, features, steps]. */
  private static INDArray layout(double[][] rows) {
    INDArray a = Nd4j.create(DataType.DOUBLE, 1, D, rows.length);
    for (int t = 0; t < rows.length; t++) {
      for (int f = 0; f < D; f++) {
        a.putScalar(new long[] {0, f, t}, rows[t][f]);
      }
    }
    return a;
  }
}
