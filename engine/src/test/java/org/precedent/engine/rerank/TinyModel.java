package org.precedent.engine.rerank;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.precedent.engine.rerank.train.RerankerTrainer;

/** One small model trained on {@link TinyData}, shared by the tests of one JVM. */
public final class TinyModel {

  private static TrainedReranker trained;

  private TinyModel() {}

  public static synchronized TrainedReranker get() {
    if (trained == null) {
      try {
        Path work = Files.createTempDirectory("tiny-reranker");
        Runtime.getRuntime().addShutdownHook(new Thread(() -> deleteTree(work)));
        trained = new RerankerTrainer(TinyData.config(), work).onProgress(p -> { }).train(TinyData.pairs());
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
    return trained;
  }

  static void deleteTree(Path dir) {
    try {
      org.precedent.knowledge.io.AtomicFiles.deleteTree(dir);
    } catch (IOException ignored) {
      // a temporary directory left behind is harmless
    }
  }
}
