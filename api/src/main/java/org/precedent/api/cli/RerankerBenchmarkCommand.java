package org.precedent.api.cli;

import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.engine.evaluate.SelfNormalizationReport;
import org.precedent.engine.rerank.bench.RerankerBenchmark;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
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

  @Option(names = "--model-version", paramLabel = "V",
      description = "Instead of the speed figures, measure how near a self-normalised model version "
          + "of the data directory (v-NNNN) scores by logits to its exact scores: |log Z| and the "
          + "candidates' order both ways, on the tickets of the fusion split.")
  String version;

  @Option(names = "--questions", paramLabel = "N", defaultValue = "400",
      description = "With --model-version, most questions asked (default ${DEFAULT-VALUE}).")
  int questions;

  @ParentCommand
  BenchmarkCommand parent;

  @Spec
  CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    NumericLibrary.announce(spec.commandLine().getErr());
    if (version != null) {
      DataDir dataDir = new DataDir(parent.parent.dataDir());
      Optional<Knowledge> knowledge = Knowledge.open(dataDir);
      if (knowledge.isEmpty()) {
        spec.commandLine().getErr().println("precedent benchmark reranker: no tickets in "
            + dataDir.root());
        return PrecedentCommand.FAILED;
      }
      SelfNormalizationReport.print(knowledge.get(), new ModelStore(dataDir.models()).load(version),
          questions, spec.commandLine().getOut());
      return 0;
    }
    RerankerBenchmark.main(new String[] {"" + trainBatches, "" + repetitions});
    return 0;
  }
}
