package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.precedent.api.models.ServiceActivation;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.evaluate.VersionComparison;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * A model version without the reranker (the faster legs alone, what the demo serves while the
 * reranker trains): it trains, verifies, opens with no scorer, decides, is evaluated with its own
 * systems only, is refused when a file of it is damaged or missing, and serves; a worse version
 * with the reranker is refused by the service's own activation (the 409) and leaves it in force.
 */
class VersionWithoutRerankerTest {
  /** As ModelComparisonTest: enough held-out tickets for a guaranteed threshold at 85%. */
  static final int HELD_OUT = 120;
  static final double TARGET = 0.85;

  static Path data;
  static String version;
  static TrainingReport trained;
  static Path heldOut;
  static Ingestor.ParsedExport parsed;
  /** The version without the reranker measured on the held-out tickets, once for the class. */
  static EvaluationReport measured;

  @BeforeAll
  static void trained() throws Exception {
    data = TrainedData.copy();
    long start = System.nanoTime();
    DataDir dir = new DataDir(data);
    trained = new TeamModelTrainer(dir, RerankerConfig.defaults())
        .trainWithoutReranker(Knowledge.open(dir).orElseThrow());
    version = trained.version();
    System.err.printf(java.util.Locale.ROOT, "version without the reranker: %s trained in %.1f s%n",
        version, (System.nanoTime() - start) / 1e9);
    heldOut = data.resolve("heldout-" + HELD_OUT + ".csv");
    Path demo = TrainedData.root().resolve("demo-data");
    org.precedent.api.models.VersionFixtures.firstRows(demo.resolve("heldout.csv"),
        heldOut, HELD_OUT);
    parsed = Ingestor.of(dir, AnswerGrouper.standard()).parse(heldOut, ExportFormat.CSV,
        ColumnMapping.fromFile(demo.resolve("mapping.properties"), Map.of()), Progress.silent());
    try (InForce opened = InForce.open(dir, version)) {
      measured = HeldOutEvaluation.measure(opened, parsed, heldOut.getFileName().toString(),
          TARGET, Progress.silent());
    }
  }

  @AfterAll
  static void removed() {
    TrainedData.delete(data);
  }

  private static boolean dense() throws Exception {
    return Knowledge.open(new DataDir(data)).orElseThrow().manifest().vectors() != null;
  }

  @Test
  void itHoldsNoRerankerFilesAndItsManifestCoversWhatItHolds() throws Exception {
    ModelStore store = new ModelStore(data.resolve("models"));
    // A candidate: v-0001 (with the reranker) was in force before it.
    assertFalse(trained.activated());
    assertFalse(trained.withReranker());
    assertEquals("v-0001", store.activeVersion().orElseThrow());
    store.verify(version);
    assertFalse(store.hasReranker(version));
    assertTrue(store.hasReranker("v-0001"));
    Path dir = store.directory(version);
    List<String> files;
    try (var listed = Files.list(dir)) {
      files = listed.map(p -> p.getFileName().toString()).sorted().toList();
    }
    assertEquals(dense() ? List.of("dense.json", "fusion.json", "manifest.properties",
        "metrics.json") : List.of("fusion.json", "manifest.properties", "metrics.json"), files);
    String manifest = Files.readString(dir.resolve("manifest.properties"));
    assertFalse(manifest.contains("model.zip"), manifest);
    ModelLoadException e = assertThrows(ModelLoadException.class, () -> store.load(version));
    assertTrue(e.getMessage().contains("holds no reranker"), e.getMessage());
    // A rerun on the same tickets finds each kind done.
    TeamModelTrainer trainer = new TeamModelTrainer(new DataDir(data), RerankerConfig.defaults());
    Knowledge knowledge = Knowledge.open(new DataDir(data)).orElseThrow();
    assertEquals(version, trainer.currentVersion(knowledge, false).orElseThrow());
    assertEquals("v-0002", trainer.currentVersion(knowledge, true).orElseThrow());
  }

  @Test
  void itOpensWithoutAScorerAndDecidesWithItsOwnSystemsOnly() throws Exception {
    try (InForce opened = InForce.open(new DataDir(data), version)) {
      assertFalse(opened.hasReranker());
      assertTrue(opened.rerankerLoad().isEmpty());
      assertThrows(IllegalStateException.class, opened::scorer);
      Pipeline pipeline = opened.pipeline();
      List<ScoringSystem> expected = dense()
          ? List.of(ScoringSystem.BM25, ScoringSystem.DENSE, ScoringSystem.FUSED_WITHOUT_RERANKER)
          : List.of(ScoringSystem.BM25);
      assertEquals(expected, pipeline.systems());
      assertEquals(expected.get(expected.size() - 1), pipeline.decisionSystem());
      Decision d = pipeline.decide("My green bin was not emptied this morning", null);
      assertFalse(d.candidates().isEmpty());
      d.candidates().forEach(c -> assertEquals(null, c.rerank()));
      String note = d.why().parts().stream().filter(p -> p.name().equals("reranker"))
          .findFirst().orElseThrow().detail();
      assertTrue(note.contains("holds no reranker"), note);
    }
  }

