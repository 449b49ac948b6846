package org.precedent.engine.rerank.net;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.activations.IActivation;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.lossfunctions.impl.LossSparseMCXENT;

/**
 * The self-normalised loss, L = -log softmax(z)_y + alpha (log Z)^2 (Devlin et al. 2014, "Fast and
 * Robust Neural Network Joint Models for Statistical Machine Translation", ACL 2014, section
 * "Self-Normalization"), against a worked example computed by hand from that formula, its gradient
 * against central finite differences of the loss itself, and, at alpha 0, against DL4J's own sparse
 * cross-entropy over softmax (the reference library's loss the plain network trains with).
 */
class SelfNormalizedLossTest {

  private static final IActivation IDENTITY = Activation.IDENTITY.getActivationFunction();

  @Test
  void workedExampleFromTheFormula() {
    // z = (1, 2, 3): Z = e + e^2 + e^3 = e^3 (1 + e^-1 + e^-2) = e^3 * 1.5032147, log Z = 3.4076060;
    // y = 0: L = log Z - z_0 + 0.1 (log Z)^2 = 2.4076060 + 0.1 * 11.6117785 = 3.5687838;
    // y = 2: L = 0.4076060 + 1.1611778 = 1.5687838 (by hand from the formula, checked to 7 digits)
    INDArray z = Nd4j.create(new double[][] {{1, 2, 3}, {1, 2, 3}});
    INDArray labels = Nd4j.create(new double[][] {{0}, {2}});
    SelfNormalizedLoss loss = new SelfNormalizedLoss(0.1);
    INDArray scores = loss.computeScoreArray(labels, z, IDENTITY, null);
    assertEquals(3.5687838, scores.getDouble(0, 0), 1e-6);
    assertEquals(1.5687838, scores.getDouble(1, 0), 1e-6);
    assertEquals((3.5687838 + 1.5687838) / 2, loss.computeScore(labels, z, IDENTITY, null, true), 1e-6);
    // dL/dz for y = 0: softmax (1 + 2 * 0.1 * log Z) - onehot: softmax = (0.0900306, 0.2447285,
    // 0.6652410), times 1.6815212 = (0.1513883, 0.4115161, 1.1186168), minus (1, 0, 0)
    INDArray gradient = loss.computeGradient(labels, z, IDENTITY, null);
    assertEquals(-0.8486117, gradient.getDouble(0, 0), 1e-6);
    assertEquals(0.4115161, gradient.getDouble(0, 1), 1e-6);
    assertEquals(1.1186168, gradient.getDouble(0, 2), 1e-6);
  }

  @Test
  void gradientMatchesFiniteDifferencesAndMaskedRowsAreZero() {
    Random random = new Random(3);
    int rows = 5;
    int width = 7;
    INDArray z = Nd4j.create(DataType.DOUBLE, rows, width);
    INDArray labels = Nd4j.create(DataType.DOUBLE, rows, 1);
    for (int r = 0; r < rows; r++) {
      labels.putScalar(r, 0, random.nextInt(width));
      for (int j = 0; j < width; j++) {
        z.putScalar(r, j, 3 * random.nextGaussian());
      }
    }
    INDArray mask = Nd4j.create(new double[][] {{1}, {1}, {0}, {1}, {1}});
    SelfNormalizedLoss loss = new SelfNormalizedLoss(0.5);
    INDArray analytic = loss.computeGradient(labels, z, IDENTITY, mask);
    double h = 1e-6; // central differences in double: error O(h^2), rounding O(1e-16 / h)
    for (int r = 0; r < rows; r++) {
      for (int j = 0; j < width; j++) {
        double saved = z.getDouble(r, j);
        z.putScalar(r, j, saved + h);
        double up = loss.computeScore(labels, z, IDENTITY, mask, false);
        z.putScalar(r, j, saved - h);
        double down = loss.computeScore(labels, z, IDENTITY, mask, false);
        z.putScalar(r, j, saved);
        assertEquals((up - down) / (2 * h), analytic.getDouble(r, j), 1e-6, "row " + r + ", word " + j);
      }
    }
    for (int j = 0; j < width; j++) {
      assertEquals(0, Math.abs(analytic.getDouble(2, j)), "a masked step has no gradient");
    }
    assertEquals(0, loss.computeScoreArray(labels, z, IDENTITY, mask).getDouble(2, 0), "nor a loss");
    var both = loss.computeGradientAndScore(labels, z, IDENTITY, mask, true);
    assertEquals(loss.computeScore(labels, z, IDENTITY, mask, true), both.getFirst(), 1e-12);
    assertEquals(analytic, both.getSecond());
  }

  @Test
  void withoutThePenaltyItIsDl4jsCrossEntropyOverSoftmax() {
    Random random = new Random(5);
    INDArray z = Nd4j.create(DataType.DOUBLE, 4, 6);
    INDArray labels = Nd4j.create(DataType.DOUBLE, 4, 1);
    for (int r = 0; r < 4; r++) {
      labels.putScalar(r, 0, random.nextInt(6));
      for (int j = 0; j < 6; j++) {
        z.putScalar(r, j, 2 * random.nextGaussian());
      }
    }
    INDArray mask = Nd4j.create(new double[][] {{1}, {0}, {1}, {1}});
    IActivation softmax = Activation.SOFTMAX.getActivationFunction();
    LossSparseMCXENT reference = new LossSparseMCXENT();
    SelfNormalizedLoss plain = new SelfNormalizedLoss(0);
    assertEquals(reference.computeScore(labels, z, softmax, mask, true),
        plain.computeScore(labels, z, IDENTITY, mask, true), 1e-9);
    INDArray expected = reference.computeGradient(labels, z, softmax, mask);
    INDArray actual = plain.computeGradient(labels, z, IDENTITY, mask);
    for (int r = 0; r < 4; r++) {
      for (int j = 0; j < 6; j++) {
        assertEquals(expected.getDouble(r, j), actual.getDouble(r, j), 1e-9, "row " + r + ", word " + j);
      }
    }
  }

  @Test
  void refusesANegativeWeightAndALabelOutsideTheOutputs() {
    assertThrows(IllegalArgumentException.class, () -> new SelfNormalizedLoss(-0.1));
    INDArray z = Nd4j.create(new double[][] {{1, 2, 3}});
    assertThrows(IllegalArgumentException.class, () -> new SelfNormalizedLoss(0.1)
        .computeScoreArray(Nd4j.create(new double[][] {{3}}), z, IDENTITY, null));
  }
}
