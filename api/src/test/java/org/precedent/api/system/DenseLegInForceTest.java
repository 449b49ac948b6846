package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.InForce;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.TicketIndex;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * A model version that learnt from the dense leg, over knowledge that no longer holds question
 * vectors (re-ingested with the encoder off): opening it is refused with what to do, rather than
 * deciding with features that are all zero.
 */
class DenseLegInForceTest {
  private Path data;

  @AfterEach
  void removeData() {
    TrainedData.delete(data);
  }

  @Test
  void aDenseModelOverKnowledgeWithoutVectorsIsRefusedSayingWhatToDo() throws Exception {
    data = TrainedData.copy();
    DataDir dir = new DataDir(data);
    try (InForce active = InForce.open(dir)) {
      assumeTrue(active.dense() != null, "the test model was trained without the dense leg");
      assertNotNull(active.pipeline().decide("my green bin was not emptied", null));
    }
    Knowledge knowledge = Knowledge.open(dir).orElseThrow();
    // The same tickets and groups, indexed for BM25 only.
    Knowledge.replace(dir, List.copyOf(knowledge.tickets().values()), knowledge.grouping(),
        knowledge.manifest().sources(), TicketIndex.builder(Progress.silent()));
    IOException e = assertThrows(IOException.class, () -> InForce.open(dir));
    assertTrue(e.getMessage().contains("ingest again") && e.getMessage().contains("train again"),
        e.getMessage());
  }
}
