package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.engine.evaluate.ClincEvaluation;
import org.precedent.knowledge.datasets.Clinc150;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "clinc150", mixinStandardHelpOptions = true,
    description = {"Runs Precedent on CLINC150 as Larson et al. (2019) do, next to their figures.",
        "It trains on 'train', fits fusion and tunes the threshold on 'val' + 'oos_val' and tests "
            + "on 'test' + 'oos_test', then reports for each scoring system its in-scope top-1 "
            + "with no threshold, and in-scope accuracy and out-of-scope recall at the threshold "
            + "that maximises their sum on validation, next to the paper's Table 2.",
        "Everything is kept in the work directory: run again to continue after an interruption "
            + "or to print the figures again; nothing finished is embedded, trained or scored "
            + "twice."})
final class ClincBenchmark implements Callable<Integer> {
  @ParentCommand
  BenchmarkCommand benchmark;

  @Spec
  CommandSpec spec;

  @Option(names = "--datasets", paramLabel = "DIR",
      description = "The shared datasets folder (default: ../shared/datasets beside the checkout, "
          + "or -Dprecedent.datasets).")
  Path datasets;

  @Option(names = "--domain", paramLabel = "NAME",
      description = "One domain only (e.g. banking), out-of-scope queries included; default: all.")
  String domain;

  @Option(names = "--epochs", paramLabel = "N", defaultValue = "10",
      description = "Most reranker epochs (default ${DEFAULT-VALUE}); a model already trained in "
          + "the work directory is kept whatever this says.")
  int epochs;

  @Option(names = "--work", paramLabel = "DIR",
      description = "Where the run keeps its knowledge, model and scores (default: "
          + "benchmarks/clinc150-SCOPE in the data directory).")
  Path work;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Clinc150 clinc = datasets == null ? Clinc150.load() : Clinc150.load(datasets);
    ClincEvaluation evaluation = ClincEvaluation.of(clinc, domain);
    Path dir = work != null ? work : benchmark.parent.dataDir().resolve("benchmarks")
        .resolve("clinc150-" + evaluation.scope());
    out.printf(Locale.ROOT, "CLINC150 %s: %,d train, %,d validation (with out-of-scope), %,d test "
        + "(with out-of-scope); work directory %s%n", evaluation.scope(),
        evaluation.train().size(), evaluation.validation().size(), evaluation.test().size(), dir);
    out.flush();
    NumericLibrary.announce(spec.commandLine().getErr());
    ClincEvaluation.Result result = evaluation.run(dir, epochs, System.err);
    out.println(result.trainingSummary());
    out.printf(Locale.ROOT, "reranker trained in %.0f s%n", result.trainingSeconds());
    out.println();
    out.println("Test, in %. Top-1: in-scope questions, no threshold. At the threshold tuned on "
        + "validation (maximising in-scope accuracy + out-of-scope recall there): in-scope "
        + "questions answered and right, out-of-scope questions held back; validation's own "
        + "figures at that threshold in brackets.");
    out.printf(Locale.ROOT, "%-40s %6s %9s %9s %9s %16s %8s%n", "system", "top-1", "threshold",
        "in-scope", "oos rec.", "(validation)", "reranked");
    for (ClincEvaluation.Row row : result.rows()) {
      out.printf(Locale.ROOT, "%-40s %6.1f %9.3f %9.1f %9.1f %16s %7.1f%%%n", row.system(),
          100 * row.inScopeTop1(), row.threshold(), 100 * row.inScopeAccuracy(),
          100 * row.outOfScopeRecall(), String.format(Locale.ROOT, "(%.1f / %.1f)",
              100 * row.validationInScope(), 100 * row.validationOutOfScope()),
          100 * row.reranked());
    }
    out.println(ClincEvaluation.PUBLISHED);
    return 0;
  }
}
