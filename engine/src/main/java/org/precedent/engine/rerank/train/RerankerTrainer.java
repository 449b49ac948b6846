package org.precedent.engine.rerank.train;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Consumer;
import org.deeplearning4j.nn.graph.ComputationGraph;
import org.nd4j.linalg.api.ndarray.INDArray;
import org.precedent.engine.rerank.ComputeThreads;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.TrainingMetrics;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.engine.rerank.TrainingProgress;
import org.precedent.engine.rerank.net.EncodedBatch;
import org.precedent.engine.rerank.net.LogLikelihoods;
import org.precedent.engine.rerank.net.PairCodec;
import org.precedent.engine.rerank.net.Seq2SeqReranker;
import org.precedent.engine.rerank.tokens.Tokenizer;
import org.precedent.engine.rerank.tokens.Vocabulary;

/**
 * Trains a reranker on (question, answer) pairs: Adam, per-layer L2 gradient clipping, a held-out
 * validation split, early stopping on validation loss, everything seeded.
 *
 * <p>Every {@code checkpointEvery} batches and at each epoch's end the network (with the optimiser's
 * state) and the position in the run are saved atomically under the work directory; {@link #resume}
 * continues from there and replays the same batches an uninterrupted run would have seen.
 */
public final class RerankerTrainer {

  private static final int VALIDATION_BATCH = 64;

  private final RerankerConfig config;
  private final Path workDir;
  private int checkpointEvery = 50;
  private Consumer<TrainingProgress> progress = ProgressPrinter.toStandardError();

  public RerankerTrainer(RerankerConfig config, Path workDir) {
    this.config = config;
    this.workDir = workDir;
  }

  public RerankerTrainer checkpointEvery(int batches) {
    if (batches <= 0) {
      throw new IllegalArgumentException("checkpoint interval must be positive");
    }
    this.checkpointEvery = batches;
    return this;
  }

  public RerankerTrainer onProgress(Consumer<TrainingProgress> listener) {
    this.progress = listener;
    return this;
  }

  /** Trains from scratch, discarding any checkpoint in the work directory. */
  public TrainedReranker train(List<TrainingPair> pairs) throws IOException {
    return run(pairs, false);
  }

  /**
   * Continues the run checkpointed in the work directory, or starts one if there is none.
   *
   * @throws ModelLoadException if the checkpoint was made from other data or with other settings
   */
  public TrainedReranker resume(List<TrainingPair> pairs) throws IOException {
    return run(pairs, true);
  }

  /** The network as of the last checkpoint of a run in {@code workDir}, with anti-LM weight 0. */
  public static RerankerModel loadCheckpoint(Path workDir) throws IOException {
    Checkpoints checkpoints = new Checkpoints(workDir);
    if (!checkpoints.exists()) {
      throw new ModelLoadException("no training checkpoint in " + workDir);
    }
    TrainingState state = checkpoints.loadState();
    return new RerankerModel(checkpoints.loadModel(state, false), checkpoints.loadVocabulary(),
        checkpoints.loadConfig(), 0);
  }

