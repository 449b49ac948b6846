package org.precedent.engine.dense;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.embed.SentenceEncoder;
import org.precedent.knowledge.store.Manifest;

/**
 * A decision's question must be embedded by the very model file that embedded the stored
 * questions, and the classifier fitted on that model's vectors: a mismatch is refused with a
 * message that says which and what to do, never compared silently.
 */
class DenseLegTest {
  private static AnswerClassifier classifier(String sha) {
    // Two groups in two dimensions, separable on the first component.
    return AnswerClassifier.fit(SentenceEncoder.BGE_SMALL_EN_V15_Q.name(), sha,
        List.of(new float[] {1, 0}, new float[] {0.9f, 0.1f}, new float[] {-1, 0},
            new float[] {-0.9f, -0.1f}), List.of("a", "a", "b", "b"), AnswerClassifier.LAMBDA);
  }

  @Test
  void aClassifierOfAnotherEncodersVectorsIsRefused() {
    Manifest.Vectors vectors = new Manifest.Vectors("bge-small-en-v1.5-q", "aaaa", 384);
    IOException e = assertThrows(IOException.class,
        () -> DenseLeg.open(vectors, classifier("bbbb")));
    assertTrue(e.getMessage().contains("train"), e.getMessage());
  }

  @Test
  void vectorsOfAnotherModelFileUnderTheSameNameAreRefused() {
    Manifest.Vectors vectors = new Manifest.Vectors("bge-small-en-v1.5-q", "cccc", 384);
    IOException e = assertThrows(IOException.class,
        () -> DenseLeg.open(vectors, classifier("cccc")));
    assertTrue(e.getMessage().contains("ingest again"), e.getMessage());
  }

  @Test
  void anEncoderThisBuildCannotRunIsNamed() {
    Manifest.Vectors vectors = new Manifest.Vectors("some-other-encoder", "dddd", 384);
    IOException e = assertThrows(IOException.class,
        () -> DenseLeg.open(vectors, classifier("dddd")));
    assertTrue(e.getMessage().contains("some-other-encoder"), e.getMessage());
  }

  @Test
  void theMatchingEncoderOpensAndScoresCandidatesGroups() throws Exception {
    String sha;
    try (SentenceEncoder encoder = SentenceEncoder.open()) {
      sha = encoder.identity().sha256();
    }
    Manifest.Vectors vectors = new Manifest.Vectors("bge-small-en-v1.5-q", sha, 384);
    try (DenseLeg leg = DenseLeg.open(vectors, classifier(sha))) {
      assertEquals(sha, leg.encoder().identity().sha256());
      List<Double> p = leg.classifier().probabilities(new float[] {1, 0}, List.of("a", "b", "z"));
      assertTrue(p.get(0) > 0.5 && p.get(1) < 0.5, p.toString());
      assertEquals(0.0, p.get(2), "a group the classifier never saw");
    }
  }
}
