package org.precedent.engine.rerank.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.rerank.AnswerScore;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.Scorer;
import org.precedent.engine.rerank.TinyData;
import org.precedent.engine.rerank.TinyModel;
import org.precedent.engine.rerank.TrainedReranker;
import org.precedent.engine.rerank.tokens.Vocabulary;

class ModelStoreTest {

  private final TrainedReranker trained = TinyModel.get();
  private final String question = "my card is blocked";

  @Test
  void savedModelScoresExactlyAsBefore(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    String version = store.save(trained);
    assertEquals("v-0001", version);
    assertEquals(version, store.activeVersion().orElseThrow());

    RerankerModel loaded = store.loadActive();
    assertEquals(trained.model().antiLmLambda(), loaded.antiLmLambda());
    assertEquals(trained.model().config(), loaded.config());
    List<AnswerScore> before = new Scorer(trained.model()).score(question, TinyData.ANSWERS);
    List<AnswerScore> after = new Scorer(loaded).score(question, TinyData.ANSWERS);
    assertEquals(before, after, "weights must survive saving bit for bit");

    JsonNode metrics = new ObjectMapper().readTree(root.resolve(version).resolve(ModelStore.METRICS).toFile());
    assertEquals(trained.dataFingerprint(), metrics.get("dataSha256").asText());
    assertEquals(trained.metrics().epochs(), metrics.get("metrics").get("epochs").asInt());
    // Read back whole, thread counts included: they are part of what made these weights.
    assertEquals(trained.metrics(), store.trainingMetrics(version).orElseThrow());
    assertEquals(trained.metrics().computeThreads().blas(),
        metrics.get("metrics").get("computeThreads").get("blas").asInt());
  }

  @Test
  void aConfigurationWrittenByTheFirstReleaseStillReads(@TempDir Path root) throws Exception {
    // config.properties verbatim in the layout the first release wrote (java.util.Properties.store's
    // header and hash order, then the anti-LM weight appended as one more line), with TinyData's sizes
    // so the saved weights fit it. Read without the manifest check, which a changed file would fail.
    String firstRelease = """
        #reranker configuration
        #Tue Nov 10 09:41:27 UTC 2026
        maxQuestionTokens=48
        validationShare=0.1
        vocabCap=500
        hidden=16
        clipNorm=5.0
        maxEpochs=25
        patience=4
        unconditionalShare=0.1
        embedding=8
        batchSize=8
        maxAnswerTokens=48
        minCount=1
        learningRate=0.01
        seed=42
        antiLmLambda=0.35
        """;
    ModelStore store = new ModelStore(root);
    Path dir = root.resolve(store.save(trained));
    Files.writeString(dir.resolve(ModelStore.CONFIG), firstRelease);
    RerankerModel loaded = ModelStore.read(dir);
    assertEquals(TinyData.config(), loaded.config());
    assertEquals(0.35, loaded.antiLmLambda());
  }

