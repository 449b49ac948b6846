package org.precedent.api.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.AnswerGrouper;
import org.precedent.knowledge.ingest.ColumnMapping;
import org.precedent.knowledge.ingest.ExportFormat;
import org.precedent.knowledge.ingest.IngestReport;
import org.precedent.knowledge.ingest.Ingestor;
import org.precedent.knowledge.io.AtomicFiles;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.retrieve.Aggregation;
import org.precedent.knowledge.retrieve.CandidateRecall;
import org.precedent.knowledge.retrieve.Retriever;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;
import org.precedent.knowledge.ticket.Ticket;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "demo", mixinStandardHelpOptions = true,
    description = {"Runs the whole job on the bundled demo help desk (invented data).",
        "It ingests the demo's resolved tickets, builds the index, measures candidate recall, "
            + "trains, evaluates on the held-out tickets, decides sample questions and starts the "
            + "service.",
        "Its data directory is ~/.precedent-demo, apart from your own, unless --data names "
            + "another."})
final class DemoCommand implements Callable<Integer> {
  @ParentCommand
  PrecedentCommand parent;

  @Spec
  CommandSpec spec;

  @Option(names = "--demo-data", paramLabel = "DIR",
      description = "The demo tickets (default: demo-data/ of the Precedent checkout).")
  Path demoData;

  @Option(names = "--no-serve", description = "End after the samples instead of starting the service.")
  boolean noServe;

  @Option(names = "--port", paramLabel = "N", defaultValue = "8080",
      description = "Port of the service started at the end (default ${DEFAULT-VALUE}).")
  int port;

  // RerankerConfig.defaults().maxEpochs(), measured there.
  @Option(names = "--epochs", paramLabel = "N", defaultValue = "4",
      description = "Most reranker training epochs (default ${DEFAULT-VALUE}).")
  int epochs;

  /** Invented questions: routine ones, a safety case, and one that no past answer covers. */
  static final List<String> SAMPLES = List.of(
      "Hi, my green bin wasn't emptied this morning, everyone else's was. Can someone come back?",
      "How do I send you a meter reading? Thanks, Dana",
      "The water coming out of my kitchen tap is brown. Is it safe to drink?",
      "Can I pay my bill in instalments? I've lost my job.",
      "Do you sponsor the Tarnwick village fete this summer?");

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    Path dir = demoData != null ? demoData : defaultDemoData();
    Path data = parent.data != null ? parent.data
        : Path.of(System.getProperty("user.home"), ".precedent-demo");
    out.println("Precedent demo: Tarnwick Vale Water & Waste, an invented utility help desk.");
    out.println("demo tickets: " + dir + "   data directory: " + data);
    out.flush();

    ColumnMapping mapping = ColumnMapping.fromFile(dir.resolve("mapping.properties"), Map.of());
    DataDir dataDir = new DataDir(data);
    dataDir.makePrivate();
    // The utility's own 24-hour line stays in its answers; customers' numbers are redacted.
    byte[] ownDetails = Files.readAllBytes(dir.resolve("own-details.txt"));
    AtomicFiles.write(dataDir.ownDetails(), o -> o.write(ownDetails));
    AnswerGrouper grouper = AnswerGrouper.standard();
    Ingestor ingestor = Ingestor.of(dataDir, grouper);
    Path history = dir.resolve("tickets.csv");
    IngestReport report = ingestor.ingest(history, ExportFormat.CSV, mapping,
        new Progress("reading tickets.csv", "rows", System.err),
        new Progress("indexing", "tickets", System.err));
    out.printf(Locale.ROOT, "%n[1] ingest: read %,d, stored %,d, updated %,d, rejected %,d%n",
        report.read(), report.stored(), report.updated(), report.rejected());
    out.printf(Locale.ROOT, "    %,d answer groups (%s), %,d one-off tickets%n",
        report.groupSizes().size(), report.method(), report.oneOffs());

    Ingestor.ParsedExport heldOut = ingestor.parse(dir.resolve("heldout.csv"), ExportFormat.CSV,
        mapping, Progress.silent());
    Knowledge knowledge = Knowledge.open(dataDir).orElseThrow();
    try (Retriever retriever = Retriever.open(knowledge)) {
      List<CandidateRecall.Case> cases = new ArrayList<>();
      var replyMatcher = grouper.matcher(knowledge.grouping());
      for (Ticket t : heldOut.tickets()) {
        Optional<AnswerGroup> right = replyMatcher.apply(t.reply());
        if (right.isPresent()) {
          cases.add(new CandidateRecall.Case(t.question(), right.get().id()));
        }
      }
      Map<Integer, Double> recall = CandidateRecall.measure(retriever, cases,
          Aggregation.MAX_PLUS_SUPPORT);
      out.printf(Locale.ROOT, "%n[2] held-out split: %,d tickets, %,d answered by a known answer "
          + "group, %,d one-offs%n", heldOut.tickets().size(), cases.size(),
          heldOut.tickets().size() - cases.size());
      StringBuilder line = new StringBuilder("    BM25 candidate recall:");
      recall.forEach((k, v) -> line.append(String.format(Locale.ROOT, "  @%d %.3f", k, v)));
      out.println(line);

    }

