package org.precedent.engine.rerank.net;

import org.deeplearning4j.nn.graph.ComputationGraph;
import org.nd4j.linalg.api.buffer.DataType;
import java.util.List;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.api.ops.impl.transforms.custom.SoftMax;
import org.nd4j.linalg.factory.Nd4j;
import org.nd4j.linalg.indexing.NDArrayIndex;
import org.nd4j.linalg.ops.transforms.Transforms;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * The reranker's forward pass for scoring only, mostly plain Java over the trained network's own
 * parameters (read once from the DL4J graph): the same function as {@code graph.output} followed by
 * {@link LogLikelihoods#perRow}, without DL4J's per-time-step overhead, which made about 95% of a
 * decision's time (an LSTM layer over 41 steps of 10 rows took 25-36 ms in DL4J, its arithmetic a
 * fraction of a millisecond).
 *
 * <p>DL4J stays the reference implementation: {@code InferencePassTest} compares the per-candidate
 * log-likelihoods of both on a trained model. Training still uses DL4J. What is done differently is
 * only the order of the arithmetic, never the function:
 * <ul>
 *   <li>The question is encoded once and shared by all the candidates (DL4J's batch repeats it per
 *       row).</li>
 *   <li>An embedding row followed by the LSTM's input weights is a fixed vector per token, so the
 *       input projections of every step are one table look-up ({@code embedding · W + b}, made once
 *       per model); the part of the decoder's input that is the encoder's last state is projected
 *       once per question.</li>
 *   <li>Scaled dot-product attention with projections (Vaswani et al. 2017, eq. 1, single head, as
 *       DL4J's {@code AttentionVertex} computes it with {@code projectInput}) is linear in the keys and
 *       values, so Wq, Wk, Wv, Wo and the output layer's context half are folded into per-question
 *       keys and per-question vocabulary rows: a decoder step then costs a dot product per question
 *       token and an output row per question token, not four matrix products.</li>
 *   <li>The output layer runs after the recurrences, for every step of every candidate at once: one
 *       ND4J matrix product (BLAS) and ND4J's softmax over the whole vocabulary, the same op DL4J's
 *       output layer applies, so the normalisation is exact; a log-probability is read and floored
 *       by {@link LogLikelihoods#logOf}, as before. These two calls are most of the arithmetic and
 *       run at the machine's matrix rate; the recurrences are small products in plain Java.</li>
 * </ul>
 *
 * <p>The gate order is DL4J's (LSTMHelpers, checked by {@code LstmGateEquationsTest}): columns [0,H)
 * the block input through tanh, [H,2H) the forget gate, [2H,3H) the output gate, [3H,4H) the input
 * gate, gates through sigmoid; {@code c = f*c' + i*z}, {@code h = o*tanh(c)}, zero initial state. A
 * row with padding in DL4J gives the same values as this unpadded pass: masked steps come after the
 * real ones, masked keys get weight zero, and the encoder's state is read at the last real step.
 *
 * <p>Immutable once made, so one instance serves every thread at once; a pass allocates its own
 * scratch arrays.
 */
public final class InferencePass {


  private final int hidden;
  private final int vocabulary;
  private final int gates;
  private final float[] encoderTable;   // [V][4H] question embedding · W + b
  private final float[] encoderRecurrent; // [H][4H]
  private final float[] decoderTable;   // [V][4H] answer embedding · W[0,E) + b
  private final float[] decoderFromState; // [H][4H] W[E,E+H): the encoder's last state
  private final float[] decoderRecurrent; // [H][4H]
  private final float[] queryWeights;   // [D][H] Wq
  private final float[] keyWeights;     // [D][H] Wk
  private final float[] valueWeights;   // [D][H] Wv
  private final float[] outWeights;     // [D][H] Wo
  private final INDArray decoderOutput; // [H][V] the output layer's rows for the decoder state
  private final INDArray contextOutput; // [H][V] its rows for the attention's output
  private final INDArray outputBias;    // [1][V]
  private final int head;
  private final boolean selfNormalized;
  private final float[] targetRows;     // [V][2H] the output layer's column per word, decoder half then context half
  private final float[] targetBias;     // [V]

  /**
   * The system property that makes a self-normalised version score exactly (the whole vocabulary's
   * product and softmax, as a plain version does), to measure what the approximation changes.
   */
  public static final String EXACT_PROPERTY = "precedent.reranker.exact";

  private InferencePass(ComputationGraph graph) {
    INDArray questionEmbedding = param(graph, Seq2SeqReranker.QUESTION_EMBEDDING, "W");
    INDArray answerEmbedding = param(graph, Seq2SeqReranker.ANSWER_EMBEDDING, "W");
    INDArray encoderW = param(graph, Seq2SeqReranker.ENCODER, "W");
    INDArray decoderW = param(graph, Seq2SeqReranker.DECODER, "W");
    int embedding = (int) questionEmbedding.size(1);
    vocabulary = (int) questionEmbedding.size(0);
    hidden = (int) param(graph, Seq2SeqReranker.ENCODER, "RW").size(0);
    gates = 4 * hidden;
    encoderTable = table(rowMajor(questionEmbedding), rowMajor(encoderW), 0, embedding,
        rowMajor(param(graph, Seq2SeqReranker.ENCODER, "b")));
    encoderRecurrent = rowMajor(param(graph, Seq2SeqReranker.ENCODER, "RW"));
    float[] decoderInput = rowMajor(decoderW);
    decoderTable = table(rowMajor(answerEmbedding), decoderInput, 0, embedding,
        rowMajor(param(graph, Seq2SeqReranker.DECODER, "b")));
    decoderFromState = new float[hidden * gates];
    System.arraycopy(decoderInput, embedding * gates, decoderFromState, 0, hidden * gates);
    decoderRecurrent = rowMajor(param(graph, Seq2SeqReranker.DECODER, "RW"));
    INDArray wq = attention(graph, "Wq");
    head = (int) wq.size(1);
    queryWeights = rowMajor(wq);
    keyWeights = rowMajor(attention(graph, "Wk"));
    valueWeights = rowMajor(attention(graph, "Wv"));
    outWeights = rowMajor(attention(graph, "Wo"));
    INDArray output = param(graph, Seq2SeqReranker.OUTPUT, "W").castTo(DataType.FLOAT);
    decoderOutput = output.get(NDArrayIndex.interval(0, hidden), NDArrayIndex.all()).dup('c');
    contextOutput = output.get(NDArrayIndex.interval(hidden, 2 * hidden), NDArrayIndex.all()).dup('c');
    outputBias = param(graph, Seq2SeqReranker.OUTPUT, "b").castTo(DataType.FLOAT).dup('c')
        .reshape(1, vocabulary);
    selfNormalized = Seq2SeqReranker.selfNormalization(graph) > 0;
    targetRows = selfNormalized ? rowMajor(output.transpose()) : null;
    targetBias = selfNormalized ? rowMajor(outputBias) : null;
    if (output.size(1) != vocabulary || wq.size(0) != 1) {
      throw new IllegalArgumentException("network does not have the reranker's shape: output "
          + output.size(1) + " wide for a vocabulary of " + vocabulary + ", " + wq.size(0) + " heads");
    }
  }

  /** Reads the parameters of a reranker network made by {@link Seq2SeqReranker#create}. */
  public static InferencePass of(ComputationGraph graph) {
    return new InferencePass(graph);
  }

  /**
   * Whether the network was trained self-normalised, so that {@link #logLikelihoods} reads each
   * target word's logit as its log-probability unless asked for exact scores.
   */
  public boolean selfNormalized() {
    return selfNormalized;
  }

  /** Whether {@value #EXACT_PROPERTY} asks for exact scores of self-normalised versions. */
  public static boolean exactRequested() {
    return Boolean.parseBoolean(System.getProperty(EXACT_PROPERTY, "false").strip());
  }

  /** The vocabulary size the network was trained with. */
  public int vocabularySize() {
    return vocabulary;
  }

  /**
   * Multiply-adds (2 FLOPs each) of one question of {@code questionSteps} and answers of the given
   * steps (tokens + 1): the recurrences, the folding of the attention per question, and per answer
   * step the attention and the output layer over hidden + question-step rows of the vocabulary.
   */
  public static double flops(int vocabulary, int hidden, int questionSteps, int[] answerSteps) {
    double h = hidden;
    double perQuestion = questionSteps * (2 * 4 * h * h + 4 * 2 * h * h + 2 * h * vocabulary);
    double total = perQuestion;
    for (int steps : answerSteps) {
      total += steps * (2 * 4 * h * h + 2 * questionSteps * h + 2 * (h + questionSteps) * vocabulary);
    }
    return total;
  }

  /** A question's encoder states, folded into what the decoder steps read. */
  public static final class EncodedQuestion {
    private final int steps;
    private final float[] stateGates; // [4H] the encoder's last state · decoder W[E,E+H)
    private final float[] keys;       // [T][H] Wq^T Wk enc_j / sqrt(D)
    private final float[] contexts;   // [T][H] Wo Wv enc_j: the attention's output is their weighted sum

    private EncodedQuestion(int steps, float[] stateGates, float[] keys, float[] contexts) {
      this.steps = steps;
      this.stateGates = stateGates;
      this.keys = keys;
      this.contexts = contexts;
    }
  }

  /**
   * [H+T][V]: the output layer's decoder half, then per question token output W[H,2H)^T Wo^T Wv
   * enc_j, so that one product gives every word's logit. Made only for exact scores: it is a
   * vocabulary-wide product per question, which self-normalised scores do without.
   */
  private INDArray outputRows(EncodedQuestion question) {
    int steps = question.steps;
    INDArray stacked = Nd4j.create(DataType.FLOAT, hidden + steps, vocabulary);
    stacked.get(NDArrayIndex.interval(0, hidden), NDArrayIndex.all()).assign(decoderOutput);
    INDArray contexts = Nd4j.create(question.contexts, new long[] {steps, hidden}, 'c');
    INDArray rows = contexts.mmul(contextOutput);
    stacked.get(NDArrayIndex.interval(hidden, hidden + steps), NDArrayIndex.all()).assign(rows);
    release(contexts, rows);
    return stacked;
  }

  /**
   * Frees arrays' native memory now. Left to the garbage collector, a scoring pass's arrays (its
   * logits alone are steps x vocabulary floats, megabytes a question) are freed only when the
   * small heap objects holding them are collected, which a large heap may put off for long.
   */
  private static void release(INDArray... arrays) {
    for (INDArray a : arrays) {
      if (a != null && a.closeable()) {
        a.close();
      }
    }
  }

  /** Encodes a question's ids (as {@link PairCodec#question} gives them, end token included). */
  public EncodedQuestion encode(int[] ids) {
    int steps = ids.length;
    if (steps == 0) {
      throw new IllegalArgumentException("a question has at least its end token");
    }
    float[] states = new float[steps * hidden];
    float[] h = new float[hidden];
    float[] c = new float[hidden];
    float[] pre = new float[gates];
    for (int t = 0; t < steps; t++) {
      System.arraycopy(encoderTable, checked(ids[t]) * gates, pre, 0, gates);
      step(pre, h, c, encoderRecurrent);
      System.arraycopy(h, 0, states, t * hidden, hidden);
    }
    float[] stateGates = new float[gates];
    axpyRows(stateGates, h, decoderFromState, gates);

    double scale = 1 / Math.sqrt(head);
    float[] keys = new float[steps * hidden];
    float[] contexts = new float[steps * hidden];
    double[] projected = new double[head];
    for (int j = 0; j < steps; j++) {
      // key j folded with Wq: score = h_dec . (Wq^T (Wk enc_j)) / sqrt(D)
      project(keyWeights, states, j * hidden, projected);
      for (int n = 0; n < hidden; n++) {
        double sum = 0;
        for (int i = 0; i < head; i++) {
          sum += queryWeights[i * hidden + n] * projected[i];
        }
        keys[j * hidden + n] = (float) (sum * scale);
      }
      // value j through Wo: the attention's output is the weighted sum of these
      project(valueWeights, states, j * hidden, projected);
      for (int m = 0; m < hidden; m++) {
        double sum = 0;
        for (int i = 0; i < head; i++) {
          sum += outWeights[i * hidden + m] * projected[i];
        }
        contexts[j * hidden + m] = (float) sum;
      }
    }
    return new EncodedQuestion(steps, stateGates, keys, contexts);
  }

  /**
   * Sum of log P(token) over the answer's tokens and the end token, given the question: what {@link
   * LogLikelihoods#perRow} gives for that row. {@code answer} holds the ids as {@link PairCodec#answer}
   * gives them (no start or end token).
   */
  public double logLikelihood(EncodedQuestion question, int[] answer) {
    return logLikelihoods(question, List.of(answer))[0];
  }

  /**
   * {@link #logLikelihood} of each answer: exact for a plain version, or when {@value
   * #EXACT_PROPERTY} is set; for a self-normalised one the sum of the target words' logits.
   */
  public double[] logLikelihoods(EncodedQuestion question, List<int[]> answers) {
    return logLikelihoods(question, answers, !selfNormalized || exactRequested());
  }

  /**
   * {@link #logLikelihood} of each answer. Exact: one output-layer product over the whole
   * vocabulary for every step of them all, and its softmax. Otherwise (a self-normalised version
   * only): log P(token) read as the token's logit z_y, its output column times the decoder state
   * and the attention's output plus its bias, 2H multiply-adds a step instead of (H+T)V; the
   * training penalty kept log Z near 0, and what is left of it is the approximation's error
   * ({@link #logNormalizers} measures it).
   */
  public double[] logLikelihoods(EncodedQuestion question, List<int[]> answers, boolean exact) {
    if (!exact && !selfNormalized) {
      throw new IllegalStateException("only a self-normalised network scores by logits alone");
    }
    float[] inputs = stepInputs(question, answers);
    int rows = inputs.length / (hidden + question.steps);
    return exact ? exactSums(question, answers, inputs, rows) : logitSums(question, answers, inputs);
  }

  /**
   * log Z of every target step of the answers, Z the sum of exp of the vocabulary's logits (the
   * softmax's normaliser; 0 is a perfectly self-normalised step), in the answers' order.
   */
  public double[] logNormalizers(EncodedQuestion question, List<int[]> answers) {
    float[] inputs = stepInputs(question, answers);
    int rows = inputs.length / (hidden + question.steps);
    INDArray logits = logits(question, inputs, rows);
    INDArray max = logits.max(true, 1);
    INDArray shifted = logits.subColumnVector(max);
    INDArray z = Transforms.log(Transforms.exp(shifted, false).sum(true, 1), false).addi(max);
    double[] out = z.castTo(DataType.DOUBLE).data().asDouble();
    release(logits, shifted, max, z);
    return out;
  }

  private INDArray logits(EncodedQuestion question, float[] inputs, int rows) {
    INDArray stepRows = Nd4j.create(inputs, new long[] {rows, hidden + question.steps}, 'c');
    INDArray outputRows = outputRows(question);
    INDArray logits = stepRows.mmul(outputRows);
    release(stepRows, outputRows);
    logits.addiRowVector(outputBias);
    return logits;
  }

  private double[] exactSums(EncodedQuestion question, List<int[]> answers, float[] inputs, int rows) {
    // the output layer for every step at once, and the softmax DL4J's output layer applies
    INDArray probabilities = logits(question, inputs, rows);
    Nd4j.getExecutioner().exec(new SoftMax(probabilities, probabilities)); // in place, as DL4J's softmax
    double[] out = sumOverTargets(answers,
        (row, target) -> LogLikelihoods.logOf(probabilities.getFloat(row, target)));
    release(probabilities);
    return out;
  }

  /** The log-probability one scoring way gives an answer's target word at one step (row). */
  private interface StepScore {
    double of(int row, int target);
  }

  /**
   * Each answer's sum of {@code score} over its target words and the end token, its steps taking
   * consecutive rows of the output layer's input, answer after answer.
   */
  private double[] sumOverTargets(List<int[]> answers, StepScore score) {
    double[] out = new double[answers.size()];
    int row = 0;
    for (int i = 0; i < answers.size(); i++) {
      int[] answer = answers.get(i);
      double total = 0;
      for (int t = 0; t <= answer.length; t++, row++) {
        total += score.of(row, t == answer.length ? Vocabulary.END_ID : checked(answer[t]));
      }
      out[i] = total;
    }
    return out;
  }

  /** The floor {@link LogLikelihoods#logOf} puts under an exact log-probability, kept for logits too. */
  private static final double LOG_FLOOR = Math.log(LogLikelihoods.MIN_PROBABILITY);

  private double[] logitSums(EncodedQuestion question, List<int[]> answers, float[] inputs) {
    int q = question.steps;
    int width = hidden + q;
    int twoH = 2 * hidden;
    float[] context = new float[hidden];
    return sumOverTargets(answers, (row, target) -> {
      int at = row * width;
      // the attention's output: its weights (after the decoder state in the row) over the contexts
      java.util.Arrays.fill(context, 0f);
      for (int j = 0; j < q; j++) {
        axpy(context, 0, inputs[at + hidden + j], question.contexts, j * hidden, hidden);
      }
      int column = target * twoH;
      double logit = targetBias[target];
      for (int n = 0; n < hidden; n++) {
        logit += inputs[at + n] * targetRows[column + n] + context[n] * targetRows[column + hidden + n];
      }
      return Math.max(logit, LOG_FLOOR);
    });
  }


  /**
   * The output layer's input for every target step of the answers, one row each: the decoder's
   * state [H], then the attention's weights over the question's steps [T].
   */
  private float[] stepInputs(EncodedQuestion question, List<int[]> answers) {
    int q = question.steps;
    int width = hidden + q;
    int rows = 0;
    for (int[] a : answers) {
      rows += a.length + 1;
    }
    // the output layer's input, one row per answer step: decoder state, then attention weights
    float[] inputs = new float[rows * width];
    float[] h = new float[hidden];
    float[] c = new float[hidden];
    float[] pre = new float[gates];
    double[] scores = new double[q];
    int row = 0;
    for (int[] answer : answers) {
      java.util.Arrays.fill(h, 0f);
      java.util.Arrays.fill(c, 0f);
      for (int t = 0; t <= answer.length; t++, row++) {
        int input = t == 0 ? Vocabulary.START_ID : checked(answer[t - 1]);
        int base = input * gates;
        for (int g = 0; g < gates; g++) {
          pre[g] = decoderTable[base + g] + question.stateGates[g];
        }
        step(pre, h, c, decoderRecurrent);
        System.arraycopy(h, 0, inputs, row * width, hidden);
        double max = Double.NEGATIVE_INFINITY;
        for (int j = 0; j < q; j++) {
          double sum = 0;
          int k = j * hidden;
          for (int n = 0; n < hidden; n++) {
            sum += h[n] * question.keys[k + n];
          }
          scores[j] = sum;
          max = Math.max(max, sum);
        }
        double sum = 0;
        for (int j = 0; j < q; j++) {
          scores[j] = Math.exp(scores[j] - max);
          sum += scores[j];
        }
        for (int j = 0; j < q; j++) {
          inputs[row * width + hidden + j] = (float) (scores[j] / sum);
        }
      }
    }
    return inputs;
  }

  /** One LSTM step: {@code pre} holds the input part of the gates and receives the recurrent part. */
  private void step(float[] pre, float[] h, float[] c, float[] recurrent) {
    axpyRows(pre, h, recurrent, gates);
    for (int n = 0; n < hidden; n++) {
      double z = tanh(pre[n]);
      double f = sigmoid(pre[hidden + n]);
      double o = sigmoid(pre[2 * hidden + n]);
      double i = sigmoid(pre[3 * hidden + n]);
      double cell = f * c[n] + i * z;
      c[n] = (float) cell;
      h[n] = (float) (o * tanh(c[n]));
    }
  }

  /** {@code out += x · M} for M [x.length][width] row-major. */
  private static void axpyRows(float[] out, float[] x, float[] m, int width) {
    for (int k = 0; k < x.length; k++) {
      axpy(out, 0, x[k], m, k * width, width);
    }
  }

  private static void axpy(float[] out, int at, float a, float[] row, int from, int n) {
    for (int v = 0; v < n; v++) {
      out[at + v] += a * row[from + v];
    }
  }

  /** {@code out = W x} for W [D][H] and x the H values at {@code at}. */
  private void project(float[] w, float[] x, int at, double[] out) {
    for (int i = 0; i < head; i++) {
      double sum = 0;
      int r = i * hidden;
      for (int n = 0; n < hidden; n++) {
        sum += w[r + n] * x[at + n];
      }
      out[i] = sum;
    }
  }

  /**
   * tanh through exp, which the JIT compiles to one instruction sequence ({@code Math.tanh} is not
   * an intrinsic in Java 17 and took a fifth of a pass); equal to it within double rounding, far
   * below the float the network computes in.
   */
  private static double tanh(double x) {
    if (x > 20) {
      return 1;
    }
    if (x < -20) {
      return -1;
    }
    double e = Math.exp(2 * x);
    return (e - 1) / (e + 1);
  }

  private static double sigmoid(double x) {
    return 1 / (1 + Math.exp(-x));
  }

  private int checked(int id) {
    if (id < 0 || id >= vocabulary) {
      throw new IllegalArgumentException("token id " + id + " outside the vocabulary of " + vocabulary);
    }
    return id;
  }

  /** {@code embedding · W[rows from, from + e) + b}: one row of input gates per token. */
  private float[] table(float[] embedding, float[] w, int from, int e, float[] bias) {
    float[] out = new float[vocabulary * gates];
    for (int token = 0; token < vocabulary; token++) {
      int o = token * gates;
      System.arraycopy(bias, 0, out, o, gates);
      for (int k = 0; k < e; k++) {
        axpy(out, o, embedding[token * e + k], w, (from + k) * gates, gates);
      }
    }
    return out;
  }

  private static INDArray param(ComputationGraph graph, String layer, String name) {
    INDArray p = graph.getLayer(layer).getParam(name);
    if (p == null) {
      throw new IllegalArgumentException("layer " + layer + " has no parameter " + name);
    }
    return p;
  }

  private static INDArray attention(ComputationGraph graph, String name) {
    INDArray p = graph.paramTable().get(Seq2SeqReranker.ATTENTION + "_" + name);
    if (p == null) {
      throw new IllegalArgumentException("attention has no parameter " + name + "; parameters: "
          + graph.paramTable().keySet());
    }
    return p;
  }

  /** The values in row-major order of the array's logical shape, whatever its storage order. */
  private static float[] rowMajor(INDArray a) {
    return a.castTo(DataType.FLOAT).dup('c').data().asFloat();
  }
}
