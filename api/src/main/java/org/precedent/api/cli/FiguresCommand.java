package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.Callable;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.decide.Outcome;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.ReportFiles;
import org.precedent.engine.figures.ExpectedFigures;
import org.precedent.engine.figures.FigureCheck;
import org.precedent.engine.figures.FigureDocs;
import org.precedent.engine.figures.MeasuredFigures;
import org.precedent.engine.rerank.TrainingMetrics;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "figures", mixinStandardHelpOptions = true,
    description = {"Checks that the demo reproduces the documented figures.",
        "Runs the demo (ingest, train unless already trained on these tickets, evaluate on the",
        "held-out tickets, decide the sample questions) in its own data directory, compares each",
        "figure with its expected value and tolerance (docs/expected-metrics.json) and prints a",
        "table; the exit status is 4 when a figure is off.",
        "--record makes the measured figures the expected ones; --update-docs writes the expected",
        "figures into DEVELOPERS.md where it marks them."})
final class FiguresCommand implements Callable<Integer> {
  /** Exit status when a measured figure lies outside its tolerance. */
  static final int FIGURES_DIFFER = 4;
  static final String MEASURED_FILE = "figures.json";

  @ParentCommand
  BenchmarkCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--demo-data", paramLabel = "DIR",
      description = "The demo tickets (default: demo-data/ of the Precedent checkout).")
  Path demoData;

  @Option(names = "--expected", paramLabel = "FILE",
      description = "The expected figures (default: docs/expected-metrics.json of the checkout).")
  Path expected;

  @Option(names = "--measured", paramLabel = "FILE",
      description = "Check the figures an earlier run wrote (DATA/reports/" + MEASURED_FILE
          + ") instead of running the demo.")
  Path measured;

  @Option(names = "--record", description = "Write the measured figures into the expected-figures "
      + "file as the new expected values (names, tolerances and formats stay).")
  boolean record;

  @Option(names = "--update-docs", description = "Write the expected figures into the document at its "
      + "<!--fig NAME--> markers.")
  boolean updateDocs;

  @Option(names = "--docs", paramLabel = "FILE",
      description = "The document --update-docs writes (default: DEVELOPERS.md of the checkout).")
  Path docs;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Path expectedFile = expected != null ? expected : home().resolve("docs").resolve("expected-metrics.json");
    ExpectedFigures expectedFigures = ExpectedFigures.load(expectedFile);
    MeasuredFigures figures;
    if (measured != null) {
      figures = MeasuredFigures.load(measured);
    } else {
      Path data = parent.parent.data != null ? parent.parent.data
          : Path.of(System.getProperty("user.home"), ".precedent-figures");
      List<String> args = new ArrayList<>(List.of("--data", data.toString(), "demo", "--no-serve"));
      if (demoData != null) {
        args.addAll(List.of("--demo-data", demoData.toString()));
      }
      int status = PrecedentCommand.run(out, spec.commandLine().getErr(), args.toArray(new String[0]));
      if (status != 0) {
        return status;
      }
      figures = measure(new DataDir(data));
      Path file = new DataDir(data).reports().resolve(MEASURED_FILE);
      figures.save(file);
      out.println();
      out.println("measured figures: " + file);
    }

    out.println("expected figures: " + expectedFile);
    out.println("  measured with: " + describe(expectedFigures.measuredWith()));
    out.println("  this run:      " + describe(figures.measuredWith()));
    String then = expectedFigures.measuredWith().get("computeThreads");
    String now = figures.measuredWith().get("computeThreads");
    if (then != null && now != null && !then.equals(now)) {
      out.println("  (other ND4J thread counts add sums in another order: expect small differences)");
    }
    List<FigureCheck.Row> rows = FigureCheck.compare(expectedFigures, figures.figures());
    out.print(FigureCheck.table(rows));
    out.flush();

    if (record) {
      expectedFigures = expectedFigures.recorded(figures.figures(), figures.measuredWith());
      expectedFigures.save(expectedFile);
      out.println("recorded these figures as the expected ones in " + expectedFile);
    }
    if (updateDocs) {
      Path doc = docs != null ? docs : home().resolve("DEVELOPERS.md");
      String before = Files.readString(doc, StandardCharsets.UTF_8);
      String after = FigureDocs.regenerate(before, expectedFigures, doc.toString());
      if (!after.equals(before)) {
        AtomicFiles.writeString(doc, after);
      }
      out.printf("%d marked figures in %s %s%n", FigureDocs.markers(after), doc,
          after.equals(before) ? "already as expected" : "rewritten from the expected figures");
    }
    return record || FigureCheck.allPass(rows) ? 0 : FIGURES_DIFFER;
  }

  /**
   * The figures of the model active in {@code dataDir}: its last evaluation report, its training
   * figures, and how many sample questions it answers automatically at the threshold in force.
   */
  static MeasuredFigures measure(DataDir dataDir) throws IOException {
    EvaluationReport report = ReportFiles.readJson(dataDir.latestReport());
    try (InForce active = InForce.open(dataDir)) {
      ModelStore store = new ModelStore(dataDir.models());
      TrainingMetrics training = store.trainingMetrics(active.version()).orElseThrow(() -> new IOException(
          store.directory(active.version()) + ": the model version has no training figures"));
      Map<String, Double> values = new LinkedHashMap<>(MeasuredFigures.of(report));
      values.putAll(MeasuredFigures.of(training));
      Pipeline pipeline = active.pipeline();
      long replied = DemoCommand.SAMPLES.stream()
          .filter(q -> pipeline.decide(q, null).outcome() == Outcome.REPLY).count();
      values.put("samples.replied", (double) replied);
      Map<String, String> with = new LinkedHashMap<>();
      with.put("date", Instant.now().truncatedTo(ChronoUnit.SECONDS).toString());
      with.put("model", active.version() + ", data " + store.dataFingerprint(active.version()).orElse("?"));
      with.put("computeThreads", Objects.toString(training.computeThreads(), "not recorded"));
      with.put("machine", cpu() + ", " + Runtime.getRuntime().availableProcessors() + " cores");
      with.put("java", System.getProperty("java.vm.name") + " " + System.getProperty("java.version"));
      return new MeasuredFigures(with, values);
    }
  }

  private static String describe(Map<String, String> with) {
    if (with.isEmpty()) {
      return "(not recorded)";
    }
    List<String> parts = new ArrayList<>();
    with.forEach((k, v) -> parts.add(k + " " + v));
    return String.join("; ", parts);
  }

  private static String cpu() {
    try {
      for (String line : Files.readAllLines(Path.of("/proc/cpuinfo"), StandardCharsets.UTF_8)) {
        if (line.startsWith("model name")) {
          return line.substring(line.indexOf(':') + 1).trim();
        }
      }
    } catch (IOException | RuntimeException e) {
      // not Linux, or not readable: the architecture is all there is to say
    }
    return System.getProperty("os.arch");
  }

  private static Path home() {
    String home = System.getProperty("precedent.home");
    return home != null ? Path.of(home) : Path.of("");
  }
}
