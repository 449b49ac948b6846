package org.precedent.engine.rerank.train;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TinyData;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.TrainingProgress;

/**
 * A training JVM killed without warning leaves a loadable checkpoint, and resuming from it ends where an
 * uninterrupted run with the same seed ends.
 */
@Tag("slow")
class KillAndResumeTest {

  @Test
  void killedRunResumesToTheSameModel(@TempDir Path killed, @TempDir Path straight) throws Exception {
    Path log = killed.resolveSibling(killed.getFileName() + "-child.log");
    Process child = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-Xmx1g", "-cp", System.getProperty("java.class.path"), TrainingChild.class.getName(), killed.toString())
        .redirectErrorStream(true).redirectOutput(log.toFile()).start();
    try {
      Path state = killed.resolve(Checkpoints.STATE);
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(180);
      while (!Files.exists(state) && child.isAlive() && System.nanoTime() < deadline) {
        Thread.sleep(50);
      }
      assertTrue(Files.exists(state), "no checkpoint appeared; child log: " + log);
      Thread.sleep(700); // let it run on, so the kill may land during a later batch or write
    } finally {
      child.destroyForcibly();
      child.waitFor(30, TimeUnit.SECONDS);
    }

    TrainingState atKill = new Checkpoints(killed).loadState();
    assertFalse(atKill.finished(), "the child finished before it was killed; the test proves nothing");
    RerankerModel checkpoint = RerankerTrainer.loadCheckpoint(killed);
    AnswerScore fromCheckpoint = new Scorer(checkpoint).score("my card is blocked", TinyData.ANSWERS).get(1);
    assertTrue(Double.isFinite(fromCheckpoint.logLikelihood()));

    List<TrainingProgress> reports = new ArrayList<>();
    TrainedReranker resumed = new RerankerTrainer(TrainingChild.config(), killed).checkpointEvery(3)
        .onProgress(reports::add).resume(TinyData.pairs());
    TrainedReranker reference = new RerankerTrainer(TrainingChild.config(), straight).checkpointEvery(3)
        .onProgress(p -> { }).train(TinyData.pairs());

    System.out.printf("killed at epoch %d batch %d; resumed in %d reports%n", atKill.epoch(), atKill.nextBatch(),
        reports.size());
    assertTrue(reports.stream().anyMatch(TrainingProgress::epochEnd));
    assertTrue(reports.stream().allMatch(p -> !p.timeLeft().isNegative() && p.tokensPerSecond() >= 0));
    assertEquals(reference.metrics().epochs(), resumed.metrics().epochs());
    assertEquals(reference.metrics().validationLoss(), resumed.metrics().validationLoss(), 1e-6);
    assertEquals(reference.dataFingerprint(), resumed.dataFingerprint());
    List<AnswerScore> a = new Scorer(resumed.model()).score("refund not received yet", TinyData.ANSWERS);
    List<AnswerScore> b = new Scorer(reference.model()).score("refund not received yet", TinyData.ANSWERS);
    for (int i = 0; i < a.size(); i++) {
      assertEquals(b.get(i).logLikelihood(), a.get(i).logLikelihood(), 1e-5);
    }
    Files.deleteIfExists(log);
  }
}
