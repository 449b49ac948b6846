package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.precedent.demo.DemoTicketGenerator;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.IngestReport;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

@Command(name = "retrieval", mixinStandardHelpOptions = true,
    description = {"Measures ingest throughput and BM25 latency on generated tickets.",
        "It generates demo-style tickets, ingests them into a scratch data directory, and reports "
            + "ingest throughput (tickets/s) and BM25 candidate latency (p50, p99)."})
final class RetrievalBenchmark implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--tickets", paramLabel = "N", defaultValue = "100000",
      description = "Tickets generated and ingested (default ${DEFAULT-VALUE}).")
  int tickets;

  @Option(names = "--queries", paramLabel = "N", defaultValue = "2000",
      description = "Questions timed (default ${DEFAULT-VALUE}), after as many warm-up questions.")
  int queries;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Path scratch = Files.createTempDirectory("precedent-bench-");
    try {
      out.printf(Locale.ROOT, "machine: %d cores, Java %s, max heap %,d MB%n",
          Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"),
          Runtime.getRuntime().maxMemory() >> 20);
      Path csv = scratch.resolve("tickets.csv");
      DemoTicketGenerator.writeCsv(DemoTicketGenerator.generate(tickets, 7L), csv);
      out.printf(Locale.ROOT, "generated %,d tickets (%,d MB of CSV)%n", tickets,
          Files.size(csv) >> 20);
      out.flush();
      ColumnMapping mapping = ColumnMapping.of(Map.of("id", "ticket_id", "subject", "subject",
          "body", "body", "reply", "reply", "category", "category", "created", "created"));
      DataDir dataDir = new DataDir(scratch.resolve("data"));
      Ingestor ingestor = new Ingestor(dataDir, TextCleaner.standard(), AnswerGrouper.standard());
      long start = System.nanoTime();
      Ingestor.ParsedExport parsed = ingestor.parse(csv, ExportFormat.CSV, mapping,
          new Progress("reading", "rows", System.err));
      double parseSeconds = (System.nanoTime() - start) / 1e9;
      IngestReport report = ingestor.store(parsed, new Progress("indexing", "tickets", System.err));
      double totalSeconds = (System.nanoTime() - start) / 1e9;
      out.printf(Locale.ROOT, "ingest: %,d tickets in %.1f s = %,.0f tickets/s "
              + "(read+clean %.1f s = %,.0f tickets/s; group+index+write %.1f s)%n",
          report.read(), totalSeconds, report.read() / totalSeconds, parseSeconds,
          report.read() / parseSeconds, totalSeconds - parseSeconds);
      out.printf(Locale.ROOT, "knowledge: %,d answer groups, %,d one-offs%n",
          report.groupSizes().size(), report.oneOffs());

      List<String> questions = DemoTicketGenerator.generate(queries * 2, 11L).stream()
          .map(t -> TextCleaner.standard().cleanQuestion(t.subject() + "\n" + t.body())).toList();
      try (Retriever retriever = Retriever.open(Knowledge.open(dataDir).orElseThrow())) {
        RetrievalSettings settings = RetrievalSettings.standard();
        for (int i = 0; i < queries; i++) {
          retriever.retrieve(questions.get(i), settings);
        }
        long[] nanos = new long[queries];
        for (int i = 0; i < queries; i++) {
          long t0 = System.nanoTime();
          retriever.retrieve(questions.get(queries + i), settings);
          nanos[i] = System.nanoTime() - t0;
        }
        Arrays.sort(nanos);
        out.printf(Locale.ROOT, "BM25 candidates (depth %d, %d groups, with evidence): "
                + "p50 %.2f ms, p99 %.2f ms, max %.2f ms over %,d questions%n",
            settings.depth(), settings.candidates(), percentile(nanos, 0.50) / 1e6,
            percentile(nanos, 0.99) / 1e6, nanos[nanos.length - 1] / 1e6, queries);
      }
    } finally {
      org.precedent.knowledge.io.AtomicFiles.deleteTree(scratch);
    }
    return 0;
  }

  /** Nearest-rank percentile of sorted values. */
  static long percentile(long[] sorted, double p) {
    int rank = (int) Math.ceil(p * sorted.length);
    return sorted[Math.max(0, Math.min(sorted.length - 1, rank - 1))];
  }
}
