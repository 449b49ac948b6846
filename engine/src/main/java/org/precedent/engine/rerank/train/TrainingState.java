package org.precedent.engine.rerank.train;

import java.io.IOException;
import java.io.StringReader;
import java.io.StringWriter;
import java.util.Properties;

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

  String toProperties() {
    Properties p = new Properties();
    p.setProperty("epoch", Integer.toString(epoch));
    p.setProperty("nextBatch", Integer.toString(nextBatch));
    p.setProperty("bestValidationLoss", Double.toString(bestValidationLoss));
    p.setProperty("epochsWithoutGain", Integer.toString(epochsWithoutGain));
    p.setProperty("lastValidationLoss", Double.toString(lastValidationLoss));
    p.setProperty("epochLossSum", Double.toString(epochLossSum));
    p.setProperty("epochTokens", Long.toString(epochTokens));
    p.setProperty("trainedTokens", Long.toString(trainedTokens));
    p.setProperty("trainingMillis", Long.toString(trainingMillis));
    p.setProperty("finished", Boolean.toString(finished));
    p.setProperty("dataFingerprint", dataFingerprint);
    p.setProperty("modelFile", modelFile);
    p.setProperty("modelSha256", modelSha256);
    p.setProperty("computeThreads", computeThreads);
    StringWriter out = new StringWriter();
    try {
      p.store(out, "reranker training checkpoint");
    } catch (IOException e) {
      throw new IllegalStateException(e);
    }
    return out.toString();
  }

  static TrainingState fromProperties(String text) throws IOException {
    Properties p = new Properties();
    p.load(new StringReader(text));
    try {
      return new TrainingState(Integer.parseInt(get(p, "epoch")), Integer.parseInt(get(p, "nextBatch")),
          Double.parseDouble(get(p, "bestValidationLoss")), Integer.parseInt(get(p, "epochsWithoutGain")),
          Double.parseDouble(get(p, "lastValidationLoss")), Double.parseDouble(get(p, "epochLossSum")),
          Long.parseLong(get(p, "epochTokens")), Long.parseLong(get(p, "trainedTokens")),
          Long.parseLong(get(p, "trainingMillis")), Boolean.parseBoolean(get(p, "finished")),
          get(p, "dataFingerprint"), get(p, "modelFile"), get(p, "modelSha256"),
          p.getProperty("computeThreads", ""));
    } catch (NumberFormatException e) {
      throw new IOException("checkpoint state has a bad number: " + e.getMessage(), e);
    }
  }

  private static String get(Properties p, String key) throws IOException {
    String v = p.getProperty(key);
    if (v == null) {
      throw new IOException("checkpoint state lacks '" + key + "'");
    }
    return v;
  }
}
