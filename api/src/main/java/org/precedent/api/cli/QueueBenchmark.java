package org.precedent.api.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.precedent.api.queue.QueueDrain;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

@Command(name = "queue", mixinStandardHelpOptions = true,
    description = {"Measures how fast one and two replicas drain the ticket queue.",
        "It stores N tickets in the given database's queue, then has one replica, and then two "
            + "at once, claim and decide them with the service's own SQL (batches, leases, "
            + "conditional writes), and reports decisions/s, milliseconds from a batch's claim "
            + "to each decision stored (p50, p99) and the ratio of the two rates. The decision is "
            + "a fixed hand-off, or a wait standing for the scoring, so the figures are the "
            + "queue's. The database's queue must be empty; the benchmark removes its tickets."})
final class QueueBenchmark implements Callable<Integer> {
  @Spec
  CommandSpec spec;

  @Option(names = "--db-url", required = true, paramLabel = "JDBC",
      description = "The database, as a JDBC address (jdbc:postgresql://host:5432/name).")
  String url;

  @Option(names = "--db-user", defaultValue = "precedent", paramLabel = "NAME",
      description = "The database user (default ${DEFAULT-VALUE}).")
  String user;

  @Option(names = "--tickets", paramLabel = "N", defaultValue = "10000",
      description = "Tickets drained in each run (default ${DEFAULT-VALUE}).")
  int tickets;

  @Option(names = "--decide-ms", paramLabel = "MS", defaultValue = "0",
      description = "A wait per decision standing for the scoring (default ${DEFAULT-VALUE}).")
  long decideMs;

  @Override
  public Integer call() throws Exception {
    PrintWriter out = spec.commandLine().getOut();
    if (tickets < 1 || decideMs < 0) {
      throw new ParameterException(spec.commandLine(),
          "--tickets must be at least 1 and --decide-ms at least 0");
    }
    // The password from the environment, never from the command line (it would show in ps).
    String password = System.getenv().getOrDefault("PRECEDENT_DB_PASSWORD", "");
    QueueDrain.Database db = new QueueDrain.Database(url, user, password);
    out.printf(Locale.ROOT, "machine: %d cores; database %s; %,d tickets, batches of 8, "
        + "decision wait %d ms%n", Runtime.getRuntime().availableProcessors(),
        // Without the address's parameters, which may hold a password.
        url.split("\\?", 2)[0], tickets,
        decideMs);
    QueueDrain.Figures one = QueueDrain.run(db, 1, tickets, decideMs);
    print(out, one);
    QueueDrain.Figures two = QueueDrain.run(db, 2, tickets, decideMs);
    print(out, two);
    out.printf(Locale.ROOT, "2 replicas / 1 replica: %.2fx the decisions/s%n",
        two.perSecond() / one.perSecond());
    return one.decidedOnce() == tickets && two.decidedOnce() == tickets ? 0 : 1;
  }

  private static void print(PrintWriter out, QueueDrain.Figures f) {
    out.printf(Locale.ROOT, "%d replica%s: %,d tickets drained in %.2f s = %.0f decisions/s; "
            + "p50 %.1f ms, p99 %.1f ms from claim to stored; decided once: %,d%n", f.replicas(),
        f.replicas() == 1 ? "" : "s", f.tickets(), f.seconds(), f.perSecond(), f.p50Ms(),
        f.p99Ms(), f.decidedOnce());
  }
}
