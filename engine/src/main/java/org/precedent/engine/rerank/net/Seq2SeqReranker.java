package org.precedent.engine.rerank.net;

import org.deeplearning4j.nn.conf.ComputationGraphConfiguration;
import org.deeplearning4j.nn.conf.GradientNormalization;
import org.deeplearning4j.nn.conf.NeuralNetConfiguration;
import org.deeplearning4j.nn.conf.RNNFormat;
import org.deeplearning4j.nn.conf.WorkspaceMode;
import org.deeplearning4j.nn.conf.graph.AttentionVertex;
import org.deeplearning4j.nn.conf.graph.MergeVertex;
import org.deeplearning4j.nn.conf.graph.rnn.DuplicateToTimeSeriesVertex;
import org.deeplearning4j.nn.conf.graph.rnn.LastTimeStepVertex;
import org.deeplearning4j.nn.conf.layers.EmbeddingSequenceLayer;
import org.deeplearning4j.nn.conf.layers.LSTM;
import org.deeplearning4j.nn.conf.layers.RnnOutputLayer;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.deeplearning4j.nn.weights.WeightInit;
import org.nd4j.linalg.activations.Activation;
import org.nd4j.linalg.learning.config.Adam;
import org.nd4j.linalg.lossfunctions.impl.LossSparseMCXENT;

/**
 * The reranker network: an attentional encoder-decoder that gives P(answer | question) token by token.
 *
 * <pre>
 * question ids -> embedding -> LSTM encoder ----------------------------+ keys = values
 *                                   | state at the last real token      |
 *                                   v (repeated at every answer step)   v
 * &lt;s&gt; a1 .. an -> embedding -> [concat] -> LSTM decoder -> queries -> attention
 *                                                  |                        |
 *                                                  +------- [concat] -------+-> softmax over vocabulary
 * </pre>
 *
 * <p>The decoder is teacher-forced: its input is the answer shifted right by a start token, and it is
 * trained to emit a1 .. an then the end token. DL4J's graph cannot seed the decoder LSTM's initial state
 * from the encoder, so the encoder's final state is fed as an extra input at every decoder step instead.
 *
 * <p>Attention is DL4J's {@link AttentionVertex}: scaled dot-product attention, softmax(Q K^T / sqrt(d)) V
 * (Vaswani et al. 2017, "Attention Is All You Need", eq. 1), single head. With {@code projectInput(true)}
 * queries, keys and values first pass through learned matrices Wq, Wk, Wv and the result through Wo,
 * as in that paper's multi-head form; the vertex masks padded encoder steps out of the softmax.
 * (Checked in DL4J's source, conf/graph/AttentionVertex.java: it calls multiHeadDotProductAttention with
 * scaled=true when projecting, dotProductAttention with scaled=true otherwise.)
 *
 * <p>Both LSTMs are DL4J's {@code LSTM} (no peephole connections), not {@code GravesLSTM}.
 */
public final class Seq2SeqReranker {

  public static final String QUESTION = "question";
  public static final String ANSWER_IN = "answerIn";
  public static final String QUESTION_EMBEDDING = "questionEmbedding";
  public static final String ANSWER_EMBEDDING = "answerEmbedding";
  public static final String ENCODER = "encoder";
  public static final String DECODER = "decoder";
  public static final String ATTENTION = "attention";
  public static final String OUTPUT = "output";

  private Seq2SeqReranker() {}

  /**
   * A freshly initialised network.
   *
   * <p>Gradients are clipped per layer by L2 norm ({@link GradientNormalization#ClipL2PerLayer}): a layer
   * whose gradient norm exceeds {@code clipNorm} has it scaled down to that norm, which keeps the
   * direction and tames the occasional exploding step of recurrent nets.
   */
  public static ComputationGraph create(NetworkSettings settings) {
    int e = settings.embedding();
    int h = settings.hidden();
    int vocabularySize = settings.vocabularySize();
    ComputationGraphConfiguration conf = new NeuralNetConfiguration.Builder()
        .seed(settings.seed())
        .updater(new Adam(settings.learningRate()))
        .weightInit(WeightInit.XAVIER)
        .gradientNormalization(GradientNormalization.ClipL2PerLayer)
        .gradientNormalizationThreshold(settings.clipNorm())
        .trainingWorkspaceMode(WorkspaceMode.ENABLED)
        .inferenceWorkspaceMode(WorkspaceMode.ENABLED)
        .graphBuilder()
        .addInputs(QUESTION, ANSWER_IN)
        .addLayer(QUESTION_EMBEDDING, new EmbeddingSequenceLayer.Builder()
            .nIn(vocabularySize).nOut(e).hasBias(false).build(), QUESTION)
        .addLayer(ANSWER_EMBEDDING, new EmbeddingSequenceLayer.Builder()
            .nIn(vocabularySize).nOut(e).hasBias(false).build(), ANSWER_IN)
        .addLayer(ENCODER, new LSTM.Builder().nIn(e).nOut(h).activation(Activation.TANH).build(),
            QUESTION_EMBEDDING)
        .addVertex("encoderLast", new LastTimeStepVertex(QUESTION), ENCODER)
        .addVertex("encoderRepeated", new DuplicateToTimeSeriesVertex(ANSWER_IN), "encoderLast")
        .addVertex("decoderIn", new MergeVertex(), ANSWER_EMBEDDING, "encoderRepeated")
        .addLayer(DECODER, new LSTM.Builder().nIn(e + h).nOut(h).activation(Activation.TANH).build(), "decoderIn")
        .addVertex(ATTENTION, new AttentionVertex.Builder()
            .nInQueries(h).nInKeys(h).nInValues(h).nOut(h).nHeads(1).projectInput(true).build(),
            DECODER, ENCODER, ENCODER)
        .addVertex("decoderAndContext", new MergeVertex(), DECODER, ATTENTION)
        .addLayer(OUTPUT, outputLayer(settings, 2 * h), "decoderAndContext")
        .setOutputs(OUTPUT)
        .build();
    ComputationGraph graph = new ComputationGraph(conf);
    graph.init();
    return graph;
  }

  /**
   * Softmax with cross-entropy, or, for a self-normalised network, the identity with {@link
   * SelfNormalizedLoss}: its output is then the logits, which {@link LogLikelihoods#forward} turns
   * into the same probabilities.
   */
  private static RnnOutputLayer outputLayer(NetworkSettings settings, int nIn) {
    double alpha = settings.selfNormalization();
    RnnOutputLayer.Builder builder = alpha > 0
        ? new RnnOutputLayer.Builder(new SelfNormalizedLoss(alpha)).activation(Activation.IDENTITY)
        : new RnnOutputLayer.Builder(new LossSparseMCXENT()).activation(Activation.SOFTMAX);
    return builder.nIn(nIn).nOut(settings.vocabularySize()).dataFormat(RNNFormat.NCW).build();
  }

  /**
   * The weight of the self-normalisation penalty the network's output layer was built with, 0 when
   * it is plain softmax (then its output is probabilities, else logits).
   */
  public static double selfNormalization(ComputationGraph graph) {
    var layer = graph.getLayer(OUTPUT).conf().getLayer();
    if (layer instanceof RnnOutputLayer output && output.getLossFn() instanceof SelfNormalizedLoss loss) {
      return loss.getAlpha();
    }
    return 0;
  }

  /** The vocabulary size a network was built for (rows of its question embedding). */
  public static long vocabularySize(ComputationGraph graph) {
    return ((EmbeddingSequenceLayer) graph.getLayer(QUESTION_EMBEDDING).conf().getLayer()).getNIn();
  }
}