  private TrainedReranker run(List<TrainingPair> pairs, boolean resume) throws IOException {
    String fingerprint = DataFingerprint.of(pairs);
    ComputeThreads threads = ComputeThreads.current();
    EpochPlan.Split split = EpochPlan.split(pairs, config);
    Checkpoints checkpoints = new Checkpoints(workDir);
    Vocabulary vocabulary;
    ComputationGraph graph;
    TrainingState state;
    if (resume && checkpoints.exists()) {
      state = checkpoints.loadState();
      if (!state.dataFingerprint().equals(fingerprint)) {
        throw new ModelLoadException("the checkpoint in " + workDir + " was made from other training data");
      }
      if (!checkpoints.loadConfig().equals(config)) {
        throw new ModelLoadException("the checkpoint in " + workDir + " was made with other settings");
      }
      if (!state.computeThreads().isEmpty() && !state.computeThreads().equals(threads.toText())) {
        ComputeThreads began = ComputeThreads.fromText(state.computeThreads());
        throw new ModelLoadException("the checkpoint in " + workDir + " was made with " + began
            + " of ND4J and this process has " + threads + ": resuming would not end on the model an"
            + " uninterrupted run gives; resume with OMP_NUM_THREADS=" + began.operations()
            + " or train afresh");
      }
      vocabulary = checkpoints.loadVocabulary();
      graph = checkpoints.loadModel(state, true);
    } else {
      vocabulary = buildVocabulary(split.train());
      checkpoints.begin(config, vocabulary);
      graph = Seq2SeqReranker.create(config.network(vocabulary.size()));
      state = TrainingState.start(fingerprint, threads.toText());
    }
    PairCodec codec = new PairCodec(new Tokenizer(), vocabulary, config.maxQuestionTokens(), config.maxAnswerTokens());
    Encoded train = Encoded.of(split.train(), codec);
    Encoded validation = Encoded.of(split.validation(), codec);
    Loop loop = new Loop(graph, checkpoints, new EpochPlan(split.train().size(), config), train, validation, state);
    TrainingState last = loop.run();

    // No best.zip means no epoch ever gave a finite validation loss; the last weights are all there is.
    ComputationGraph best = checkpoints.hasBest() ? checkpoints.loadBest() : graph;
    RerankerModel model = new RerankerModel(best, vocabulary, config, 0);
    LambdaTuner.Choice choice = LambdaTuner.choose(model, split.validation(), pairs, config.seed());
    double seconds = last.trainingMillis() / 1000.0;
    TrainingMetrics metrics = new TrainingMetrics(last.epochTokens() == 0 ? Double.NaN
        : last.epochLossSum() / last.epochTokens(), last.bestValidationLoss(), last.epoch(), last.trainingMillis(),
        seconds > 0 ? last.trainedTokens() / seconds : 0, choice.lambda(), choice.top1(), split.train().size(),
        split.validation().size(), vocabulary.size(), threads);
    return new TrainedReranker(model.withAntiLmLambda(choice.lambda()), metrics, fingerprint);
  }

  private Vocabulary buildVocabulary(List<TrainingPair> train) {
    Tokenizer tokenizer = new Tokenizer();
    List<List<String>> texts = new ArrayList<>(train.size() * 2);
    for (TrainingPair p : train) {
      texts.add(tokenizer.tokenize(p.question()));
      texts.add(tokenizer.tokenize(p.answer()));
    }
    return Vocabulary.build(texts, config.vocabCap(), config.minCount());
  }

  /** Encoded questions and answers of one split. */
  private record Encoded(List<PairCodec.Encoded> questions, List<PairCodec.Encoded> answers, PairCodec.Encoded empty) {
    static Encoded of(List<TrainingPair> pairs, PairCodec codec) {
      List<PairCodec.Encoded> q = new ArrayList<>(pairs.size());
      List<PairCodec.Encoded> a = new ArrayList<>(pairs.size());
      for (TrainingPair p : pairs) {
        q.add(codec.question(p.question()));
        a.add(codec.answer(p.answer()));
      }
      return new Encoded(q, a, codec.emptyQuestion());
    }

    EncodedBatch batch(int[] rows) {
      List<PairCodec.Encoded> q = new ArrayList<>(rows.length);
      List<PairCodec.Encoded> a = new ArrayList<>(rows.length);
      for (int row : rows) {
        int i = row >= 0 ? row : -row - 1;
        q.add(row >= 0 ? questions.get(i) : empty);
        a.add(answers.get(i));
      }
      return new EncodedBatch(q, a);
    }
  }

  /** One run of the epoch loop; the mutable counters live here and are copied into checkpoints. */
  private final class Loop {
    private final ComputationGraph graph;
    private final Checkpoints checkpoints;
    private final EpochPlan plan;
    private final Encoded train;
    private final Encoded validation;
    private int epoch;
    private int nextBatch;
    private double best;
    private int withoutGain;
    private double lastValidation;
    private double epochLossSum;
    private long epochTokens;
    private long trainedTokens;
    private final long millisBefore;
    private final long started = System.nanoTime();
    private long runTokens;
    private int runBatches;
    private boolean finished;
    private final String fingerprint;
    private final String computeThreads;

