package org.precedent.engine.dense;

import java.io.IOException;
import java.util.List;
import org.precedent.knowledge.embed.Encoders;
import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.retrieve.Candidate;
import org.precedent.knowledge.store.Manifest;

/**
 * What a decision needs of the dense leg: the encoder that embeds each new question, the same one
 * that embedded the stored questions, and the answer classifier fitted on those vectors. Closing it
 * closes the encoder.
 */
public final class DenseLeg implements AutoCloseable {
  private final SentenceEncoder encoder;
  private final AnswerClassifier classifier;

  private DenseLeg(SentenceEncoder encoder, AnswerClassifier classifier) {
    this.encoder = encoder;
    this.classifier = classifier;
  }

  /**
   * Opens the encoder that made the knowledge's vectors and pairs it with a classifier fitted on
   * them.
   *
   * @param vectors    what made the index's vectors (from the knowledge's manifest)
   * @param classifier fitted on vectors by that same encoder
   * @throws IOException naming the encoder when this build cannot run it, or runs a different file
   *                     under its name, or the classifier was fitted on another encoder's vectors
   */
  public static DenseLeg open(Manifest.Vectors vectors, AnswerClassifier classifier)
      throws IOException {
    if (!vectors.sha256().equals(classifier.encoderSha256())) {
      throw new IOException("the answer classifier was fitted on vectors of encoder "
          + classifier.encoder() + " (model file " + shortSha(classifier.encoderSha256())
          + "), the knowledge holds vectors of " + vectors.encoder() + " ("
          + shortSha(vectors.sha256()) + "): run 'precedent train' again");
    }
    SentenceEncoder.Model model;
    try {
      model = Encoders.named(vectors.encoder()).orElseThrow(() -> new IllegalArgumentException(
          "encoder '" + vectors.encoder() + "' is not a sentence encoder"));
    } catch (IllegalArgumentException e) {
      throw new IOException("the knowledge's vectors were made by " + e.getMessage()
          + "; ingest again with -D" + Encoders.PROPERTY + " set to one this build runs", e);
    }
    SentenceEncoder encoder = SentenceEncoder.open(model);
    if (!encoder.identity().sha256().equals(vectors.sha256())) {
      String built = encoder.identity().sha256();
      encoder.close();
      throw new IOException("the knowledge's vectors were made by " + vectors.encoder()
          + " with model file " + shortSha(vectors.sha256()) + ", but this build's "
          + vectors.encoder() + " is " + shortSha(built) + ": ingest again so that questions "
          + "and stored vectors come from one model");
    }
    return new DenseLeg(encoder, classifier);
  }

  public SentenceEncoder encoder() {
    return encoder;
  }

  public AnswerClassifier classifier() {
    return classifier;
  }

  /** The classifier's probability of each candidate's group, in the candidates' order. */
  public List<Double> probabilities(float[] vector, List<Candidate> candidates) {
    return classifier.probabilities(vector, candidates.stream().map(c -> c.group().id()).toList());
  }

  @Override
  public void close() {
    encoder.close();
  }

  private static String shortSha(String sha256) {
    return sha256 == null ? "(unknown)" : "sha256 " + sha256.substring(0, Math.min(12,
        sha256.length()));
  }
}
