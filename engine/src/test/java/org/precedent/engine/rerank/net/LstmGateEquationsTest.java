package org.precedent.engine.rerank.net;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.deeplearning4j.nn.conf.MultiLayerConfiguration;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.layers.LSTM;
import org.deeplearning4j.nn.multilayer.MultiLayerNetwork;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;

/**
 * DL4J's {@code LSTM} layer (the one the reranker uses) against the LSTM equations worked by hand:
 * Hochreiter &amp; Schmidhuber 1997 with the forget gate of Gers, Schmidhuber &amp; Cummins 2000
 * ("Learning to Forget"), no peepholes:
 * <pre>
 *   z = tanh(W_z x + R_z h' + b_z)   block input
 *   i = sigmoid(W_i x + R_i h' + b_i) input gate
 *   f = sigmoid(W_f x + R_f h' + b_f) forget gate
 *   o = sigmoid(W_o x + R_o h' + b_o) output gate
 *   c = f * c' + i * z,  h = o * tanh(c)
 * </pre>
 * The order of the four blocks in DL4J's weight columns is taken from its source,
 * deeplearning4j-nn/.../nn/layers/recurrent/LSTMHelpers.java (activateHelper): columns [0,H) are the block
 * input (through the layer activation, tanh), [H,2H) the forget gate, [2H,3H) the output gate, [3H,4H) the
 * input gate (called "input modulation gate" there), gates through sigmoid.
 */
class LstmGateEquationsTest {

  private static final int IN = 2;
  private static final int H = 2;
  private static final int STEPS = 3;

  @Test
  void forwardPassMatchesTheGateEquations() {
    MultiLayerConfiguration conf = new NeuralNetConfiguration.Builder().dataType(DataType.DOUBLE).list()
        .layer(new LSTM.Builder().nIn(IN).nOut(H).activation(Activation.TANH)
            .gateActivationFunction(Activation.SIGMOID).build())
        .build();
    MultiLayerNetwork net = new MultiLayerNetwork(conf);
    net.init();

    // Small fixed weights, all different, so a swapped block or a transposed matrix shows.
    double[][] w = new double[IN][4 * H];
    double[][] r = new double[H][4 * H];
    double[] b = new double[4 * H];
    for (int c = 0; c < 4 * H; c++) {
      for (int k = 0; k < IN; k++) {
        w[k][c] = 0.1 * ((3 * k + 5 * c) % 7 - 3);
      }
      for (int k = 0; k < H; k++) {
        r[k][c] = 0.05 * ((2 * k + 3 * c) % 5 - 2);
      }
      b[c] = 0.02 * (c - 3);
    }
    net.getLayer(0).setParam("W", Nd4j.create(w));
    net.getLayer(0).setParam("RW", Nd4j.create(r));
    net.getLayer(0).setParam("b", Nd4j.create(b, new long[] {1, 4 * H}));

    double[][] x = {{0.5, -1.0}, {1.5, 0.25}, {-0.75, 2.0}};
    INDArray input = Nd4j.create(DataType.DOUBLE, 1, IN, STEPS);
    for (int t = 0; t < STEPS; t++) {
      for (int k = 0; k < IN; k++) {
        input.putScalar(new long[] {0, k, t}, x[t][k]);
      }
    }
    INDArray out = net.output(input); // [1, H, STEPS]

    double[] h = new double[H];
    double[] c = new double[H];
    for (int t = 0; t < STEPS; t++) {
      double[] pre = new double[4 * H];
      for (int col = 0; col < 4 * H; col++) {
        double s = b[col];
        for (int k = 0; k < IN; k++) {
          s += x[t][k] * w[k][col];
        }
        for (int k = 0; k < H; k++) {
          s += h[k] * r[k][col];
        }
        pre[col] = s;
      }
      double[] nextH = new double[H];
      for (int u = 0; u < H; u++) {
        double z = Math.tanh(pre[u]);
        double f = sigmoid(pre[H + u]);
        double o = sigmoid(pre[2 * H + u]);
        double i = sigmoid(pre[3 * H + u]);
        c[u] = f * c[u] + i * z;
        nextH[u] = o * Math.tanh(c[u]);
      }
      h = nextH;
      for (int u = 0; u < H; u++) {
        assertEquals(h[u], out.getDouble(0, u, t), 1e-9, "unit " + u + " step " + t);
      }
    }
  }

  private static double sigmoid(double v) {
    return 1 / (1 + Math.exp(-v));
  }
}