  @Test
  void aTamperedConfigurationNamesTheFileAndTheField(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    Path dir = root.resolve(store.save(trained));
    Path config = dir.resolve(ModelStore.CONFIG);
    Files.writeString(config, Files.readString(config).replace("hidden=16", "hidden=sixteen"));
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> ModelStore.read(dir));
    assertTrue(e.getMessage().contains(config.toString()) && e.getMessage().contains("'hidden'"), e.getMessage());
  }

  @Test
  void eachSaveIsANewVersionAndActiveSwitches(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    store.save(trained);
    String second = store.save(trained);
    assertEquals("v-0002", second);
    assertEquals(List.of("v-0001", "v-0002"), store.versions());
    assertEquals("v-0002", store.activeVersion().orElseThrow());
    store.activate("v-0001");
    assertEquals("v-0001", store.activeVersion().orElseThrow());
    try (var files = Files.list(root)) {
      assertTrue(files.noneMatch(p -> p.getFileName().toString().startsWith(".")), "no staging left behind");
    }
  }

  @Test
  void truncatedWeightsAreReportedAsSuch(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    String version = store.save(trained);
    Path weights = root.resolve(version).resolve(ModelStore.WEIGHTS);
    try (FileChannel ch = FileChannel.open(weights, StandardOpenOption.WRITE)) {
      ch.truncate(ch.size() / 2);
    }
    ModelLoadException checked = assertThrows(ModelLoadException.class, () -> store.load(version));
    assertTrue(checked.getMessage().contains("corrupt or truncated"), checked.getMessage());
    assertTrue(checked.getMessage().contains(ModelStore.WEIGHTS), checked.getMessage());

    // Even without the manifest's help, DL4J's failure on the cut zip comes out as the same clear error.
    ModelLoadException unchecked = assertThrows(ModelLoadException.class, () -> ModelStore.read(root.resolve(version)));
    assertTrue(unchecked.getMessage().contains("corrupt or truncated"), unchecked.getMessage());
  }

  @Test
  void vocabularyOfAnotherSizeIsRefused(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    String version = store.save(trained);
    Vocabulary other = Vocabulary.build(List.of(List.of("only", "a", "few", "words")), 100, 1);
    other.save(root.resolve(version).resolve(ModelStore.VOCABULARY));

    ModelLoadException viaManifest = assertThrows(ModelLoadException.class, () -> store.load(version));
    assertTrue(viaManifest.getMessage().contains(ModelStore.VOCABULARY), viaManifest.getMessage());
    ModelLoadException mismatch = assertThrows(ModelLoadException.class, () -> ModelStore.read(root.resolve(version)));
    assertTrue(mismatch.getMessage().contains("vocabulary has 8 tokens but the model's embedding has "
        + trained.model().vocabulary().size()), mismatch.getMessage());
  }

  @Test
  void noActiveModelIsAClearError(@TempDir Path root) {
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> new ModelStore(root).loadActive());
    assertTrue(e.getMessage().contains("no active reranker"), e.getMessage());
  }

  @Test
  void aChangedFileOfAnyKindIsRefusedNamingIt(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    String version = store.save(trained);
    Path metrics = root.resolve(version).resolve(ModelStore.METRICS);
    Files.writeString(metrics, Files.readString(metrics).replace("\"epochs\"", "\"epochs\" "));
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> store.load(version));
    assertTrue(e.getMessage().contains(metrics.toString()), e.getMessage());
    assertTrue(e.getMessage().contains("corrupt or truncated"), e.getMessage());
  }

  @Test
  void aFileTheManifestDoesNotCoverIsRefused(@TempDir Path root) throws Exception {
    // As a version made before every file was in the manifest: fusion.json added afterwards.
    ModelStore store = new ModelStore(root);
    String version = store.save(trained);
    Path extra = root.resolve(version).resolve("fusion.json");
    Files.writeString(extra, "{}");
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> store.load(version));
    assertTrue(e.getMessage().contains(extra.toString()), e.getMessage());
    assertTrue(e.getMessage().contains("not in the checksum manifest"), e.getMessage());
    assertTrue(e.getMessage().contains("precedent train"), e.getMessage());
  }

  @Test
  void filesWrittenWithTheVersionAreInItsManifestAndChecked(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    String version = store.write(trained, dir -> Files.writeString(dir.resolve("fusion.json"),
        "{\"a\": 1}"));
    Path dir = root.resolve(version);
    java.util.Properties manifest = new java.util.Properties();
    try (var in = Files.newBufferedReader(dir.resolve(ModelStore.MANIFEST))) {
      manifest.load(in);
    }
    try (var files = Files.list(dir)) {
      assertEquals(files.map(p -> p.getFileName().toString())
          .filter(n -> !n.equals(ModelStore.MANIFEST)).collect(java.util.stream.Collectors.toSet()),
          manifest.stringPropertyNames());
    }
    store.verify(version);
    Files.writeString(dir.resolve("fusion.json"), "{\"a\": 2}");
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> store.verify(version));
    assertTrue(e.getMessage().contains("fusion.json"), e.getMessage());
  }

  @Test
  void aDamagedVersionIsNeverMadeActive(@TempDir Path root) throws Exception {
    ModelStore store = new ModelStore(root);
    store.save(trained);
    String second = store.write(trained);
    store.activate("v-0001");
    Path config = root.resolve(second).resolve(ModelStore.CONFIG);
    Files.writeString(config, Files.readString(config) + "antiLmLambda=0.9\n");
    assertThrows(ModelLoadException.class, () -> store.activate(second));
    assertEquals("v-0001", store.activeVersion().orElseThrow());
  }
}
