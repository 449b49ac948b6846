package org.precedent.api.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.precedent.api.models.Activations;
import org.precedent.api.models.ModelAudit;
import org.precedent.api.models.ServiceActivation;
import org.precedent.api.threshold.ServiceThresholds;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.evaluate.EvaluationReport;
import org.precedent.engine.evaluate.HeldOutEvaluation;
import org.precedent.engine.evaluate.VersionComparison;
import org.precedent.engine.evaluate.VersionComparisons;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.learn.TrainingReport;
import org.precedent.engine.rerank.ModelLoadException;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.engine.rerank.store.ModelStore;
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
import org.springframework.context.ConfigurableApplicationContext;
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
    long started = System.nanoTime();
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
    TeamModelTrainer trainer = new TeamModelTrainer(dataDir, RerankerConfig.defaults()
        .withEpochs(epochs, RerankerConfig.defaults().patience())
        .withMaxTokens(RerankerConfig.defaults().maxQuestionTokens(), 32));
    ModelStore store = new ModelStore(dataDir.models());
    Optional<String> full = trainer.currentVersion(knowledge, true);
    // Stage one: the faster legs alone, in force within seconds of the ingest. A rerun whose
    // version with the reranker is already in force has nothing left to train.
    boolean finished = full.isPresent() && full.equals(store.activeVersion());
    if (finished) {
      out.printf(Locale.ROOT, "%n[3] model %s, with the reranker, is already trained on these "
          + "tickets and in force ('precedent train --data %s' trains again)%n", full.get(), data);
    } else {
      Optional<String> fast = trainer.currentVersion(knowledge, false);
      String version;
      if (fast.isPresent()) {
        version = fast.get();
        out.printf(Locale.ROOT, "%n[3] model %s, without the reranker, is already trained on "
            + "these tickets%n", version);
      } else {
        out.printf(Locale.ROOT, "%n[3] stage one: the dense leg's answer classifier and fusion "
            + "without the reranker%n");
        out.flush();
        TrainingReport trained = trainer.trainWithoutReranker(knowledge);
        version = trained.version();
        out.println(trained.summary().indent(4).stripTrailing());
      }
      if (!store.activeVersion().equals(Optional.of(version))) {
        // The demo's own directory, on changed demo tickets: put in force through the model
        // audit, as an acknowledged activation without a comparison.
        ModelAudit.activateFromCommandLine(dataDir, version, who(),
            "the demo: its version without the reranker, on its tickets", true);
      }
      out.println("    model " + version + " (no reranker) is in force");
    }

    out.printf(Locale.ROOT, "%n[4] evaluation on the held-out split%n");
    out.flush();
    HeldOutEvaluation first;
    try (InForce active = InForce.open(dataDir)) {
      first = HeldOutEvaluation.run(dataDir, active, heldOut, "demo held-out split", TARGET,
          dataDir.reports(), null, new Progress("evaluating", "tickets", System.err));
      EvaluationPrinter.print(out, first);
      EvaluationPrinter.applyThreshold(out, dataDir, List.of(), first,
          "the demo: guaranteed threshold of its held-out evaluation at target precision 0.95");
    }
    samples(out, dataDir, "[5] decisions for sample questions");
    out.println("Ask more: ./precedent ask --data " + data + " \"my bin was not collected\"");
    out.println("The evaluation report is in " + dataDir.reports());
    out.printf(Locale.ROOT, "(%.0f s since the demo started)%n", seconds(started));
    Path heldOutFile = dir.resolve("heldout.csv");
    if (noServe) {
      if (!finished) {
        secondStage(out, dataDir, knowledge, trainer, heldOut, heldOutFile, first, null, started);
      }
      return 0;
    }
    out.printf(Locale.ROOT, "%n[6] starting the service on model %s%n",
        store.activeVersion().orElse("none"));
    out.flush();
    ConfigurableApplicationContext context = Serving.start(out, spec.commandLine().getErr(),
        data, port, List.of());
    if (context == null) {
      return PrecedentCommand.FAILED;
    }
    String url = org.precedent.api.system.PrecedentServer.url(context).replaceAll("/+$", "");
    out.printf(Locale.ROOT, "%nThe pages are usable now (%.0f s since the demo started): "
        + "%s/answers (agents), %s/queue, %s/manage (managers), %s/library%n", seconds(started),
        url, url, url, url);
    if (!finished) {
      out.println("The reranker is training in the background at lower priority; the service "
          + "puts it in force once it is measured on the held-out split and answers at least "
          + "as many tickets at the target precision.");
    }
    out.println("Stop it with Ctrl-C.");
    out.flush();
    if (!finished) {
      Thread background = new Thread(() -> {
        LowerPriority.ofThisThread(out);
        try {
          secondStage(out, dataDir, knowledge, trainer, heldOut, heldOutFile, first, context,
              started);
        } catch (Exception | OutOfMemoryError e) {
          out.println("stage two stopped: " + Messages.oneLine(e) + "; "
              + "the version in force stays (run the demo again to resume)");
          out.flush();
        }
      }, "precedent-demo-stage-two");
      background.setDaemon(true);
      background.start();
    }
    Serving.awaitClosed(context);
    return 0;
  }

  private static final double TARGET = 0.95;

  /**
   * Stage two: trains the version with the reranker (resuming an interrupted run), measures it
   * beside the version in force on the held-out split, and asks for its activation, through the
   * running service when there is one ({@code context}), else through the command line's door;
   * either way the comparison decides, and a worse version leaves the one in force.
   */
  private void secondStage(PrintWriter out, DataDir dataDir, Knowledge knowledge,
      TeamModelTrainer trainer, Ingestor.ParsedExport heldOut, Path heldOutFile,
      HeldOutEvaluation inForceEvaluation, ConfigurableApplicationContext context, long started)
      throws IOException {
    ModelStore store = new ModelStore(dataDir.models());
    Optional<String> full = trainer.currentVersion(knowledge, true);
    String candidate;
    if (full.isPresent()) {
      candidate = full.get();
      out.printf(Locale.ROOT, "%n[7] model %s, with the reranker, is already trained on these "
          + "tickets%n", candidate);
    } else {
      out.printf(Locale.ROOT, "%n[7] stage two: training the reranker (up to %d epochs; progress "
          + "below; interrupt and run again to resume)%n", epochs);
      out.flush();
      NumericLibrary.announce(spec.commandLine().getErr());
      TrainingReport trained;
      try {
        trained = trainer.train(knowledge, true);
      } catch (ModelLoadException e) {
        out.println("    " + e.getMessage() + "; starting afresh");
        trained = trainer.train(knowledge, false);
      }
      candidate = trained.version();
      out.println("    model " + candidate + " (with the reranker) is written, a candidate");
      out.println(trained.summary().indent(4).stripTrailing());
    }
    String inForce = store.activeVersion().orElseThrow();
    out.printf(Locale.ROOT, "%n[8] %s beside %s on the held-out split%n", candidate, inForce);
    out.flush();
    EvaluationReport measured;
    try (InForce opened = InForce.open(dataDir, candidate)) {
      measured = HeldOutEvaluation.measure(opened, heldOut, "demo held-out split", TARGET,
          new Progress("evaluating " + candidate, "tickets", System.err));
    }
    try (InForce active = InForce.open(dataDir, inForce)) {
      VersionComparison c = EvaluateCommand.compared(store, candidate, measured, active,
          inForceEvaluation.report(), heldOutFile);
      VersionComparisons.write(store, c);
      Activations.lines(c).forEach(l -> out.println("    " + l));
    }
    String reason = "the demo: its version with the reranker, compared on the held-out split";
    String objection = null;
    if (context == null) {
      try {
        ModelAudit.activateFromCommandLine(dataDir, candidate, who(), reason, false);
      } catch (ModelAudit.Refused e) {
        objection = e.verdict().objection();
      }
    } else {
      ServiceActivation.Result r = ServiceActivation.activate(context, candidate,
          "demo (stage two)", reason);
      objection = r.activated() ? null : r.objection();
    }
    if (objection != null) {
      out.printf(Locale.ROOT, "    %s is not activated: %s%n    %s stays in force.%n", candidate,
          objection, inForce);
      out.flush();
      return;
    }
    out.printf(Locale.ROOT, "    model %s (with the reranker) is in force%s (%.0f s since the "
        + "demo started)%n", candidate, context == null ? "" : " in the running service",
        seconds(started));
    try (InForce active = InForce.open(dataDir)) {
      HeldOutEvaluation evaluation = HeldOutEvaluation.written(dataDir, active, heldOut,
          measured, dataDir.reports(), null);
      out.printf(Locale.ROOT, "%n[9] evaluation of %s on the held-out split%n", candidate);
      EvaluationPrinter.print(out, evaluation);
      String why = "the demo: guaranteed threshold of " + candidate + "'s held-out evaluation at "
          + "target precision 0.95";
      if (context == null) {
        EvaluationPrinter.applyThreshold(out, dataDir, List.of(), evaluation, why);
      } else if (evaluation.guaranteedThreshold().isPresent()) {
        double t = evaluation.guaranteedThreshold().getAsDouble();
        ServiceThresholds.setGlobal(context, t, "demo (stage two)", why);
        out.println("threshold " + org.precedent.engine.measure.ThresholdDecimals.of(t)
            + " is now in force for automatic replies");
      } else {
        out.println("no threshold could be guaranteed; the threshold in force is unchanged");
      }
    }
    if (context == null) {
      samples(out, dataDir, "[10] decisions for sample questions with " + candidate);
    }
    out.printf(Locale.ROOT, "(%.0f s since the demo started)%n", seconds(started));
    out.flush();
  }

  private static void samples(PrintWriter out, DataDir dataDir, String title) throws IOException {
    out.printf(Locale.ROOT, "%n%s%n%n", title);
    try (InForce active = InForce.open(dataDir)) {
      Pipeline pipeline = active.pipeline();
      DecisionPrinter printer = new DecisionPrinter(out, 2);
      for (String q : SAMPLES) {
        printer.print(pipeline.decide(q, null), active.version());
      }
    }
    out.flush();
  }

  private static String who() {
    return System.getProperty("user.name") + " (command line)";
  }

  private static double seconds(long startedNanos) {
    return (System.nanoTime() - startedNanos) / 1e9;
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
