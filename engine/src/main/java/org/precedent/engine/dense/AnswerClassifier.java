package org.precedent.engine.dense;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.api.memory.MemoryWorkspace;
import org.nd4j.linalg.api.memory.conf.WorkspaceConfiguration;
import org.nd4j.linalg.api.memory.enums.AllocationPolicy;
import org.nd4j.linalg.api.memory.enums.LearningPolicy;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.ops.transforms.Transforms;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;

/**
 * Which answer group a question belongs to, from its frozen sentence-encoder vector alone: a
 * multinomial logistic regression (softmax regression; Bishop 2006, Pattern Recognition and
 * Machine Learning, section 4.3.4) over standardised vector components, with an L2 penalty on the
 * weights. Its probability of a candidate's group is one of the dense leg's fusion features.
 *
 * <p>Fitted by {@code train} on the stored tickets fusion does not ask (the reranker split), so
 * that the fusion questions it is used on are not what it learnt from. Saved as {@code dense.json} in the model version with the encoder that made
 * the vectors: a classifier must not read vectors of another encoder.
 *
 * @param encoder the encoder's name and model-file SHA-256, as the knowledge's manifest has them
 * @param groups  the answer groups it tells apart, in the order of the weights' columns
 * @param mean    each vector component's mean over the training vectors
 * @param scale   each component's standard deviation (1 where it was constant)
 * @param weights one row per component, one column per group, for standardised components
 * @param bias    one per group
 * @param lambda  the L2 penalty it was fitted with
 */
