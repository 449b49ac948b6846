package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.engine.decide.ActiveModel;
import org.precedent.engine.decide.Ranker;
import org.precedent.engine.decide.Thresholds;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.EvaluationReports;
import org.precedent.engine.evaluate.HeldOutRuns;
import org.precedent.engine.evaluate.HtmlReport;
import org.precedent.engine.evaluate.ReportFiles;
import org.precedent.engine.evaluate.SystemReport;
import org.precedent.engine.measure.ThresholdDecimals;
import org.precedent.engine.measure.ThresholdRecommendation;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.ticket.Ticket;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "evaluate", mixinStandardHelpOptions = true,
    description = {"Measures the model on held-out tickets and recommends a threshold.",
        // picocli formats descriptions: a percent sign is written %%.
        "It compares BM25 alone, the reranker alone and the fused system side by side on held-out "
            + "resolved tickets (never ingested). The recommended threshold is the lowest one whose "
            + "automatic replies reach the target precision with 95%% confidence.",
        "The right answer of each held-out ticket is its label (if a label column is mapped) or "
            + "the answer group its reply reuses; a ticket whose reply reuses none is out of scope.",
        "Writes a JSON and an HTML report."})
final class EvaluateCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(paramLabel = "FILE", description = "Held-out tickets (CSV or JSON Lines).")
  Path file;

  @Mixin
  ColumnOptions columns;

  @Option(names = "--target", paramLabel = "P", defaultValue = "0.95",
      description = "Target precision of automatic replies (default ${DEFAULT-VALUE}).")
  double target;

  @Option(names = "--out", paramLabel = "DIR",
      description = "Where the reports go (default: DATA/reports).")
  Path out;

  @Option(names = "--compare-to", paramLabel = "REPORT.json",
      description = "An earlier report to show changes against.")
  Path compareTo;

  @Option(names = "--apply", description = "Put the fused system's guaranteed threshold in force.")
  boolean apply;

  @Override
  public Integer call() throws Exception {
    PrintWriter w = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    EvaluationReport previous = compareTo == null ? null : ReportFiles.readJson(compareTo);
    // The file is read before the model is opened: a wrong file name is said at once.
    Ingestor.ParsedExport parsed = new Ingestor(dataDir, TextCleaner.standard(),
        AnswerGrouper.standard())
        .parse(file, ExportFormat.of(file), columns.mapping(file, spec), Progress.silent());
    for (var p : parsed.problems()) {
      spec.commandLine().getErr().println("skipped: " + p);
    }
    NumericLibrary.announce(spec.commandLine().getErr());
    try (ActiveModel active = ActiveModel.open(dataDir)) {
      Evaluation result = evaluate(active, parsed, file.getFileName().toString(), target,
          out != null ? out : dataDir.root().resolve("reports"), previous);
      print(w, result);
      if (apply) {
        applyThreshold(w, dataDir, active, result.report());
      }
    }
    return 0;
  }

  /**
   * A finished evaluation.
   *
   * @param report    the report
   * @param questions the held-out questions and their truth
   * @param html      where the HTML report was written
   * @param json      where the JSON report was written
   */
  record Evaluation(EvaluationReport report, List<HeldOutRuns.HeldOutQuestion> questions, Path html,
      Path json, long safetyHandOffs) {}

  /** Runs the three systems over parsed held-out tickets and writes the reports into {@code dir}. */
  static Evaluation evaluate(ActiveModel active, Ingestor.ParsedExport parsed, String dataset,
      double target, Path dir, EvaluationReport previous) throws java.io.IOException {
    var replyMatcher = AnswerGrouper.standard().matcher(active.knowledge().grouping());
    List<HeldOutRuns.HeldOutQuestion> questions = new ArrayList<>();
    var groups = active.knowledge().grouping().byId();
    for (Ticket t : parsed.tickets()) {
      String right = t.label() != null ? (groups.containsKey(t.label()) ? t.label() : null)
          : replyMatcher.apply(t.reply()).map(AnswerGroup::id).orElse(null);
      questions.add(new HeldOutRuns.HeldOutQuestion(t.id(), t.question(), t.category(), right));
    }
    var runs = HeldOutRuns.run(active.retriever(), active.scorer(),
        new Ranker(active.fusion()), active.safety(), questions, new Progress("evaluating", "tickets", System.err));
    EvaluationReport report = EvaluationReports.build(dataset + " (model " + active.version()
        + ")", runs, target);
    org.precedent.knowledge.io.AtomicFiles.createPrivateDirectories(dir);
    String stamp = DateTimeFormatter.ofPattern("yyyyMMdd-HHmmss").withZone(ZoneOffset.UTC)
        .format(Instant.now());
    Path json = dir.resolve("evaluation-" + stamp + ".json");
    Path html = dir.resolve("evaluation-" + stamp + ".html");
    ReportFiles.writeJson(report, json);
    ReportFiles.writeJson(report, dir.resolve("latest.json"));
    ReportFiles.writeHtml(HtmlReport.render(report, previous), html);
    // In service the safety gate hands these off whatever the confidence says.
    return new Evaluation(report, questions, html, json, fused(report).safetyHandOffs());
  }

  /** Puts the fused system's guaranteed threshold in force, when there is one. */
  static void applyThreshold(PrintWriter w, DataDir dataDir, ActiveModel active,
      EvaluationReport report) throws java.io.IOException {
    ThresholdRecommendation r = fused(report).recommendation();
    if (r.repliesAutomatically()) {
      ActiveModel.writeThresholds(dataDir, new Thresholds(r.threshold(),
          active.thresholds().perCategory()));
      w.println("threshold " + ThresholdDecimals.of(r.threshold()) + " is now in force for automatic "
          + "replies");
    } else {
      w.println("no threshold could be guaranteed; the threshold in force is unchanged");
    }
  }

  static SystemReport fused(EvaluationReport report) {
    return report.systems().get(report.systems().size() - 1);
  }

  static void print(PrintWriter w, Evaluation result) {
    EvaluationReport report = result.report();
    List<HeldOutRuns.HeldOutQuestion> qs = result.questions();
    long inScope = qs.stream().filter(q -> q.rightGroup() != null).count();
    w.printf(Locale.ROOT, "%d held-out tickets: %d with a known answer, %d out of scope%n",
        qs.size(), inScope, qs.size() - inScope);
    w.printf(Locale.ROOT, "%-16s %7s %7s %7s %7s %7s %7s %9s%n", "system", "top-1", "MRR",
        "R@10", "ECE", "Brier", "AUROC", "cov@95%");
    for (SystemReport s : report.systems()) {
      var m = s.measures();
      w.printf(Locale.ROOT, "%-16s %7.3f %7.3f %7.3f %7.3f %7.3f %7.3f %9.3f%n", s.name(), m.top1(),
          m.meanReciprocalRank(), m.recallAt10(), m.expectedCalibrationError(), m.brierScore(),
          m.auroc(), m.coverageAt95());
    }
    w.println(fused(report).recommendation().explanation());
    w.printf(Locale.ROOT, "%d of these tickets fall under a safety rule or a people-only category: in "
        + "service they are handed off whatever the confidence (the figures above measure the model "
        + "alone)%n", result.safetyHandOffs());
    w.println("report: " + result.html());
    w.println("        " + result.json());
  }
}
