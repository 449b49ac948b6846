package org.precedent.api.cli;

import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

@Command(name = "benchmark", mixinStandardHelpOptions = true,
    description = "Measures Precedent's speed and prints the figures.",
    subcommands = {RetrievalBenchmark.class, RerankerBenchmarkCommand.class,
        EncoderBenchmark.class, DecisionBenchmark.class,
        ClincBenchmark.class, ServiceBenchmark.class, QueueBenchmark.class, FiguresCommand.class})
final class BenchmarkCommand implements Callable<Integer> {
  @picocli.CommandLine.ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Override
  public Integer call() {
    spec.commandLine().usage(spec.commandLine().getOut());
    return 0;
  }
}
