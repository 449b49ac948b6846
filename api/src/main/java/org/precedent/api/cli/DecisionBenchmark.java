package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.precedent.demo.DemoTicketGenerator;
import org.precedent.engine.decide.Decision;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.decide.RerankerUse;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "decisions", mixinStandardHelpOptions = true,
    description = {"Measures a decision's cost in the engine, without HTTP, each way of running "
        + "the reranker side by side.",
        "On the data directory's model in force it decides generated demo-style questions, first "
            + "on one thread, then on --threads threads at once, for each reranker setting "
            + "(always, on-disagreement, never), and reports decisions/s, p50 and p99, the share "
            + "of decisions that ran the reranker, and each setting's speed against 'always'."})
final class DecisionBenchmark implements Callable<Integer> {
  @ParentCommand
  BenchmarkCommand benchmark;

  @Spec
  CommandSpec spec;

  @Option(names = "--questions", paramLabel = "N", defaultValue = "300",
      description = "Decisions timed per setting and thread count (default ${DEFAULT-VALUE}), "
          + "after a fifth as many to warm up.")
  int questions;

  @Option(names = "--threads", paramLabel = "N", defaultValue = "2",
      description = "Threads deciding at once in the second measurement (default "
          + "${DEFAULT-VALUE}).")
  int threads;

  /** One setting's figures. */
  private record Run(double perSecond, double p50Ms, double p99Ms, double reranked) {}

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (questions < 1 || threads < 1) {
      throw new picocli.CommandLine.ParameterException(spec.commandLine(),
          "--questions and --threads must be at least 1");
    }
    NumericLibrary.announce(spec.commandLine().getErr());
    List<String> texts = DemoTicketGenerator.generate(questions + questions / 5, 23L).stream()
        .map(t -> TextCleaner.standard().cleanQuestion(t.subject() + "\n" + t.body())).toList();
    long start = System.nanoTime();
    try (InForce active = InForce.open(new DataDir(benchmark.parent.dataDir()))) {
      out.printf(Locale.ROOT, "machine: %d cores; model %s opened in %.1f s; dense leg %s; %d "
              + "questions per run%n", Runtime.getRuntime().availableProcessors(),
          active.version(), (System.nanoTime() - start) / 1e9,
          active.dense() == null ? "absent" : "present", questions);
      for (int n : threads == 1 ? new int[] {1} : new int[] {1, threads}) {
        Run always = null;
        for (RerankerUse use : RerankerUse.values()) {
          Pipeline pipeline = active.pipeline(use);
          Run r = measure(pipeline, texts, n);
          if (use == RerankerUse.ALWAYS) {
            always = r;
          }
          out.printf(Locale.ROOT, "%d thread%s, reranker %-15s %6.1f decisions/s  p50 %6.1f ms  "
                  + "p99 %6.1f ms  reranked %5.1f%%  speed %.2fx 'always'%n", n, n == 1 ? " " : "s",
              use.setting(), r.perSecond(), r.p50Ms(), r.p99Ms(), 100 * r.reranked(),
              r.perSecond() / always.perSecond());
        }
      }
    }
    return 0;
  }

  private Run measure(Pipeline pipeline, List<String> texts, int threads) throws Exception {
    int warm = texts.size() - questions;
    for (int i = 0; i < warm; i++) {
      pipeline.decideCleaned(texts.get(i), null);
    }
    long[] nanos = new long[questions];
    AtomicInteger next = new AtomicInteger();
    AtomicInteger reranked = new AtomicInteger();
    ExecutorService pool = Executors.newFixedThreadPool(threads);
    long all = System.nanoTime();
    try {
      List<Future<?>> work = new ArrayList<>();
      for (int t = 0; t < threads; t++) {
        work.add(pool.submit(() -> {
          for (int i; (i = next.getAndIncrement()) < questions; ) {
            long t0 = System.nanoTime();
            Decision d = pipeline.decideCleaned(texts.get(warm + i), null);
            nanos[i] = System.nanoTime() - t0;
            if (!d.candidates().isEmpty() && d.candidates().get(0).rerank() != null) {
              reranked.incrementAndGet();
            }
          }
          return null;
        }));
      }
      for (Future<?> f : work) {
        f.get();
      }
    } finally {
      pool.shutdown();
    }
    double seconds = (System.nanoTime() - all) / 1e9;
    Arrays.sort(nanos);
    return new Run(questions / seconds, RetrievalBenchmark.percentile(nanos, 0.50) / 1e6,
        RetrievalBenchmark.percentile(nanos, 0.99) / 1e6, reranked.get() / (double) questions);
  }
}
