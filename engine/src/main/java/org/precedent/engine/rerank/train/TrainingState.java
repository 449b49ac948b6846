package org.precedent.engine.rerank.train;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Properties;
import org.precedent.engine.rerank.PropertiesRecords;

/**
 * Where training stopped, enough to continue exactly: the next batch of which epoch (each epoch's order
 * comes from the seed and the epoch number, so it can be rebuilt), the early-stopping counters, and the
 * running sums behind the reported figures.
 *
 * <p>{@code computeThreads} are ND4J's thread counts when the run began ({@code ComputeThreads#toText});
 * empty in checkpoints written before they were recorded.
 */
record TrainingState(int epoch, int nextBatch, double bestValidationLoss, int epochsWithoutGain,
    double lastValidationLoss, double epochLossSum, long epochTokens, long trainedTokens, long trainingMillis,
    boolean finished, String dataFingerprint, String modelFile, String modelSha256, String computeThreads) {

  static TrainingState start(String fingerprint, String computeThreads) {
    return new TrainingState(0, 0, Double.POSITIVE_INFINITY, 0, Double.NaN, 0, 0, 0, 0, false, fingerprint, "", "",
        computeThreads);
  }

  TrainingState withModel(String file, String sha256) {
    return new TrainingState(epoch, nextBatch, bestValidationLoss, epochsWithoutGain, lastValidationLoss,
        epochLossSum, epochTokens, trainedTokens, trainingMillis, finished, dataFingerprint, file, sha256,
        computeThreads);
  }

  /** As the text of {@value Checkpoints#STATE}. */
  String toProperties() {
    return PropertiesRecords.text(this, "reranker training checkpoint");
  }

  static TrainingState read(Path file) throws IOException {
    Properties p = PropertiesRecords.load(file);
    // Checkpoints written before the thread counts were recorded lack them (see the class comment).
    p.putIfAbsent("computeThreads", "");
    return PropertiesRecords.toRecord(p, TrainingState.class, file);
  }
}
