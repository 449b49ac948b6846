package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;

/**
 * A one-question command opens what is in force without the reranker's network and loads it only
 * for a question the faster legs disagree on, checking its files again then: a network changed
 * after the opening fails that decision with the file named, and decides nothing with it.
 */
class DeferredRerankerTest {
  private Path data;

  @AfterEach
  void removeData() {
    TrainedData.delete(data);
  }

  @Test
  void theNetworkLoadsOnlyForAQuestionTheLegsDisagreeOn() throws Exception {
    data = TrainedData.copy();
    DataDir dir = new DataDir(data);
    try (InForce active = InForce.openRerankerOnFirstUse(dir)) {
      assumeTrue(active.dense() != null, "the test model was trained without the dense leg");
      Pipeline pipeline = active.pipeline();
      assertEquals(ScoringSystem.CASCADE, pipeline.decisionSystem());
      assertTrue(active.rerankerLoad().isEmpty(), "nothing loaded at open");
      // A question the demo's bin-collection answers settle, then one that matches nothing well.
      Decision settled = pipeline.decide("my green bin was not emptied on collection day", null);
      boolean neededNetwork = settled.candidates().get(0).rerank() != null;
      assertEquals(neededNetwork, active.rerankerLoad().isPresent());
      Decision unclear = pipeline.decide("parking permit for the library car park, also a "
          + "pothole and a missed bin", null);
      assertEquals(unclear.candidates().get(0).rerank() != null || neededNetwork,
          active.rerankerLoad().isPresent());
    }
  }

  @Test
  void aNetworkChangedAfterTheOpeningFailsTheDecisionThatNeedsIt() throws Exception {
    data = TrainedData.copy();
    DataDir dir = new DataDir(data);
    try (InForce active = InForce.openRerankerOnFirstUse(dir)) {
      assumeTrue(active.dense() != null, "the test model was trained without the dense leg");
      Path zip = new ModelStore(dir.models()).directory(active.version()).resolve("model.zip");
      Files.write(zip, new byte[] {1, 2, 3}, StandardOpenOption.APPEND);
      // Every question ranked as the reranker always would: the network is needed at once.
      Pipeline always = active.pipeline(org.precedent.engine.decide.RerankerUse.ALWAYS);
      RuntimeException e = assertThrows(RuntimeException.class,
          () -> always.decide("my green bin was not emptied", null));
      assertTrue(String.valueOf(e.getMessage()).contains("model.zip"), e.getMessage());
      assertFalse(active.rerankerLoad().isPresent(), "nothing loaded from a changed file");
    }
  }
}
