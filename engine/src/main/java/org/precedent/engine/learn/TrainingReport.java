package org.precedent.engine.learn;

import java.util.Locale;
import org.precedent.engine.rerank.TrainingMetrics;

/**
 * What one training run produced.
 *
 * @param version       the model version written
 * @param activated     whether it was made active (no version was in force before); else it is a
 *                      candidate beside the version in force
 * @param reranker      the reranker's training figures, or null for a version trained without
 *                      the reranker
 * @param fusionSummary the fitted fusion and calibration, in words
 */
public record TrainingReport(String version, boolean activated, TrainingMetrics reranker, String fusionSummary) {
  /** Whether the version holds a reranker. */
  public boolean withReranker() {
    return reranker != null;
  }

  public String summary() {
    if (reranker == null) {
      return "no reranker in this version (trained without it)\n" + fusionSummary;
    }
    return String.format(Locale.ROOT, "reranker: %d pairs trained, %d validation, %d epochs in %.0f s, "
            + "%.0f target tokens/s, validation loss %.3f, anti-LM lambda %.1f, validation top-1 %.3f, "
            + "ND4J %s%n%s",
        reranker.trainPairs(), reranker.validationPairs(), reranker.epochs(),
        reranker.trainingMillis() / 1000.0, reranker.targetTokensPerSecond(),
        reranker.validationLoss(), reranker.antiLmLambda(), reranker.validationTop1(),
        reranker.computeThreads(), fusionSummary);
  }
}
