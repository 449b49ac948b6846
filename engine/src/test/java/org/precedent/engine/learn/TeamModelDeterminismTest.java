package org.precedent.engine.learn;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.engine.fusion.FusionModel;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.RerankerModel;
import org.precedent.engine.rerank.TrainingMetrics;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;

/**
 * The whole training of a team's model, twice from the same tickets into two data directories:
 * grouping, splits, reranker, fusion and calibration come out the same, bit for bit (wall-clock
 * figures aside).
 */
@Tag("slow")
class TeamModelDeterminismTest {
  private static final int TICKETS = 400;

  @Test
  void trainingTwiceOnTheSameTicketsGivesTheSameModelAndFusion(@TempDir Path one, @TempDir Path two)
      throws Exception {
    Trained a = trainOn(one);
    Trained b = trainOn(two);

    assertArrayEquals(a.weights(), b.weights(), "reranker weights differ");
    TrainingMetrics ma = a.metrics();
    TrainingMetrics mb = b.metrics();
    assertEquals(ma.validationLoss(), mb.validationLoss());
    assertEquals(ma.antiLmLambda(), mb.antiLmLambda());
    assertEquals(ma.validationTop1(), mb.validationTop1());
    assertEquals(ma.computeThreads(), mb.computeThreads());
    // fusion.json holds the three systems' weights, standardisation, Platt parameters and the
    // out-of-fold figures, written with the doubles' shortest exact form: equal text, equal numbers.
    assertEquals(a.fusionJson(), b.fusionJson());
    assertTrue(a.fusionJson().contains("top1_in_scope"), "fusion.json lacks its validation figures");
    assertEquals(a.fusion().validation(), b.fusion().validation());
  }

  private record Trained(float[] weights, TrainingMetrics metrics, String fusionJson,
      FusionModel fusion) {}

  private static Trained trainOn(Path dir) throws Exception {
    DataDir data = new DataDir(dir);
    Path demo = root().resolve("demo-data");
    ColumnMapping mapping = ColumnMapping.fromFile(demo.resolve("mapping.properties"), Map.of());
    Ingestor ingestor = new Ingestor(data, TextCleaner.standard(), AnswerGrouper.standard());
    Ingestor.ParsedExport all = ingestor.parse(demo.resolve("tickets.csv"), ExportFormat.CSV,
        mapping, Progress.silent());
    List<Ticket> some = all.tickets().subList(0, TICKETS);
    ingestor.store(new Ingestor.ParsedExport(all.file(), TICKETS, 0, some, List.of(), List.of()),
        Progress.silent());
    RerankerConfig tiny = RerankerConfig.defaults().withSizes(16, 32).withEpochs(2, 1)
        .withMaxTokens(24, 16);
    TrainingReport report;
    Knowledge knowledge = Knowledge.open(data).orElseThrow();
    report = new TeamModelTrainer(data, tiny).train(knowledge, false);
    ModelStore store = new ModelStore(data.models());
    RerankerModel model = store.load(report.version());
    Path version = store.directory(report.version());
    return new Trained(model.network().params().dup().toFloatVector(), report.reranker(),
        Files.readString(version.resolve("fusion.json")), FusionModel.load(version));
  }

  private static Path root() {
    String root = System.getProperty("precedent.root");
    return root != null ? Path.of(root) : Path.of("..").toAbsolutePath().normalize();
  }
}
