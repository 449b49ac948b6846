package org.precedent.engine.rerank.train;

import java.nio.file.Path;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.TinyData;

/**
 * Runs a training in its own JVM so a test can kill it mid-run. Each batch's progress report pauses a
 * little, only to widen the window in which the kill lands; the training itself is the real one.
 */
public final class TrainingChild {

  static RerankerConfig config() {
    return TinyData.config().withEpochs(5, 5);
  }

  public static void main(String[] args) throws Exception {
    Path work = Path.of(args[0]);
    new RerankerTrainer(config(), work).checkpointEvery(3).onProgress(p -> {
      try {
        Thread.sleep(150);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }).train(TinyData.pairs());
  }

  private TrainingChild() {}
}
