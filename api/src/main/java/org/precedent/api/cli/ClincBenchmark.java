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
import picocli.CommandLine.Spec;

@Command(name = "clinc150", mixinStandardHelpOptions = true,
    description = {"Runs Precedent on CLINC150 as Larson et al. (2019) do, next to their figures.",
        "It trains on 'train', tunes on 'val' + 'oos_val' and tests on 'test' + 'oos_test', then "
            + "reports in-scope accuracy and out-of-scope recall at the validation-tuned threshold "
            + "next to the paper's Table 2."})
final class ClincBenchmark implements Callable<Integer> {
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
      description = "Most reranker epochs (default ${DEFAULT-VALUE}).")
  int epochs;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Clinc150 clinc = datasets == null ? Clinc150.load() : Clinc150.load(datasets);
    ClincEvaluation evaluation = ClincEvaluation.of(clinc, domain);
    out.printf(Locale.ROOT, "CLINC150 %s: %,d train, %,d validation (with out-of-scope), %,d test "
        + "(with out-of-scope)%n", evaluation.scope(), evaluation.train().size(),
        evaluation.validation().size(), evaluation.test().size());
    out.flush();
    NumericLibrary.announce(spec.commandLine().getErr());
    ClincEvaluation.Result result = evaluation.run(Path.of(System.getProperty("java.io.tmpdir")),
        epochs, System.err);
    out.println(result.trainingSummary());
    out.printf(Locale.ROOT, "trained in %.0f s%n", result.trainingSeconds());
    out.println();
    out.println("system            threshold  in-scope accuracy  out-of-scope recall");
    for (ClincEvaluation.Row row : result.rows()) {
      out.printf(Locale.ROOT, "%-17s %9.3f  %17.1f  %19.1f%n", row.system(), row.threshold(),
          100 * row.inScopeAccuracy(), 100 * row.outOfScopeRecall());
    }
    out.println(ClincEvaluation.PUBLISHED);
    return 0;
  }
}
