package org.precedent.api.queue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.UUID;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.system.ServiceSchema;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DataSourceTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Measures how fast replicas drain one queue: the questions are stored as tickets, then {@code
 * replicas} replicas, each with its own connection pool and id, claim and decide them with the
 * queue's own SQL until none is left. What decides is given: the model in force (so the figures
 * are a replica's real ones: scoring, claims, leases and conditional writes), or a fixed
 * hand-off (so they are the database's share alone). It refuses a database whose queue holds
 * tickets, since it would decide them, and removes its own tickets afterwards.
 */
public final class QueueDrain {
  private QueueDrain() {
  }

  /** Decides one claimed ticket's question, as stored (cleaned); called on each replica's thread. */
  @FunctionalInterface
  public interface Decide {
    DecisionView decide(String question, String category) throws Exception;
  }

  /** The same hand-off for every ticket, after a wait of {@code decideMs} standing for scoring. */
  public static Decide handOff(long decideMs) {
    DecisionView decision = new DecisionView("HAND_OFF", "low_confidence", "", null, null,
        0.25, 0.95, null, null, "handed off: confidence below the threshold", null, false,
        "benchmark", List.of(), null);
    return (question, category) -> {
      if (decideMs > 0) {
        Thread.sleep(decideMs);
      }
      return decision;
    };
  }

  /**
   * One run's figures. {@code perSecond} is the drain rate, tickets decided and stored per second
   * from the first claim until the queue is empty; {@code perReplica} the decisions per second of
   * one replica (its own count over the same time, averaged); p50 and p99 from a batch's claim to
   * each of its decisions stored, and of the decision alone; {@code outcomes} counts the stored
   * decisions by outcome.
   */
  public record Figures(int replicas, int tickets, double seconds, double perSecond,
      double perReplica, double p50Ms, double p99Ms, double decideP50Ms, double decideP99Ms,
      long decidedOnce, Map<String, Integer> outcomes) {}

  /** Where the database is. */
  public record Database(String url, String user, String password) {}

  public static Figures run(Database database, int replicas, List<String> questions,
      Decide decide) throws Exception {
    int tickets = questions.size();
    List<HikariDataSource> pools = new ArrayList<>();
    try {
      List<TicketQueue> queues = new ArrayList<>();
      for (int r = 0; r < replicas; r++) {
        HikariConfig c = new HikariConfig();
        c.setJdbcUrl(database.url());
        c.setUsername(database.user());
        c.setPassword(database.password());
        c.setMaximumPoolSize(2);
        HikariDataSource pool = new HikariDataSource(c);
        pools.add(pool);
        if (r == 0) {
          ServiceSchema.migrate(pool);
        }
        queues.add(new TicketQueue(new JdbcTemplate(pool),
            new TransactionTemplate(new DataSourceTransactionManager(pool)), new ObjectMapper(),
            "bench-replica-" + (r + 1), Duration.ofSeconds(30)));
      }
      TicketQueue first = queues.get(0);
      long waiting = first.count(TicketState.QUEUED) + first.count(TicketState.DECIDING);
      if (waiting > 0) {
        throw new IllegalStateException("the database's queue holds " + waiting + " tickets "
            + "queued or being decided; the benchmark would decide them: give it an empty "
            + "database");
      }
      String prefix = "bench-" + UUID.randomUUID().toString().substring(0, 8) + "-";
      JdbcTemplate db = new JdbcTemplate(pools.get(0));
      try {
        for (int i = 0; i < tickets; i++) {
          queues.get(i % replicas).submit(new SubmitRequest(prefix + i, questions.get(i), null),
              "benchmark");
        }
        ExecutorService threads = Executors.newFixedThreadPool(replicas);
        List<Future<long[][]>> each = new ArrayList<>();
        long start = System.nanoTime();
        for (TicketQueue q : queues) {
          each.add(threads.submit(() -> drain(q, decide, tickets)));
        }
        long[] stored = new long[0];
        long[] decided = new long[0];
        for (Future<long[][]> f : each) {
          long[][] mine = f.get();
          stored = append(stored, mine[0]);
          decided = append(decided, mine[1]);
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        threads.shutdown();
        Arrays.sort(stored);
        Arrays.sort(decided);
        Long once = db.queryForObject("SELECT COUNT(DISTINCT d.ticket_id) FROM ticket_decision d "
            + "JOIN queue_ticket q ON q.ticket_id = d.ticket_id WHERE q.status = 'DECIDED' AND "
            + "d.ticket_id LIKE ?", Long.class, prefix + "%");
        Map<String, Integer> outcomes = new TreeMap<>();
        db.query("SELECT outcome, COUNT(*) FROM ticket_decision WHERE ticket_id LIKE ? "
            + "GROUP BY outcome", rs -> {
              outcomes.put(rs.getString(1), rs.getInt(2));
            }, prefix + "%");
        return new Figures(replicas, tickets, seconds, stored.length / seconds,
            stored.length / seconds / replicas, percentile(stored, 0.50) / 1e6,
            percentile(stored, 0.99) / 1e6, percentile(decided, 0.50) / 1e6,
            percentile(decided, 0.99) / 1e6, once == null ? 0 : once, outcomes);
      } finally {
        db.update("DELETE FROM ticket_decision WHERE ticket_id LIKE ?", prefix + "%");
        db.update("DELETE FROM queue_ticket WHERE ticket_id LIKE ?", prefix + "%");
      }
    } finally {
      pools.forEach(HikariDataSource::close);
    }
  }

  /** Claims and decides until the queue is empty: each decision's nanoseconds from its batch's
   * claim to stored, and of the decision alone. */
  private static long[][] drain(TicketQueue q, Decide decide, int max) throws Exception {
    long[] stored = new long[max];
    long[] decided = new long[max];
    int n = 0;
    while (true) {
      long claimed = System.nanoTime();
      List<TicketQueue.Claimed> batch = q.claimBatch(8);
      if (batch.isEmpty()) {
        return new long[][] {Arrays.copyOf(stored, n), Arrays.copyOf(decided, n)};
      }
      for (TicketQueue.Claimed c : batch) {
        long asked = System.nanoTime();
        DecisionView d = decide.decide(c.question(), c.category());
        long answered = System.nanoTime();
        if (q.decided(c, d)) {
          stored[n] = System.nanoTime() - claimed;
          decided[n++] = answered - asked;
        }
      }
    }
  }

  private static long[] append(long[] a, long[] b) {
    long[] both = Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, both, a.length, b.length);
    return both;
  }

  /** Nearest-rank percentile of sorted values. */
  private static double percentile(long[] sorted, double p) {
    if (sorted.length == 0) {
      return 0;
    }
    return sorted[Math.max(0, (int) Math.ceil(p * sorted.length) - 1)];
  }
}
