package org.precedent.engine.rerank.train;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.rerank.ModelLoadException;

class TrainingStateTest {

  @Test
  void aStateReadsBackEqualInfinityAndNaNIncluded(@TempDir Path dir) throws Exception {
    // A fresh run's state holds +Infinity (no best loss yet) and NaN (no validation yet): both must
    // survive, as Double.toString and Double.parseDouble write and read them.
    TrainingState start = TrainingState.start("abc123", "OMP_NUM_THREADS=1");
    TrainingState later = new TrainingState(3, 17, 2.5, 1, 2.75, 123.25, 4096L, 1L << 40, 98_765L, true,
        "f00d", "checkpoint-00003-000017.zip", "beef", "");
    for (TrainingState state : new TrainingState[] {start, later}) {
      Path file = dir.resolve(Checkpoints.STATE);
      Files.writeString(file, state.toProperties());
      assertEquals(state, TrainingState.read(file));
    }
  }

  @Test
  void aCheckpointWrittenBeforeThreadCountsWereRecordedStillReads(@TempDir Path dir) throws Exception {
    // Verbatim in the layout java.util.Properties.store gave it in the first release (header comment,
    // date line, keys in hash order, no computeThreads key).
    String firstRelease = """
        #reranker training checkpoint
        #Tue Nov 10 09:41:27 UTC 2026
        modelFile=checkpoint-00002-000040.zip
        epochLossSum=310.5
        epochTokens=5120
        trainedTokens=61440
        finished=false
        nextBatch=40
        lastValidationLoss=NaN
        dataFingerprint=9f2c
        epoch=2
        modelSha256=0a1b
        epochsWithoutGain=0
        bestValidationLoss=Infinity
        trainingMillis=45000
        """;
    Path file = dir.resolve(Checkpoints.STATE);
    Files.writeString(file, firstRelease);
    assertEquals(new TrainingState(2, 40, Double.POSITIVE_INFINITY, 0, Double.NaN, 310.5, 5120L, 61440L,
        45000L, false, "9f2c", "checkpoint-00002-000040.zip", "0a1b", ""), TrainingState.read(file));
  }

  @Test
  void aTamperedCheckpointNamesTheFileAndTheField(@TempDir Path dir) throws Exception {
    Path file = dir.resolve(Checkpoints.STATE);
    String good = TrainingState.start("abc", "").toProperties();
    Files.writeString(file, good.replace("nextBatch=0", "nextBatch=zero"));
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> TrainingState.read(file));
    assertTrue(e.getMessage().contains(file.toString()) && e.getMessage().contains("'nextBatch'"), e.getMessage());

    Files.writeString(file, good.replace("epoch=0", ""));
    e = assertThrows(ModelLoadException.class, () -> TrainingState.read(file));
    assertTrue(e.getMessage().contains(file.toString()) && e.getMessage().contains("'epoch'"), e.getMessage());
  }
}
