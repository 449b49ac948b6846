package org.precedent.engine.rerank.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.deeplearning4j.util.ModelSerializer;
import org.nd4j.linalg.api.buffer.DataType;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.nd4j.linalg.factory.Nd4j;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.net.EncodedBatch;
import org.precedent.engine.rerank.net.InferencePass;
import org.precedent.engine.rerank.net.LogLikelihoods;
import org.precedent.engine.rerank.net.PairCodec;
import org.precedent.engine.rerank.net.Seq2SeqReranker;
import org.precedent.engine.rerank.tokens.Tokenizer;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * Measures the reranker at its default size on this machine and prints plain lines: training throughput,
 * scoring latency for 10 candidates, model size on disk, the machine's matrix-multiply rate, and how much of
 * that rate scoring achieves.
 *
 * <p>Text is synthetic (words drawn from a Zipf-like law over a full 4000-word vocabulary, questions of
 * 12-30 tokens, answers of 20-48), because speed depends on sizes, not on meaning. Run with one OpenMP
 * thread, as the service does:
 * <pre>
 * mvn -q -pl engine -am compile dependency:build-classpath -Dmdep.outputFile=target/cp.txt
 * OMP_NUM_THREADS=1 java -cp engine/target/classes:$(cat engine/target/cp.txt) \
 *     org.precedent.engine.rerank.bench.RerankerBenchmark [trainBatches] [scoreRepetitions]
 * </pre>
 */
public final class RerankerBenchmark {

  private static final int CANDIDATES = 10;

  private RerankerBenchmark() {}