  @Test
  void evaluateListsOnlyItsSystems() throws Exception {
    Path copy = Files.createTempDirectory("precedent-fast-eval-");
    try {
      TrainedData.copyTree(data, copy);
      new ModelStore(copy.resolve("models")).activate(version);
      StringWriter out = new StringWriter();
      StringWriter err = new StringWriter();
      int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true),
          "--data", copy.toString(), "evaluate", heldOut.toString(), "--mapping",
          TrainedData.root().resolve("demo-data/mapping.properties").toString(), "--target",
          String.valueOf(TARGET));
      String printed = out.toString();
      assertEquals(0, status, err + "\n" + printed);
      String table = printed.substring(0, printed.indexOf("(the last system decides"));
      assertTrue(table.contains("BM25 alone"), table);
      assertFalse(table.contains("reranker alone"), table);
      assertFalse(table.contains("legs disagree"), table);
      if (dense()) {
        assertTrue(table.contains("fused without reranker"), table);
      }
      // What evaluate prints is what the engine measures of the version on its own.
      assertEquals(measured.systems().stream().map(org.precedent.engine.evaluate.SystemReport::name).toList(),
          org.precedent.engine.evaluate.ReportFiles.readJson(new DataDir(copy).latestReport())
              .systems().stream().map(org.precedent.engine.evaluate.SystemReport::name).toList());
    } finally {
      TrainedData.delete(copy);
    }
  }

  @Test
  void aDamagedOrMissingFileIsRefusedByName() throws Exception {
    Path copy = Files.createTempDirectory("precedent-fast-damaged-");
    try {
      Path models = copy.resolve("models");
      TrainedData.copyTree(data.resolve("models").resolve(version), models.resolve(version));
      ModelStore store = new ModelStore(models);
      Path dir = store.directory(version);
      // Edited: one byte of the fusion model.
      Path fusion = dir.resolve("fusion.json");
      byte[] original = Files.readAllBytes(fusion);
      byte[] edited = original.clone();
      edited[edited.length / 2] ^= 1;
      Files.write(fusion, edited);
      ModelLoadException e = assertThrows(ModelLoadException.class, () -> store.verify(version));
      assertTrue(e.getMessage().contains(fusion.toString()), e.getMessage());
      Files.write(fusion, original);
      store.verify(version);
      // Missing: the fusion model gone.
      Files.delete(fusion);
      e = assertThrows(ModelLoadException.class, () -> store.verify(version));
      assertTrue(e.getMessage().contains(fusion + " is missing"), e.getMessage());
      Files.write(fusion, original);
      // A version that claims a reranker (metrics.json without "reranker": false) with a
      // manifest made for what it holds: the reranker's files are missing.
      Path metrics = dir.resolve("metrics.json");
      Files.writeString(metrics, Files.readString(metrics).replace("\"reranker\" : false",
          "\"note\" : \"edited\""));
      org.precedent.api.models.VersionFixtures.remanifest(dir);
      e = assertThrows(ModelLoadException.class, () -> store.verify(version));
      assertTrue(e.getMessage().contains(dir.resolve("model.zip") + " is missing"),
          e.getMessage());
    } finally {
      TrainedData.delete(copy);
    }
  }

  @Test
  void theServiceDecidesWithItAndItsGateKeepsItAgainstAWorseVersion() throws Exception {
    Path copy = Files.createTempDirectory("precedent-fast-service-");
    TrainedData.copyTree(data, copy);
    ModelStore store = new ModelStore(copy.resolve("models"));
    store.activate(version);
    // A worse version with the reranker: v-0001 with every calibration flat at 0.5, so that no
    // threshold is guaranteed for it (the fixture ModelComparisonTest uses).
    String worse = "v-0009";
    org.precedent.api.models.VersionFixtures.flatVersion(copy, worse);
    DataDir dir = new DataDir(copy);
    EvaluationReport candidate;
    try (InForce opened = InForce.open(dir, worse)) {
      candidate = HeldOutEvaluation.measure(opened, parsed, heldOut.getFileName().toString(),
          TARGET, Progress.silent());
    }
    try (InForce active = InForce.open(dir)) {
      VersionComparison c = EvaluateCommand.compared(store, worse, candidate, active, measured,
          heldOut);
      assertTrue(c.candidateWorse(), "the flat version answers fewer tickets: " + c);
      VersionComparisons.write(store, c);
    }
    try (RunningService service = RunningService.startOn(copy)) {
      Reply r = service.http().post("/api/v1/decisions", Map.of("question",
          "My green bin was not emptied this morning"), Caller.AGENT);
      assertEquals(200, r.status(), r.raw().body());
      assertEquals(version, r.json().get("modelVersion").asText());
      for (JsonNode cand : r.json().get("candidates")) {
        assertTrue(cand.get("reranker") == null || cand.get("reranker").isNull(), cand.toString());
      }
      ServiceActivation.Result refused = ServiceActivation.activate(service.context(), worse,
          "test", "a worse version with the reranker");
      assertFalse(refused.activated());
      assertNotNull(refused.objection());
      assertTrue(refused.objection().contains("points fewer"), refused.objection());
      assertEquals(version, service.http().get("/api/v1/models", Caller.MANAGER).json()
          .get("active").asText());
      assertEquals(version, store.activeVersion().orElseThrow());
      // And the version with the reranker, once compared and better or equal, is put in force
      // through the same door, the next decision made with it.
      ServiceActivation.Result back = ServiceActivation.activate(service.context(), "v-0001",
          "test", "not compared: refused too");
      assertFalse(back.activated(), "an uncompared version needs an acknowledgement");
    }
  }
}