    byte[] rules = Files.readAllBytes(dir.resolve("safety.rules"));
    AtomicFiles.write(dataDir.safetyRules(), o -> o.write(rules));
    out.flush();
    NumericLibrary.announce(spec.commandLine().getErr());
    TeamModelTrainer trainer = new TeamModelTrainer(dataDir, RerankerConfig.defaults()
        .withEpochs(epochs, RerankerConfig.defaults().patience())
        .withMaxTokens(RerankerConfig.defaults().maxQuestionTokens(), 32));
    Optional<String> current = trainer.currentVersion(knowledge);
    if (current.isPresent()) {
      out.printf(Locale.ROOT, "%n[3] model %s is already trained on these tickets "
          + "('precedent train --data %s' trains again)%n", current.get(), data);
    } else {
      out.printf(Locale.ROOT, "%n[3] training the reranker (up to %d epochs; progress below; "
          + "interrupt and run again to resume)%n", epochs);
      out.flush();
      TrainingReport trained;
      try {
        trained = trainer.train(knowledge, true);
      } catch (ModelLoadException e) {
        out.println("    " + e.getMessage() + "; starting afresh");
        trained = trainer.train(knowledge, false);
      }
      if (!trained.activated()) {
        // The demo's own directory, trained again on changed demo tickets: put in force through
        // the model audit, as an acknowledged activation without a comparison.
        org.precedent.api.models.ModelAudit.activateFromCommandLine(dataDir, trained.version(),
            System.getProperty("user.name") + " (command line)",
            "the demo: trained again on its tickets", true);
      }
      out.println("    model " + trained.version() + " is active");
      out.println(trained.summary().indent(4).stripTrailing());
    }

    out.printf(Locale.ROOT, "%n[4] evaluation on the held-out split%n");
    out.flush();
    try (InForce active = InForce.open(dataDir)) {
      HeldOutEvaluation evaluation = HeldOutEvaluation.run(dataDir, active, heldOut,
          "demo held-out split", 0.95, dataDir.reports(), null,
          new Progress("evaluating", "tickets", System.err));
      EvaluationPrinter.print(out, evaluation);
      EvaluationPrinter.applyThreshold(out, dataDir, java.util.List.of(), evaluation,
          "the demo: guaranteed threshold of its held-out evaluation at target precision 0.95");
    }

    out.printf(Locale.ROOT, "%n[5] decisions for sample questions%n%n");
    try (InForce active = InForce.open(dataDir)) {
      Pipeline pipeline = active.pipeline();
      DecisionPrinter printer = new DecisionPrinter(out, 2);
      for (String q : SAMPLES) {
        printer.print(pipeline.decide(q, null), active.version());
      }
    }
    out.println("Ask more: ./precedent ask --data " + data + " \"my bin was not collected\"");
    out.println("The evaluation report is in " + dataDir.reports());
    if (noServe) {
      return 0;
    }
    out.printf(Locale.ROOT, "%n[6] starting the service on the demo model%n");
    out.flush();
    return Serving.run(out, spec.commandLine().getErr(), data, port, List.of());
  }

  /**
   * Describes the inherited --data option as the demo uses it: the demo never falls back on
   * $PRECEDENT_DATA or ~/.precedent, where a team's own data may be.
   */
  static void describeDataOption(CommandSpec demo) {
    OptionSpec inherited = demo.findOption("--data");
    demo.remove(inherited);
    demo.addOption(OptionSpec.builder(inherited)
        .description("The demo's data directory (default: ~/.precedent-demo).").build());
  }

  private static Path defaultDemoData() {
    String home = System.getProperty("precedent.home");
    Path dir = home != null ? Path.of(home, "demo-data") : Path.of("demo-data");
    if (!Files.isDirectory(dir)) {
      throw new IllegalStateException(dir.toAbsolutePath()
          + ": demo data not found; pass --demo-data DIR");
    }
    return dir;
  }
}