  public static void main(String[] args) throws Exception {
    int trainBatches = args.length > 0 ? Integer.parseInt(args[0]) : 30;
    int repetitions = args.length > 1 ? Integer.parseInt(args[1]) : 200;
    RerankerConfig config = RerankerConfig.defaults();
    Random random = new Random(7);
    Vocabulary vocabulary = syntheticVocabulary(config.vocabCap());
    PairCodec codec = new PairCodec(new Tokenizer(), vocabulary, config.maxQuestionTokens(), config.maxAnswerTokens());
    ComputationGraph graph = Seq2SeqReranker.create(config.network(vocabulary.size()));
    line("reranker size: vocabulary %d, embedding %d, hidden %d, parameters %d", vocabulary.size(),
        config.embedding(), config.hidden(), graph.numParams());

    // Training throughput: fit() on batches of the default size, after a short warm-up.
    long tokens = 0;
    long start = 0;
    for (int b = -3; b < trainBatches; b++) {
      if (b == 0) {
        start = System.nanoTime();
      }
      List<PairCodec.Encoded> qs = new ArrayList<>();
      List<PairCodec.Encoded> as = new ArrayList<>();
      for (int r = 0; r < config.batchSize(); r++) {
        qs.add(codec.question(text(random, 12, 30)));
        as.add(codec.answer(text(random, 20, 48)));
      }
      EncodedBatch batch = new EncodedBatch(qs, as);
      graph.fit(batch.toDataSet());
      if (b >= 0) {
        tokens += batch.targetTokens();
      }
    }
    double trainSeconds = (System.nanoTime() - start) / 1e9;
    line("training: %.0f target tokens/s (%d batches of %d pairs, %.1f s)", tokens / trainSeconds, trainBatches,
        config.batchSize(), trainSeconds);

    Path file = Files.createTempFile("reranker-bench", ".zip");
    ModelSerializer.writeModel(graph, file.toFile(), false);
    line("model size on disk: %.1f MB (weights only)", Files.size(file) / 1e6);
    Files.delete(file);

    // Scoring latency: one question, 10 candidate answers, anti-LM on with P(answer) cached after warm-up.
    Scorer scorer = new Scorer(new RerankerModel(graph, vocabulary, config, 0.5), 1);
    String question = text(random, 20, 20);
    List<String> answers = new ArrayList<>();
    for (int i = 0; i < CANDIDATES; i++) {
      answers.add(text(random, 40, 40));
    }
    for (int i = 0; i < 20; i++) {
      scorer.score(question, answers);
    }
    double[] millis = new double[repetitions];
    for (int i = 0; i < repetitions; i++) {
      long t0 = System.nanoTime();
      scorer.score(question, answers);
      millis[i] = (System.nanoTime() - t0) / 1e6;
    }
    Arrays.sort(millis);
    double p50 = percentile(millis, 0.50);
    line("scoring %d candidates (question 20 tokens, answers 40): p50 %.1f ms, p99 %.1f ms over %d runs",
        CANDIDATES, p50, percentile(millis, 0.99), repetitions);

    selfNormalizedScoring(config, vocabulary, codec, question, answers, repetitions);

    // The same rows through DL4J's own forward pass (the reference the scorer is checked against,
    // and what the scorer ran before): one padded batch, the question repeated per row.
    List<PairCodec.Encoded> qs = new ArrayList<>();
    List<PairCodec.Encoded> as = new ArrayList<>();
    for (String a : answers) {
      qs.add(codec.question(question));
      as.add(codec.answer(a));
    }
    EncodedBatch batch = new EncodedBatch(qs, as);
    double[] reference = LogLikelihoods.perRow(LogLikelihoods.forward(graph, batch), batch);
    List<AnswerScore> fast = scorer.score(question, answers);
    double worst = 0;
    for (int i = 0; i < CANDIDATES; i++) {
      worst = Math.max(worst, Math.abs(reference[i] - fast.get(i).logLikelihood()));
    }
    int referenceRuns = Math.max(10, repetitions / 4);
    double[] dl4j = new double[referenceRuns];
    for (int i = -5; i < referenceRuns; i++) {
      long t0 = System.nanoTime();
      LogLikelihoods.perRow(LogLikelihoods.forward(graph, batch), batch);
      if (i >= 0) {
        dl4j[i] = (System.nanoTime() - t0) / 1e6;
      }
    }
    Arrays.sort(dl4j);
    double dl4jP50 = percentile(dl4j, 0.50);
    line("DL4J forward pass on the same %d rows (the reference): p50 %.1f ms, p99 %.1f ms over %d runs; "
        + "max |log-likelihood difference| %.1e", CANDIDATES, dl4jP50, percentile(dl4j, 0.99), referenceRuns,
        worst);

    // Throughput with passes at once, each on its own copy of the network (the service's decision
    // threads): one thread is the baseline, the ratio says how much of the second core is used.
    RerankerModel shared = new RerankerModel(graph, vocabulary, config, 0.5);
    double single = 0;
    for (int threads : new int[] {1, Runtime.getRuntime().availableProcessors()}) {
      double rate = passesPerSecond(new Scorer(shared, threads), threads, question, answers,
          repetitions);
      single = threads == 1 ? rate : single;
      line("scoring %d candidates from %d thread(s) at once, one network copy each: %.1f passes/s "
          + "(%.2fx one thread)", CANDIDATES, threads, rate, rate / single);
      if (Runtime.getRuntime().availableProcessors() == 1) {
        break;
      }
    }

    double machine = 0;
    for (int n : new int[] {512, 1024}) {
      double rate = mmulGflops(n);
      machine = Math.max(machine, rate);
      line("ND4J matrix multiply %dx%d (float): %.1f GFLOP/s", n, n, rate);
    }
    double flops = scoringFlops(config, vocabulary.size(), CANDIDATES, 21, 41);
    line("DL4J's pass: %.2f GFLOP (estimate from layer sizes), %.1f GFLOP/s achieved, %.0f%% of the machine rate",
        flops / 1e9, flops / (dl4jP50 / 1000) / 1e9, 100 * flops / (dl4jP50 / 1000) / 1e9 / machine);
    double folded = InferencePass.flops(vocabulary.size(), config.hidden(), 21, answers.stream()
        .mapToInt(a -> codec.answer(a).ids().length + 1).toArray());
    line("scoring pass: %.2f GFLOP (the same function folded: shared question, table look-ups), "
        + "%.1f GFLOP/s achieved, %.0f%% of the machine rate; %.2f GFLOP DL4J-equivalent in %.1f ms",
        folded / 1e9, folded / (p50 / 1000) / 1e9, 100 * folded / (p50 / 1000) / 1e9 / machine,
        flops / 1e9, p50);
  }

