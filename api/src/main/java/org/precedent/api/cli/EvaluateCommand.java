package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.Callable;
import org.precedent.api.models.Activations;
import org.precedent.engine.evaluate.VersionComparison;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.evaluate.ReportFiles;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.store.DataDir;
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
        "It compares BM25 alone, the dense leg alone, the reranker alone, fusion without the reranker "
            + "and the fused system side by side on held-out "
            + "resolved tickets (never ingested). The recommended threshold is the lowest one whose "
            + "automatic replies reach the target precision with 95%% confidence.",
        "The right answer of each held-out ticket is its label (if a label column is mapped) or "
            + "the answer group its reply reuses; a ticket whose reply reuses none is out of scope.",
        "When a newer version than the one in force exists (a candidate of train), or "
            + "--candidate names one, it is measured on the same tickets too, and the two are "
            + "compared side by side; the comparison is kept in the candidate's directory, where "
            + "activate and the service's activation read it.",
        "It also shows coverage and precision at the threshold with the answer library's "
            + "approval gate and without it, and what approving drafted answers would add.",
        "Writes a JSON and an HTML report."})
final class EvaluateCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(index = "0", paramLabel = "FILE",
      description = "Held-out tickets (CSV or JSON Lines).")
  Path file;

  @Parameters(index = "1..*", paramLabel = "SETTING", arity = "0..*",
      description = "With --apply, after --: the database settings serve is given, as "
          + "--name=value; the environment's SPRING_DATASOURCE_URL, _USERNAME and _PASSWORD are "
          + "read as serve reads them.")
  List<String> settings;

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

  @Option(names = "--apply", description = "Put the fused system's guaranteed threshold in force, "
      + "recorded in the threshold audit of the service's database: the data directory's own "
      + "(refused while the service runs on it), or the PostgreSQL the service is set to use, "
      + "whose replicas then put it in force.")
  boolean apply;

  @Option(names = "--candidate", paramLabel = "VERSION",
      description = "The version to compare with the one in force (default: the newest, when it "
          + "is not the one in force).")
  String candidate;

  @Option(names = "--reason", paramLabel = "TEXT",
      description = "Why, for the threshold audit (default: the evaluation it comes from).")
  String reason;

  @Override
  public Integer call() throws Exception {
    PrintWriter w = spec.commandLine().getOut();
    for (String setting : settings == null ? List.<String>of() : settings) {
      if (!apply || !setting.startsWith("--") || setting.indexOf('=') < 0) {
        throw new picocli.CommandLine.ParameterException(spec.commandLine(), "'" + setting
            + "': after the file, only the service's settings for --apply, as --name=value");
      }
    }
    DataDir dataDir = new DataDir(parent.dataDir());
    EvaluationReport previous = compareTo == null ? null : ReportFiles.readJson(compareTo);
    // The file is read before the model is opened: a wrong file name is said at once.
    // Read as ingest reads, so that held-out replies keep the organisation's own details too.
    Ingestor.ParsedExport parsed = Ingestor.of(dataDir, AnswerGrouper.standard())
        .parse(file, ExportFormat.of(file), columns.mapping(file, spec), Progress.silent());
    for (var p : parsed.problems()) {
      spec.commandLine().getErr().println("skipped: " + p);
    }
    NumericLibrary.announce(spec.commandLine().getErr());
    try (InForce active = InForce.open(dataDir)) {
      HeldOutEvaluation result = HeldOutEvaluation.run(dataDir, active, parsed,
          file.getFileName().toString(), target, out != null ? out : dataDir.reports(), previous,
          new Progress("evaluating", "tickets", System.err));
      EvaluationPrinter.print(w, result);
      if (apply) {
        EvaluationPrinter.applyThreshold(w, dataDir, settings == null ? List.of() : settings,
            result, reason != null ? reason
            : "guaranteed threshold of the evaluation " + result.json() + " at target precision "
                + target);
      }
      EvaluationPrinter.approval(w, dataDir, result, active.thresholds().global());
      compare(w, dataDir, active, result, parsed);
    }
    return 0;
  }

  /** Measures the candidate on the same tickets and keeps the comparison in its directory. */
  private void compare(PrintWriter w, DataDir dataDir, InForce active, HeldOutEvaluation result,
      Ingestor.ParsedExport parsed) throws java.io.IOException {
    ModelStore store = new ModelStore(dataDir.models());
    String version = candidate;
    if (version == null) {
      List<String> all = store.versions();
      version = all.isEmpty() ? null : all.get(all.size() - 1);
      if (version == null || version.equals(active.version())) {
        return;
      }
    }
    if (version.equals(active.version())) {
      throw new IllegalArgumentException("--candidate " + version + " is the version in force");
    }
    InForce opened;
    try {
      store.verify(version);
      if (store.fingerprint(version).equals(store.fingerprint(active.version()))) {
        // The same files (a copy): the same figures, without measuring them twice.
        keep(w, store, version, active, result.report(), result);
        w.println("(" + version + " holds the same files as " + active.version() + ")");
        return;
      }
      opened = InForce.open(dataDir, version);
    } catch (ModelLoadException e) {
      if (candidate != null) {
        throw e;
      }
      w.println("candidate " + version + " cannot be measured: " + Messages.oneLine(e));
      return;
    }
    try (InForce other = opened) {
      var report = HeldOutEvaluation.measure(other, parsed, file.getFileName().toString(), target,
          new Progress("evaluating " + version, "tickets", System.err));
      keep(w, store, version, active, report, result);
    }
  }

  /**
   * The comparison of {@code version}, measured as {@code report}, with the version {@code
   * active} holds, measured as {@code inForceReport}, on the held-out {@code file}.
   */
  static VersionComparison compared(ModelStore store, String version,
      org.precedent.engine.evaluate.EvaluationReport report, InForce active,
      org.precedent.engine.evaluate.EvaluationReport inForceReport, Path file)
      throws java.io.IOException {
    var basis = new VersionComparison.Basis(store.fingerprint(version),
        store.fingerprint(active.version()),
        active.knowledge().generation().getFileName().toString(),
        file.getFileName().toString(), AtomicFiles.sha256(file));
    return VersionComparison.of(version, report, active.version(), inForceReport, basis,
        Instant.now());
  }

  private void keep(PrintWriter w, ModelStore store, String version, InForce active,
      org.precedent.engine.evaluate.EvaluationReport report, HeldOutEvaluation result)
      throws java.io.IOException {
    VersionComparison c = compared(store, version, report, active, result.report(), file);
    Path kept = VersionComparisons.write(store, c);
    w.println();
    Activations.lines(c).forEach(w::println);
    if (c.candidateWorse()) {
      w.println(version + " answers fewer held-out tickets at the target precision: activating "
          + "it needs an acknowledgement (precedent activate " + version + " --acknowledge "
          + "--reason TEXT)");
    } else {
      w.println("to put " + version + " in force: precedent activate " + version
          + " --reason TEXT");
    }
    w.println("comparison: " + kept);
  }
}
