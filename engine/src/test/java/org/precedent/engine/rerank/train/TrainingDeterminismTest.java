package org.precedent.engine.rerank.train;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.rerank.ComputeThreads;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TinyData;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.TrainingMetrics;

/**
 * Training is a function of the pairs, the settings (seed included) and the machine: two runs give
 * the same weights bit for bit, and so does a run interrupted and resumed from its checkpoint. The
 * comparisons are exact, not within a tolerance: any hidden input (an unseeded draw, a hash order,
 * a clock) would show as a difference in the last bits of some weight.
 */
class TrainingDeterminismTest {

  /** Long enough to early-stop or not on validation loss and to pick lambda among ties. */
  private static RerankerConfig config() {
    return TinyData.config().withEpochs(6, 2);
  }

  @Test
  void twoRunsWithTheSeedGiveIdenticalWeightsAndFigures(@TempDir Path one, @TempDir Path two)
      throws Exception {
    TrainedReranker a = new RerankerTrainer(config(), one).onProgress(p -> { }).train(TinyData.pairs());
    TrainedReranker b = new RerankerTrainer(config(), two).onProgress(p -> { }).train(TinyData.pairs());

    assertArrayEquals(weights(a), weights(b), "weights differ between two runs with one seed");
    assertSameFigures(a.metrics(), b.metrics());
    assertEquals(a.model().antiLmLambda(), b.model().antiLmLambda());
  }

  @Test
  void anotherSeedGivesOtherWeights(@TempDir Path one, @TempDir Path two) throws Exception {
    // Guards the test above against comparing two things that cannot differ.
    TrainedReranker a = new RerankerTrainer(config(), one).onProgress(p -> { }).train(TinyData.pairs());
    TrainedReranker b = new RerankerTrainer(config().withSeed(43), two).onProgress(p -> { })
        .train(TinyData.pairs());
    assertNotEquals(java.util.Arrays.hashCode(weights(a)), java.util.Arrays.hashCode(weights(b)));
  }

  @Test
  void anInterruptedRunResumesToTheWeightsOfAnUninterruptedOne(@TempDir Path interrupted,
      @TempDir Path straight) throws Exception {
    // Stops the run from inside, as a crash would, mid-epoch and after a checkpoint (every 3 batches).
    AtomicInteger batches = new AtomicInteger();
    RuntimeException stop = new IllegalStateException("stopped for the test");
    RerankerTrainer first = new RerankerTrainer(config(), interrupted).checkpointEvery(3)
        .onProgress(p -> {
          if (batches.incrementAndGet() == 13) {
            throw stop;
          }
        });
    assertEquals(stop, assertThrows(IllegalStateException.class, () -> first.train(TinyData.pairs())));
    TrainingState atStop = new Checkpoints(interrupted).loadState();
    assertTrue(atStop.epoch() > 0 && atStop.nextBatch() > 0,
        "the stop should fall mid-epoch after the first epoch, was epoch " + atStop.epoch()
            + " batch " + atStop.nextBatch());

    TrainedReranker resumed = new RerankerTrainer(config(), interrupted).checkpointEvery(3)
        .onProgress(p -> { }).resume(TinyData.pairs());
    TrainedReranker reference = new RerankerTrainer(config(), straight).checkpointEvery(3)
        .onProgress(p -> { }).train(TinyData.pairs());

    assertArrayEquals(weights(reference), weights(resumed), "resumed run ended on other weights");
    assertSameFigures(reference.metrics(), resumed.metrics());
  }

  @Test
  void theModelRecordsTheThreadCountsItWasTrainedWith(@TempDir Path work) throws Exception {
    TrainedReranker trained = new RerankerTrainer(config().withEpochs(1, 1), work).onProgress(p -> { })
        .train(TinyData.pairs());
    assertEquals(ComputeThreads.current(), trained.metrics().computeThreads());
    String omp = System.getenv("OMP_NUM_THREADS");
    if (omp != null && !omp.isBlank()) {
      // The build runs tests with OMP_NUM_THREADS=1 (pom.xml), as the precedent script runs the tool.
      int n = Integer.parseInt(omp.trim());
      assertEquals(new ComputeThreads(n, n, n), trained.metrics().computeThreads());
    }
  }

  @Test
  void aCheckpointMadeWithOtherThreadCountsIsNotResumed(@TempDir Path work) throws Exception {
    AtomicInteger batches = new AtomicInteger();
    RerankerTrainer first = new RerankerTrainer(config(), work).checkpointEvery(3).onProgress(p -> {
      if (batches.incrementAndGet() == 4) {
        throw new IllegalStateException("stopped for the test");
      }
    });
    assertThrows(IllegalStateException.class, () -> first.train(TinyData.pairs()));
    Path stateFile = work.resolve(Checkpoints.STATE);
    TrainingState state = new Checkpoints(work).loadState();
    ComputeThreads here = ComputeThreads.current();
    assertEquals(here.toText(), state.computeThreads());
    // As if the interrupted run had been started under other thread counts.
    ComputeThreads other = new ComputeThreads(here.operations() + 1, here.masterOperations() + 1,
        here.blas() + 1);
    TrainingState edited = new TrainingState(state.epoch(), state.nextBatch(), state.bestValidationLoss(),
        state.epochsWithoutGain(), state.lastValidationLoss(), state.epochLossSum(), state.epochTokens(),
        state.trainedTokens(), state.trainingMillis(), state.finished(), state.dataFingerprint(),
        state.modelFile(), state.modelSha256(), other.toText());
    Files.writeString(stateFile, edited.toProperties());

    ModelLoadException refused = assertThrows(ModelLoadException.class,
        () -> new RerankerTrainer(config(), work).onProgress(p -> { }).resume(TinyData.pairs()));
    assertTrue(refused.getMessage().contains("OMP_NUM_THREADS=" + other.operations()), refused.getMessage());
    assertTrue(Files.exists(work.resolve(state.modelFile())), "the checkpoint must be kept");
  }

  private static float[] weights(TrainedReranker trained) {
    return trained.model().network().params().dup().toFloatVector();
  }

  /** Every figure but the wall-clock ones (time and speed). */
  private static void assertSameFigures(TrainingMetrics a, TrainingMetrics b) {
    assertEquals(a.trainLoss(), b.trainLoss(), "train loss");
    assertEquals(a.validationLoss(), b.validationLoss(), "validation loss");
    assertEquals(a.epochs(), b.epochs(), "epochs");
    assertEquals(a.antiLmLambda(), b.antiLmLambda(), "anti-LM lambda");
    assertEquals(a.validationTop1(), b.validationTop1(), "validation top-1");
    assertEquals(a.trainPairs(), b.trainPairs());
    assertEquals(a.validationPairs(), b.validationPairs());
    assertEquals(a.vocabularySize(), b.vocabularySize());
  }
}