    Loop(ComputationGraph graph, Checkpoints checkpoints, EpochPlan plan, Encoded train, Encoded validation,
        TrainingState s) {
      this.graph = graph;
      this.checkpoints = checkpoints;
      this.plan = plan;
      this.train = train;
      this.validation = validation;
      epoch = s.epoch();
      nextBatch = s.nextBatch();
      best = s.bestValidationLoss();
      withoutGain = s.epochsWithoutGain();
      lastValidation = s.lastValidationLoss();
      epochLossSum = s.epochLossSum();
      epochTokens = s.epochTokens();
      trainedTokens = s.trainedTokens();
      millisBefore = s.trainingMillis();
      finished = s.finished();
      fingerprint = s.dataFingerprint();
      computeThreads = s.computeThreads();
    }

    TrainingState run() throws IOException {
      int batches = plan.batchesPerEpoch();
      int sinceCheckpoint = 0;
      while (!finished) {
        while (nextBatch < batches) {
          EncodedBatch batch = train.batch(plan.batch(epoch, nextBatch));
          graph.fit(batch.toDataSet());
          // DL4J's score is the summed token loss divided by the rows; turn it back into a per-token mean.
          epochLossSum += graph.score() * batch.rows();
          epochTokens += batch.targetTokens();
          trainedTokens += batch.targetTokens();
          runTokens += batch.targetTokens();
          runBatches++;
          nextBatch++;
          if (++sinceCheckpoint >= checkpointEvery && nextBatch < batches) {
            checkpoints.save(graph, state());
            sinceCheckpoint = 0;
          }
          report(nextBatch, false);
        }
        lastValidation = validationLoss();
        if (lastValidation < best) {
          best = lastValidation;
          withoutGain = 0;
          checkpoints.saveBest(graph);
        } else {
          withoutGain++;
        }
        report(batches, true);
        epoch++;
        nextBatch = 0;
        finished = withoutGain >= config.patience() || epoch >= config.maxEpochs();
        if (!finished) {
          epochLossSum = 0;
          epochTokens = 0;
        }
        checkpoints.save(graph, state());
        sinceCheckpoint = 0;
      }
      return state();
    }

    private TrainingState state() {
      long millis = millisBefore + (System.nanoTime() - started) / 1_000_000;
      return new TrainingState(epoch, nextBatch, best, withoutGain, lastValidation, epochLossSum, epochTokens,
          trainedTokens, millis, finished, fingerprint, "", "", computeThreads);
    }

    private double validationLoss() {
      double nll = 0;
      long tokens = 0;
      int n = validation.questions().size();
      for (int from = 0; from < n; from += VALIDATION_BATCH) {
        int[] rows = new int[Math.min(VALIDATION_BATCH, n - from)];
        for (int k = 0; k < rows.length; k++) {
          rows[k] = from + k;
        }
        EncodedBatch batch = validation.batch(rows);
        INDArray output = LogLikelihoods.forward(graph, batch);
        for (double ll : LogLikelihoods.perRow(output, batch)) {
          nll -= ll;
        }
        tokens += batch.targetTokens();
      }
      return nll / tokens;
    }

    private void report(int batch, boolean epochEnd) {
      double seconds = (System.nanoTime() - started) / 1e9;
      int batches = plan.batchesPerEpoch();
      long remaining = (long) (config.maxEpochs() - epoch - 1) * batches + (batches - batch);
      Duration left = runBatches == 0 ? Duration.ZERO
          : Duration.ofMillis((long) (remaining * seconds * 1000 / runBatches));
      progress.accept(new TrainingProgress(epoch + 1, config.maxEpochs(), batch, batches,
          epochTokens == 0 ? Double.NaN : epochLossSum / epochTokens, lastValidation,
          seconds > 0 ? runTokens / seconds : 0, left, epochEnd));
    }
  }
}
