package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringReader;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Properties;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.ReportFiles;
import org.precedent.engine.figures.ExpectedFigures;
import org.precedent.engine.figures.MeasuredFigures;
import org.precedent.engine.fusion.ScoringSystem;
import org.precedent.knowledge.store.DataDir;

/**
 * {@code precedent benchmark figures} on small files: the check, its exit status, recording and the
 * document; and the figures it reads from a trained data directory.
 */
class FiguresCommandTest {
  @TempDir
  Path tmp;

  private record Run(int status, String out, String err) {}

  private static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    int status = PrecedentCommand.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    return new Run(status, out.toString(), err.toString());
  }

  private Path expected() throws Exception {
    return Files.writeString(tmp.resolve("expected.json"), """
        {"about": "small", "measuredWith": {"computeThreads": "1 thread"}, "figures": [
          {"name": "fused.top1", "expected": 0.985, "tolerance": 0.002, "format": "0.000"},
          {"name": "fused.threshold_coverage", "expected": 0.262, "tolerance": 0.01, "format": "0.0%"},
          {"name": "bm25.threshold", "expected": null, "tolerance": 0}
        ]}
        """);
  }

  private Path measured(double top1, double coverage) throws Exception {
    Path file = tmp.resolve("figures.json");
    new MeasuredFigures(Map.of("computeThreads", "2 threads"), Map.of("fused.top1", top1,
        "fused.threshold_coverage", coverage, "bm25.threshold", Double.NaN)).save(file);
    return file;
  }

  @Test
  void passesWithinTheTolerancesAndExitsWithFourOnAMiss() throws Exception {
    Path expected = expected();
    Run ok = run("benchmark", "figures", "--expected", expected.toString(), "--measured",
        measured(0.9861, 0.27).toString());
    assertEquals(0, ok.status(), ok.out() + ok.err());
    assertTrue(ok.out().contains("3 of 3 figures as expected"), ok.out());
    assertTrue(ok.out().contains("other ND4J thread counts"), "the thread counts differ: " + ok.out());

    Run miss = run("benchmark", "figures", "--expected", expected.toString(), "--measured",
        measured(0.9861, 0.827).toString());
    assertEquals(FiguresCommand.FIGURES_DIFFER, miss.status(), miss.out() + miss.err());
    assertTrue(miss.out().lines().anyMatch(l -> l.startsWith("fused.threshold_coverage")
        && l.endsWith("FAIL")), miss.out());
    assertTrue(miss.out().contains("2 of 3 figures as expected; 1 FAIL"), miss.out());
  }

  @Test
  void recordsTheMeasuredFiguresAndWritesThemIntoTheDocument() throws Exception {
    Path expected = expected();
    Path doc = Files.writeString(tmp.resolve("DOC.md"), """
        Fused top-1 **<!--fig fused.top1-->0.985<!--/fig-->**, answering \
        <!--fig fused.threshold_coverage-->26.2%<!--/fig-->; BM25 threshold <!--fig bm25.threshold-->none<!--/fig-->.
        """);
    Run r = run("benchmark", "figures", "--expected", expected.toString(), "--measured",
        measured(0.9815, 0.8266).toString(), "--record", "--update-docs", "--docs", doc.toString());
    assertEquals(0, r.status(), "recording accepts the new figures: " + r.out() + r.err());
    assertTrue(r.out().contains("1 of 3 figures as expected; 2 FAIL"), "the table still shows what changed: " + r.out());

    ExpectedFigures now = ExpectedFigures.load(expected);
    assertEquals(0.9815, now.figure("fused.top1").orElseThrow().expected());
    assertEquals(0.002, now.figure("fused.top1").orElseThrow().tolerance());
    assertNull(now.figure("bm25.threshold").orElseThrow().expected());
    assertEquals("2 threads", now.measuredWith().get("computeThreads"));
    assertEquals("""
        Fused top-1 **<!--fig fused.top1-->0.982<!--/fig-->**, answering \
        <!--fig fused.threshold_coverage-->82.7%<!--/fig-->; BM25 threshold <!--fig bm25.threshold-->none<!--/fig-->.
        """, Files.readString(doc));

    Run again = run("benchmark", "figures", "--expected", expected.toString(), "--measured",
        measured(0.9815, 0.8266).toString(), "--update-docs", "--docs", doc.toString());
    assertEquals(0, again.status(), again.out());
    assertTrue(again.out().contains("3 marked figures in " + doc + " already as expected"), again.out());
  }

  @Test
  void aBadExpectedFileIsOneLineNamingIt() throws Exception {
    Path bad = Files.writeString(tmp.resolve("bad.json"), "{\"figures\": [{\"name\": \"x\"}]}");
    Run r = run("benchmark", "figures", "--expected", bad.toString(), "--measured",
        measured(0.98, 0.2).toString());
    assertEquals(PrecedentCommand.FAILED, r.status());
    assertTrue(r.err().startsWith("precedent: " + bad + ": figures[0]: figure x: 'expected'"), r.err());
  }

  @Test
  void measuresTheActiveModelFromItsReportItsTrainingAndTheSamples() throws Exception {
    Path data = TrainedData.copy();
    Path demo = TrainedData.root().resolve("demo-data");
    Run evaluated = run("--data", data.toString(), "evaluate", demo.resolve("heldout.csv").toString(),
        "--mapping", demo.resolve("mapping.properties").toString(), "--apply");
    assertEquals(0, evaluated.status(), evaluated.err());

    MeasuredFigures m = FiguresCommand.measure(new DataDir(data));
    EvaluationReport report = ReportFiles.readJson(data.resolve("reports").resolve("latest.json"));
    assertEquals(600.0, m.figures().get("heldout.tickets"));
    assertEquals((double) report.inScopeTickets(), m.figures().get("heldout.in_scope"));
    // Each system under its own name; the deciding one (the cascade, with this model's dense leg)
    // is the report's last.
    assertEquals(report.systems().stream().filter(s -> s.name().equals(ScoringSystem.FUSED.label()))
        .findFirst().orElseThrow().measures().top1(), m.figures().get("fused.top1"));
    var deciding = report.systems().get(report.systems().size() - 1);
    ScoringSystem decides = java.util.Arrays.stream(ScoringSystem.values())
        .filter(s -> s.label().equals(deciding.name())).findFirst().orElseThrow();
    assertEquals(deciding.measures().top1(),
        m.figures().get(decides.name().toLowerCase(java.util.Locale.ROOT) + ".top1"));
    // The anti-LM weight as the model version's own settings file records it.
    Properties config = new Properties();
    config.load(new StringReader(Files.readString(data.resolve("models/v-0001/config.properties"))));
    assertEquals(Double.parseDouble(config.getProperty("antiLmLambda")),
        m.figures().get("training.anti_lm_lambda"));
    double replied = m.figures().get("samples.replied");
    assertTrue(replied >= 0 && replied <= DemoCommand.SAMPLES.size() && replied == Math.rint(replied));
    assertTrue(m.measuredWith().get("model").startsWith("v-0001, data "), m.measuredWith().toString());
    assertEquals("1 thread", m.measuredWith().get("computeThreads"), "surefire runs with OMP_NUM_THREADS=1");
    TrainedData.delete(data);
  }
}
