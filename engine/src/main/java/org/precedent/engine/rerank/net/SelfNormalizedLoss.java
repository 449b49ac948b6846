package org.precedent.engine.rerank.net;

import org.nd4j.common.primitives.Pair;
import org.nd4j.linalg.activations.IActivation;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.api.ops.impl.transforms.custom.SoftMax;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.lossfunctions.ILossFunction;
import org.nd4j.linalg.ops.transforms.Transforms;

/**
 * Cross-entropy over the vocabulary with a penalty that keeps the softmax's normaliser near 1, so
 * that a trained network's raw output z_y (the output layer's logit of the target word, bias
 * included) is itself close to log P(y): self-normalisation as Devlin et al. 2014 train it ("Fast
 * and Robust Neural Network Joint Models for Statistical Machine Translation", ACL 2014, section
 * "Self-Normalization", their equation for the training objective):
 *
 * <pre>
 *   L = -log softmax(z)_y + alpha (log Z)^2,    Z = sum_j exp(z_j)
 *   dL/dz = softmax(z) - onehot(y) + 2 alpha log Z softmax(z)
 * </pre>
 *
 * (the first two terms are the usual cross-entropy gradient; d log Z / dz = softmax(z), so the
 * penalty adds 2 alpha log Z times it). With log Z = 0, -log softmax(z)_y = -z_y, which is what
 * {@link InferencePass} reads for a self-normalised version instead of multiplying the decoder's
 * state by the whole vocabulary.
 *
 * <p>Used by the output layer with the identity activation, so the network's output is the logits.
 * Labels are word indices, one per row ([rows, 1]), as for DL4J's {@code LossSparseMCXENT}; a
 * mask ([rows, 1], the padded answer steps 0) zeroes a row's loss and gradient, as there. The
 * average is over all rows, masked ones included, again as {@code LossSparseMCXENT} averages.
 * The arithmetic is in the logits' data type; log Z is taken after subtracting each row's largest
 * logit so that exp cannot overflow.
 */
public final class SelfNormalizedLoss implements ILossFunction {
  private static final long serialVersionUID = 1L;

  // Not final and with a no-argument constructor: DL4J stores the loss in the network's JSON
  // configuration inside model.zip and makes it again from there when the model is read.
  private double alpha;

  public SelfNormalizedLoss() {
    this(0.1);
  }

  /** @param alpha weight of (log Z)^2; 0 gives plain cross-entropy on logits */
  public SelfNormalizedLoss(double alpha) {
    if (!(alpha >= 0) || Double.isInfinite(alpha)) {
      throw new IllegalArgumentException("the self-normalisation weight must be at least 0, was " + alpha);
    }
    this.alpha = alpha;
  }

  public double getAlpha() {
    return alpha;
  }

  /** Per row: log Z, softmax(z) and the loss; masked rows keep their values here, zeroed by callers. */
  private record Parts(INDArray logZ, INDArray softmax, INDArray loss) {}

  private Parts parts(INDArray labels, INDArray preOutput, IActivation activationFn) {
    INDArray z = activationFn.getActivation(preOutput.dup(), true);
    long rows = z.size(0);
    long width = z.size(1);
    if (labels.size(0) != rows || labels.size(1) != 1) {
      throw new IllegalArgumentException("labels must be one word index per row: [" + rows + ", 1], were "
          + java.util.Arrays.toString(labels.shape()));
    }
    INDArray max = z.max(true, 1);
    INDArray shifted = z.subColumnVector(max);
    INDArray logZ = Transforms.log(Transforms.exp(shifted, true).sum(true, 1), false).addi(max);
    INDArray softmax = Nd4j.getExecutioner().exec(new SoftMax(z.dup()))[0];
    INDArray target = Nd4j.create(z.dataType(), rows, 1);
    for (long r = 0; r < rows; r++) {
      long y = labels.getLong(r, 0);
      if (y < 0 || y >= width) {
        throw new IllegalArgumentException("label " + y + " of row " + r + " outside the " + width + " outputs");
      }
      target.putScalar(r, 0, z.getDouble(r, y));
    }
    INDArray loss = logZ.sub(target).addi(logZ.mul(logZ).muli(alpha));
    return new Parts(logZ, softmax, loss);
  }

  private static INDArray masked(INDArray perRow, INDArray mask) {
    if (mask == null) {
      return perRow;
    }
    if (mask.length() != perRow.size(0)) {
      throw new IllegalArgumentException("mask must hold one value per row (" + perRow.size(0) + "), held "
          + mask.length());
    }
    return perRow.mulColumnVector(mask.reshape(perRow.size(0), 1).castTo(perRow.dataType()));
  }

  @Override
  public INDArray computeScoreArray(INDArray labels, INDArray preOutput, IActivation activationFn, INDArray mask) {
    return masked(parts(labels, preOutput, activationFn).loss(), mask);
  }

  @Override
  public double computeScore(INDArray labels, INDArray preOutput, IActivation activationFn, INDArray mask,
      boolean average) {
    INDArray scores = computeScoreArray(labels, preOutput, activationFn, mask);
    double sum = scores.sumNumber().doubleValue();
    return average ? sum / scores.size(0) : sum;
  }

  @Override
  public INDArray computeGradient(INDArray labels, INDArray preOutput, IActivation activationFn, INDArray mask) {
    return gradient(parts(labels, preOutput, activationFn), labels, preOutput, activationFn, mask);
  }

  private INDArray gradient(Parts parts, INDArray labels, INDArray preOutput, IActivation activationFn,
      INDArray mask) {
    // softmax (1 + 2 alpha log Z) - onehot(y)
    INDArray dz = parts.softmax().mulColumnVector(parts.logZ().mul(2 * alpha).addi(1));
    for (long r = 0; r < dz.size(0); r++) {
      long y = labels.getLong(r, 0);
      dz.putScalar(r, y, dz.getDouble(r, y) - 1);
    }
    dz = masked(dz, mask);
    return activationFn.backprop(preOutput.dup(), dz).getFirst();
  }

  @Override
  public Pair<Double, INDArray> computeGradientAndScore(INDArray labels, INDArray preOutput,
      IActivation activationFn, INDArray mask, boolean average) {
    Parts parts = parts(labels, preOutput, activationFn);
    INDArray scores = masked(parts.loss(), mask);
    double sum = scores.sumNumber().doubleValue();
    return new Pair<>(average ? sum / scores.size(0) : sum,
        gradient(parts, labels, preOutput, activationFn, mask));
  }

  @Override
  public String name() {
    return "SelfNormalizedLoss(alpha=" + alpha + ")";
  }

  @Override
  public String toString() {
    return name();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SelfNormalizedLoss other && Double.compare(other.alpha, alpha) == 0;
  }

  @Override
  public int hashCode() {
    return Double.hashCode(alpha);
  }
}
