package org.precedent.api.cli;

import java.util.concurrent.Callable;
import org.precedent.engine.rerank.bench.RerankerBenchmark;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "reranker", mixinStandardHelpOptions = true,
    description = {"Measures the reranker's training and scoring speed.",
        "It reports the reranker's training target tokens/s and its latency to score 10 candidates "
            + "(p50, p99) at the default size, with the machine's ND4J matrix-multiply rate "
            + "(GFLOP/s) and the share of it the reranker achieves. Set OMP_NUM_THREADS before "
            + "starting."})
final class RerankerBenchmarkCommand implements Callable<Integer> {
  @Option(names = "--train-batches", paramLabel = "N", defaultValue = "30",
      description = "Training batches timed (default ${DEFAULT-VALUE}).")
  int trainBatches;

  @Option(names = "--repetitions", paramLabel = "N", defaultValue = "200",
      description = "Scoring passes timed (default ${DEFAULT-VALUE}).")
  int repetitions;

  @Spec
  CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    NumericLibrary.announce(spec.commandLine().getErr());
    RerankerBenchmark.main(new String[] {"" + trainBatches, "" + repetitions});
    return 0;
  }
}