  /**
   * The same 10 rows on a network built self-normalised (alpha 0.1; untrained weights, since the
   * time depends on sizes only): scored exactly (the vocabulary-wide product and softmax, what every
   * plain version does) and by the target words' logits, the two timed in alternation so that both
   * see the same load, and the plain network's pass beside them.
   */
  private static void selfNormalizedScoring(RerankerConfig config, Vocabulary vocabulary, PairCodec codec,
      String question, List<String> answers, int repetitions) {
    ComputationGraph graph = Seq2SeqReranker.create(config.withSelfNormalization(0.1).network(vocabulary.size()));
    InferencePass pass = InferencePass.of(graph);
    int[] q = codec.question(question).ids();
    List<int[]> ids = new ArrayList<>();
    for (String a : answers) {
      ids.add(codec.answer(a).ids());
    }
    double[][] millis = new double[2][repetitions];
    for (int i = -20; i < repetitions; i++) {
      for (int mode = 0; mode < 2; mode++) {
        long t0 = System.nanoTime();
        pass.logLikelihoods(pass.encode(q), ids, mode == 0);
        if (i >= 0) {
          millis[mode][i] = (System.nanoTime() - t0) / 1e6;
        }
      }
    }
    Arrays.sort(millis[0]);
    Arrays.sort(millis[1]);
    double exact = percentile(millis[0], 0.50);
    double byLogits = percentile(millis[1], 0.50);
    line("self-normalised network, the same %d rows, alternating: exact p50 %.1f ms, p99 %.1f ms; by the "
        + "target words' logits p50 %.1f ms, p99 %.1f ms (%.1fx faster at p50) over %d runs each", CANDIDATES,
        exact, percentile(millis[0], 0.99), byLogits, percentile(millis[1], 0.99), exact / byLogits, repetitions);
  }

  /** Scoring passes per second with {@code threads} threads each running {@code runs} passes. */
  private static double passesPerSecond(Scorer scorer, int threads, String question,
      List<String> answers, int runs) throws InterruptedException {
    for (int i = 0; i < 5; i++) {
      scorer.score(question, answers);
    }
    Thread[] workers = new Thread[threads];
    long t0 = System.nanoTime();
    for (int t = 0; t < threads; t++) {
      workers[t] = new Thread(() -> {
        for (int i = 0; i < runs; i++) {
          scorer.score(question, answers);
        }
      }, "bench-score-" + t);
      workers[t].start();
    }
    for (Thread w : workers) {
      w.join();
    }
    return threads * (double) runs / ((System.nanoTime() - t0) / 1e9);
  }

  /**
   * Multiply-adds of one forward pass, counted 2 FLOPs each: encoder and decoder LSTMs (4 gates), the
   * attention's projections, scores and weighted sums, and the output layer over the vocabulary.
   * Element-wise work (activations, softmax) is left out as small beside these.
   */
  static double scoringFlops(RerankerConfig c, int vocabulary, int rows, int questionSteps, int answerSteps) {
    double e = c.embedding();
    double h = c.hidden();
    double encoder = questionSteps * 2 * 4 * h * (e + h);
    double decoder = answerSteps * 2 * 4 * h * (e + h + h);
    double attention = answerSteps * 2 * h * h * 2 + questionSteps * 2 * h * h * 2
        + answerSteps * questionSteps * 2 * h * 2;
    double output = answerSteps * 2 * (2 * h) * vocabulary;
    return rows * (encoder + decoder + attention + output);
  }

  private static double mmulGflops(int n) {
    INDArray a = Nd4j.rand(DataType.FLOAT, n, n);
    INDArray b = Nd4j.rand(DataType.FLOAT, n, n);
    INDArray c = Nd4j.create(DataType.FLOAT, n, n);
    for (int i = 0; i < 3; i++) {
      a.mmuli(b, c);
    }
    int reps = n <= 512 ? 40 : 8;
    long t0 = System.nanoTime();
    for (int i = 0; i < reps; i++) {
      a.mmuli(b, c);
    }
    double seconds = (System.nanoTime() - t0) / 1e9;
    return 2.0 * n * n * n * reps / seconds / 1e9;
  }

  private static Vocabulary syntheticVocabulary(int size) {
    List<String> words = new ArrayList<>();
    for (int i = 0; i < size - 4; i++) {
      words.add("w" + i);
    }
    return Vocabulary.build(List.of(words), size, 1);
  }

  /** Words w0..w3995 with probability falling as 1/(rank+1), roughly as word frequencies do. */
  private static String text(Random random, int minTokens, int maxTokens) {
    int n = minTokens + random.nextInt(maxTokens - minTokens + 1);
    StringBuilder sb = new StringBuilder();
    for (int i = 0; i < n; i++) {
      int rank = (int) Math.floor(Math.exp(random.nextDouble() * Math.log(3996))) - 1;
      sb.append('w').append(Math.max(0, rank)).append(' ');
    }
    return sb.toString();
  }

  private static double percentile(double[] sorted, double q) {
    int index = (int) Math.ceil(q * sorted.length) - 1;
    return sorted[Math.max(0, Math.min(sorted.length - 1, index))];
  }

  private static void line(String format, Object... args) {
    System.out.println(String.format(Locale.ROOT, format, args));
  }
}
