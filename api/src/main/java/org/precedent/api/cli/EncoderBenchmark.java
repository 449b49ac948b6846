package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.demo.DemoTicketGenerator;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.embed.SentenceEncoder;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "encoder", mixinStandardHelpOptions = true,
    description = {"Measures the sentence encoder's speed on one thread.",
        "It loads the pretrained sentence encoder (bge-small-en-v1.5, quantized, on ONNX "
            + "Runtime with one thread), embeds cleaned demo-style ticket questions one at a time "
            + "and reports the load time, texts/s and milliseconds per text (p50, p99)."})
final class EncoderBenchmark implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--texts", paramLabel = "N", defaultValue = "1000",
      description = "Texts timed (default ${DEFAULT-VALUE}), after as many warm-up texts.")
  int texts;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    if (texts < 1) {
      throw new picocli.CommandLine.ParameterException(spec.commandLine(),
          "--texts must be at least 1");
    }
    out.printf(Locale.ROOT, "machine: %d cores, Java %s%n",
        Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"));
    List<String> questions = DemoTicketGenerator.generate(texts * 2, 13L).stream()
        .map(t -> TextCleaner.standard().cleanQuestion(t.subject() + "\n" + t.body())).toList();
    long start = System.nanoTime();
    try (SentenceEncoder encoder = SentenceEncoder.open()) {
      double loadSeconds = (System.nanoTime() - start) / 1e9;
      out.printf(Locale.ROOT, "encoder: %s, %d dimensions, sha256 %s; loaded in %.2f s%n",
          encoder.identity().model(), encoder.dimension(), encoder.identity().sha256(),
          loadSeconds);
      for (int i = 0; i < texts; i++) {
        encoder.embed(questions.get(i));
      }
      long[] nanos = new long[texts];
      long chars = 0;
      long all = System.nanoTime();
      for (int i = 0; i < texts; i++) {
        String q = questions.get(texts + i);
        chars += q.length();
        long t = System.nanoTime();
        encoder.embed(q);
        nanos[i] = System.nanoTime() - t;
      }
      double seconds = (System.nanoTime() - all) / 1e9;
      Arrays.sort(nanos);
      out.printf(Locale.ROOT, "embed, 1 thread: %,d texts (mean %d characters) in %.1f s = %.1f "
              + "texts/s; p50 %.2f ms, p99 %.2f ms per text%n", texts, chars / texts, seconds,
          texts / seconds, RetrievalBenchmark.percentile(nanos, 0.50) / 1e6,
          RetrievalBenchmark.percentile(nanos, 0.99) / 1e6);
    }
    return 0;
  }
}
