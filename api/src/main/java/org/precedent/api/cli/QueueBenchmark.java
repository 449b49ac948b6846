package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.queue.QueueDrain;
import org.precedent.demo.DemoTicket;
import org.precedent.demo.DemoTicketGenerator;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Pipeline;
import org.precedent.engine.rerank.store.ModelStore;
import org.precedent.knowledge.store.DataDir;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

@Command(name = "queue", mixinStandardHelpOptions = true,
    description = {"Measures how fast one and two replicas drain the ticket queue.",
        "It stores N generated demo tickets in the given database's queue, then has one "
            + "replica, and then two at once, claim them with the service's own SQL (batches, "
            + "leases, conditional writes) and decide them on the model in force in the data "
            + "directory (--data), as the service's queue does but without the answer library's "
            + "approval step. It reports the drain rate (tickets decided per second until the "
            + "queue is empty), the decisions per second of each replica, milliseconds from a "
            + "batch's claim to each decision stored and of the decision alone (p50, p99), the "
            + "outcomes, and the ratio of the two drain rates. The replicas are threads of this "
            + "process sharing the one model, as a service's threads do.",
        "With --hand-off-only the decision is a fixed hand-off (or a wait of --decide-ms), so the "
            + "figures are the queue's own cost. The database's queue must be empty; the "
            + "benchmark removes its tickets."})
final class QueueBenchmark implements Callable<Integer> {
  @ParentCommand
  BenchmarkCommand benchmark;

  @Spec
  CommandSpec spec;

  @Option(names = "--db-url", required = true, paramLabel = "JDBC",
      description = "The database, as a JDBC address (jdbc:postgresql://host:5432/name).")
  String url;

  @Option(names = "--db-user", defaultValue = "precedent", paramLabel = "NAME",
      description = "The database user (default ${DEFAULT-VALUE}).")
  String user;

  // A few minutes on two cores with the demo model (about 10 decisions/s per core); 10,000 for
  // the figures in DEVELOPERS.md.
  @Option(names = "--tickets", paramLabel = "N", defaultValue = "1000",
      description = "Tickets drained in each run (default ${DEFAULT-VALUE}; the recorded figures "
          + "use 10000).")
  int tickets;

  @Option(names = "--hand-off-only",
      description = "Decide every ticket with a fixed hand-off instead of the model.")
  boolean handOffOnly;

  @Option(names = "--decide-ms", paramLabel = "MS", defaultValue = "0",
      description = "With --hand-off-only: a wait per decision standing for the scoring "
          + "(default ${DEFAULT-VALUE}).")
  long decideMs;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (tickets < 1 || decideMs < 0) {
      throw new ParameterException(spec.commandLine(),
          "--tickets must be at least 1 and --decide-ms at least 0");
    }
    if (decideMs > 0 && !handOffOnly) {
      throw new ParameterException(spec.commandLine(),
          "--decide-ms stands for the model's scoring, so it goes with --hand-off-only");
    }
    // The password from the environment, never from the command line (it would show in ps).
    String password = System.getenv().getOrDefault("PRECEDENT_DB_PASSWORD", "");
    QueueDrain.Database db = new QueueDrain.Database(url, user, password);
    // The generated questions benchmark service sends (the same seed).
    List<String> questions = new ArrayList<>();
    for (DemoTicket t : DemoTicketGenerator.generate(tickets, 99L)) {
      questions.add(t.subject() + "\n" + t.body());
    }
    DataDir data = new DataDir(benchmark.parent.dataDir());
    if (!handOffOnly && (data.currentGeneration().isEmpty()
        || new ModelStore(data.models()).activeVersion().isEmpty())) {
      spec.commandLine().getErr().println("precedent benchmark queue: no tickets or no trained "
          + "model in " + data.root() + ": give --data a trained directory (such as the "
          + "demo's), or measure the queue alone with --hand-off-only");
      return PrecedentCommand.FAILED;
    }
    if (handOffOnly) {
      return measure(out, db, questions, QueueDrain.handOff(decideMs), "a fixed hand-off"
          + (decideMs > 0 ? " after " + decideMs + " ms" : ""));
    }
    NumericLibrary.announce(spec.commandLine().getErr());
    try (InForce active = InForce.open(data)) {
      Pipeline pipeline = active.pipeline();
      String version = active.version();
      // The pipeline is shared by threads, as the service's requests and worker share it.
      QueueDrain.Decide decide = (question, category) ->
          DecisionView.of(pipeline.decideCleaned(question, category), version, 3);
      // Warm: the first decisions load the network's native code and fill its caches.
      for (int i = 0; i < 5; i++) {
        decide.decide(questions.get(i), null);
      }
      return measure(out, db, questions, decide, "model " + version + " of " + data.root());
    }
  }

  private int measure(PrintWriter out, QueueDrain.Database db, List<String> questions,
      QueueDrain.Decide decide, String decidedBy) throws Exception {
    out.printf(Locale.ROOT, "machine: %d cores; database %s; %,d tickets, batches of 8, "
        + "decided by %s%n", Runtime.getRuntime().availableProcessors(),
        // Without the address's parameters, which may hold a password.
        url.split("\\?", 2)[0], questions.size(), decidedBy);
    QueueDrain.Figures one = QueueDrain.run(db, 1, questions, decide);
    print(out, one);
    QueueDrain.Figures two = QueueDrain.run(db, 2, questions, decide);
    print(out, two);
    out.printf(Locale.ROOT, "2 replicas / 1 replica: %.2fx the drain rate%n",
        two.perSecond() / one.perSecond());
    return one.decidedOnce() == tickets && two.decidedOnce() == tickets ? 0 : 1;
  }

  private static void print(PrintWriter out, QueueDrain.Figures f) {
    out.printf(Locale.ROOT, "%d replica%s: %,d tickets drained in %.2f s = %.1f decisions/s "
            + "(%.1f per replica); claim to stored p50 %.1f ms, p99 %.1f ms; decision p50 %.1f "
            + "ms, p99 %.1f ms; outcomes %s; decided once: %,d%n", f.replicas(),
        f.replicas() == 1 ? "" : "s", f.tickets(), f.seconds(), f.perSecond(), f.perReplica(),
        f.p50Ms(), f.p99Ms(), f.decideP50Ms(), f.decideP99Ms(), f.outcomes(), f.decidedOnce());
  }
}