public record AnswerClassifier(String encoder, String encoderSha256, List<String> groups,
    double[] mean, double[] scale, double[][] weights, double[] bias, double lambda) {
  /** The file in a model version directory. */
  public static final String FILE = "dense.json";
  /**
   * The L2 penalty on standardised features: issue 8's probe found 1e-3 best on CLINC150
   * validation among the values it tried; kept here, not tuned again.
   */
  public static final double LAMBDA = 1e-3;
  /** Adam steps of the fit: enough for the gradient to settle on the data sets tried here. */
  static final int STEPS = 300;

  /** Sized by the first step, then reused: every step allocates the same arrays. */
  private static final WorkspaceConfiguration PER_STEP = WorkspaceConfiguration.builder()
      .policyAllocation(AllocationPolicy.STRICT).policyLearning(LearningPolicy.FIRST_LOOP).build();

  private static final ObjectMapper JSON = new ObjectMapper();

  public AnswerClassifier {
    Objects.requireNonNull(encoder, "encoder");
    Objects.requireNonNull(encoderSha256, "encoderSha256");
    groups = List.copyOf(groups);
    if (mean.length != scale.length || weights.length != mean.length || bias.length != groups.size()) {
      throw new IllegalArgumentException("a classifier of " + mean.length + " components and "
          + groups.size() + " groups with " + scale.length + " scales, " + weights.length
          + " weight rows and " + bias.length + " biases");
    }
    for (double[] row : weights) {
      if (row.length != groups.size()) {
        throw new IllegalArgumentException("a weight row of " + row.length + " for "
            + groups.size() + " groups");
      }
    }
  }

  /**
   * Fits on labelled vectors: minimises the mean cross-entropy plus {@code lambda / 2} times the
   * squared weights (biases unpenalised) with Adam (Kingma and Ba 2015; their default beta1 0.9,
   * beta2 0.999, epsilon 1e-8; step 0.05 is this project's choice), full batch.
   *
   * @param vectors one per example, all of one length
   * @param labels  each example's group
   */
  public static AnswerClassifier fit(String encoder, String encoderSha256, List<float[]> vectors,
      List<String> labels, double lambda) {
    return fit(encoder, encoderSha256, vectors, labels, lambda, Progress.silent());
  }

  /** As above, reporting the steps done (with rate and time left) to {@code progress}. */
  public static AnswerClassifier fit(String encoder, String encoderSha256, List<float[]> vectors,
      List<String> labels, double lambda, Progress progress) {
    if (vectors.size() != labels.size() || vectors.isEmpty()) {
      throw new IllegalArgumentException(vectors.size() + " vectors for " + labels.size()
          + " labels");
    }
    List<String> groups = labels.stream().distinct().sorted().toList();
    Map<String, Integer> column = new HashMap<>();
    for (int g = 0; g < groups.size(); g++) {
      column.put(groups.get(g), g);
    }
    int n = vectors.size();
    int d = vectors.get(0).length;
    int k = groups.size();
    double[] mean = new double[d];
    double[] scale = new double[d];
    for (float[] v : vectors) {
      if (v.length != d) {
        throw new IllegalArgumentException("vectors of lengths " + d + " and " + v.length);
      }
      for (int j = 0; j < d; j++) {
        mean[j] += v[j] / (double) n;
      }
    }
    for (float[] v : vectors) {
      for (int j = 0; j < d; j++) {
        scale[j] += (v[j] - mean[j]) * (v[j] - mean[j]) / n;
      }
    }
    for (int j = 0; j < d; j++) {
      scale[j] = scale[j] > 1e-24 ? Math.sqrt(scale[j]) : 1.0;
    }
    double[][] x = new double[n][d];
    double[][] y = new double[n][k];
    for (int i = 0; i < n; i++) {
      for (int j = 0; j < d; j++) {
        x[i][j] = (vectors.get(i)[j] - mean[j]) / scale[j];
      }
      y[i][column.get(labels.get(i))] = 1;
    }
    INDArray xs = Nd4j.create(x).castTo(DataType.DOUBLE);
    INDArray ys = Nd4j.create(y).castTo(DataType.DOUBLE);
    INDArray w = Nd4j.zeros(DataType.DOUBLE, d, k);
    INDArray b = Nd4j.zeros(DataType.DOUBLE, 1, k);
    INDArray mw = w.dup();
    INDArray vw = w.dup();
    INDArray mb = b.dup();
    INDArray vb = b.dup();
    double rate = 0.05;
    double beta1 = 0.9;
    double beta2 = 0.999;
    progress.total(STEPS);
    for (int step = 1; step <= STEPS; step++) {
      // Each step's arrays (a few of questions x groups) live in a workspace reused by the next
      // step. Left to the garbage collector, their native memory was freed only when the heap was
      // collected, which the small Java objects rarely prompt: fitting on CLINC150's 15,000
      // questions grew the process past 12 GB resident.
      try (MemoryWorkspace ws = Nd4j.getWorkspaceManager()
          .getAndActivateWorkspace(PER_STEP, "answer-classifier-step")) {
        INDArray[] grad = gradient(xs, ys, w, b, lambda);
        adam(w, grad[0], mw, vw, rate, beta1, beta2, step);
        adam(b, grad[1], mb, vb, rate, beta1, beta2, step);
      }
      progress.update(step);
    }
    progress.finish(STEPS);
    double[][] weights = w.toDoubleMatrix();
    double[] bias = b.toDoubleVector();
    return new AnswerClassifier(encoder, encoderSha256, groups, mean, scale, weights, bias, lambda);
  }

  /**
   * The gradient of the objective at {@code w}, {@code b}: {@code X^T (P - Y) / n + lambda W} and
   * the column sums of {@code (P - Y) / n} (Bishop 2006, eq. 4.109, averaged and penalised).
   */
  static INDArray[] gradient(INDArray x, INDArray y, INDArray w, INDArray b, double lambda) {
    long n = x.rows();
    INDArray z = x.mmul(w).addiRowVector(b);
    INDArray p = softmaxRows(z);
    INDArray diff = p.subi(y).divi(n);
    INDArray gw = x.transpose().mmul(diff).addi(w.mul(lambda));
    INDArray gb = diff.sum(true, 0);
    return new INDArray[] {gw, gb};
  }

  private static INDArray softmaxRows(INDArray z) {
    INDArray shifted = z.subColumnVector(z.max(true, 1));
    INDArray e = Transforms.exp(shifted, false);
    return e.diviColumnVector(e.sum(true, 1));
  }

  private static void adam(INDArray param, INDArray grad, INDArray m, INDArray v, double rate,
      double beta1, double beta2, int step) {
    m.muli(beta1).addi(grad.mul(1 - beta1));
    v.muli(beta2).addi(grad.mul(grad).muli(1 - beta2));
    double correction1 = 1 - Math.pow(beta1, step);
    double correction2 = 1 - Math.pow(beta2, step);
    INDArray update = m.div(correction1).divi(Transforms.sqrt(v.div(correction2), false)
        .addi(1e-8)).muli(rate);
    param.subi(update);
  }

  /** P(group | vector) for every group it knows, by group id. */
  public Map<String, Double> probabilities(float[] vector) {
    if (vector.length != mean.length) {
      throw new IllegalArgumentException("a vector of length " + vector.length
          + " for a classifier of " + mean.length);
    }
    int k = groups.size();
    double[] z = bias.clone();
    for (int j = 0; j < mean.length; j++) {
      double xj = (vector[j] - mean[j]) / scale[j];
      double[] row = weights[j];
      for (int g = 0; g < k; g++) {
        z[g] += xj * row[g];
      }
    }
    double max = Double.NEGATIVE_INFINITY;
    for (double v : z) {
      max = Math.max(max, v);
    }
    double sum = 0;
    for (int g = 0; g < k; g++) {
      z[g] = Math.exp(z[g] - max);
      sum += z[g];
    }
    Map<String, Double> out = new HashMap<>();
    for (int g = 0; g < k; g++) {
      out.put(groups.get(g), z[g] / sum);
    }
    return out;
  }

  /** The probability of each of {@code groups}, 0 for a group it never saw. */
  public List<Double> probabilities(float[] vector, List<String> ofGroups) {
    Map<String, Double> all = probabilities(vector);
    List<Double> out = new ArrayList<>(ofGroups.size());
    for (String g : ofGroups) {
      out.add(all.getOrDefault(g, 0.0));
    }
    return out;
  }

  public void save(Path versionDir) throws IOException {
    AtomicFiles.write(versionDir.resolve(FILE), out -> out.write(JSON.writeValueAsBytes(this)));
  }

  /** The classifier of a model version, or null when it was trained without a dense leg. */
  public static AnswerClassifier loadIfPresent(Path versionDir) throws IOException {
    Path file = versionDir.resolve(FILE);
    if (!Files.exists(file)) {
      return null;
    }
    try {
      return JSON.readValue(file.toFile(), AnswerClassifier.class);
    } catch (IOException | IllegalArgumentException e) {
      throw new ModelLoadException(file + ": unreadable answer classifier: "
          + String.valueOf(e.getMessage()).split("\n")[0], e);
    }
  }
}
