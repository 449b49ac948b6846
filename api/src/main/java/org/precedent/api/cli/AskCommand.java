package org.precedent.api.cli;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.io.PrintWriter;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.function.Consumer;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.clean.TextCleaner;
import org.precedent.knowledge.retrieve.RetrievalSettings;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

@Command(name = "ask", mixinStandardHelpOptions = true,
    description = {"Shows the best candidate answers for a question, with scores and evidence.",
        "With no question, reads questions line by line until end of input."})
final class AskCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Parameters(paramLabel = "QUESTION", arity = "0..*", description = "The question (quoted).")
  List<String> words;

  @Option(names = "--candidates", paramLabel = "N", defaultValue = "5",
      description = "Candidate answers shown (default ${DEFAULT-VALUE}).")
  int candidates;

  @Option(names = "--category", paramLabel = "NAME",
      description = "The ticket's category, if known (category thresholds and rules apply).")
  String category;

  @Option(names = "--timings",
      description = "Also print where the time went, to standard error: the JVM's start, opening "
          + "each part, loading the reranker (only when a question needs it) and each decision.")
  boolean timings;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    DataDir dataDir = new DataDir(parent.dataDir());
    if (dataDir.currentGeneration().isEmpty()) {
      spec.commandLine().getErr().println("precedent ask: no tickets in " + dataDir.root()
          + " yet: run 'precedent ingest FILE' first (or 'precedent demo')");
      return PrecedentCommand.FAILED;
    }
    if (new ModelStore(dataDir.models()).activeVersion().isEmpty()) {
      spec.commandLine().getErr().println("no trained model yet: showing BM25 candidates only "
          + "('precedent train' adds the reranker, confidence and the reply-or-hand-off decision)");
      return retrievalOnly(dataDir, out);
    }
    long started = System.nanoTime();
    PrintWriter err = spec.commandLine().getErr();
    // The reranker loads only for a question the faster legs disagree on: a one-question command
    // then waits for neither the numeric library nor the network, and is told when it does.
    try (InForce active = InForce.openRerankerOnFirstUse(dataDir,
        () -> NumericLibrary.announce(err))) {
      long opened = System.nanoTime();
      Pipeline pipeline = active.pipeline();
      DecisionPrinter printer = new DecisionPrinter(out, candidates);
      if (timings) {
        InForce.OpenTimes t = active.openTimes();
        err.printf(Locale.ROOT, "timings: JVM start to this command %.2f s; opened in %.2f s "
                + "(knowledge %.2f s, index %.2f s, model files %.2f s, dense leg %.2f s)%n",
            (System.currentTimeMillis() - ManagementFactory.getRuntimeMXBean().getStartTime()
                - (opened - started) / 1_000_000) / 1e3, (opened - started) / 1e9,
            t.knowledge() / 1e3, t.index() / 1e3, t.model() / 1e3, t.dense() / 1e3);
      }
      return eachQuestion(out, q -> {
        boolean hadReranker = active.rerankerLoad().isPresent();
        long t0 = System.nanoTime();
        var decision = pipeline.decide(q, category);
        long took = System.nanoTime() - t0;
        printer.print(decision, active.version());
        if (timings) {
          var load = active.rerankerLoad();
          err.printf(Locale.ROOT, "timings: decision %.1f ms%s; since the JVM started %.2f s%n",
              took / 1e6, hadReranker ? "" : load.isPresent() ? String.format(Locale.ROOT,
                  " (of which loading the reranker %.2f s)", load.getAsLong() / 1e3)
                  : " (reranker not loaded: the faster legs agreed)",
              (System.currentTimeMillis()
                  - ManagementFactory.getRuntimeMXBean().getStartTime()) / 1e3);
          err.flush();
        }
      });
    }
  }

  private int retrievalOnly(DataDir dataDir, PrintWriter out) throws Exception {
    TextCleaner cleaner = TextCleaner.standard();
    RetrievalSettings settings = RetrievalSettings.standard().withCandidates(candidates);
    RetrievalPrinter printer = new RetrievalPrinter(out, 160);
    Knowledge knowledge = Knowledge.open(dataDir).orElseThrow();
    try (Retriever retriever = Retriever.open(knowledge)) {
      return eachQuestion(out, q -> printer.print(
          retriever.retrieve(cleaner.cleanQuestion(q), settings)));
    }
  }

  /** Answers the question on the command line, or each line of standard input. */
  private int eachQuestion(PrintWriter out, Consumer<String> answer) throws Exception {
    if (words != null && !words.isEmpty()) {
      answer.accept(String.join(" ", words));
      return 0;
    }
    boolean console = System.console() != null;
    BufferedReader in = new BufferedReader(new InputStreamReader(System.in, StandardCharsets.UTF_8));
    if (console) {
      out.println("Type a question and press Enter; end with Ctrl-D.");
    }
    String line;
    while (true) {
      if (console) {
        out.print("> ");
        out.flush();
      }
      if ((line = in.readLine()) == null) {
        return 0;
      }
      if (!line.isBlank()) {
        answer.accept(line);
      }
    }
  }
}
