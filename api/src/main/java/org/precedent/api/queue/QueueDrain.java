package org.precedent.api.queue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
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
 * Measures how fast replicas drain one queue: {@code tickets} tickets are stored, then {@code
 * replicas} replicas, each with its own connection pool and id, claim and decide them with the
 * queue's own SQL until none is left. The decision is a fixed hand-off (or a wait of {@code
 * decideMs} standing for the scoring), so the figures are the queue's: the database's claims,
 * leases and conditional writes. It refuses a database whose queue holds tickets, since it would
 * decide them, and removes its own tickets afterwards.
 */
public final class QueueDrain {
  private QueueDrain() {
  }

  /** One run's figures; latency is from a batch's claim to each of its decisions stored. */
  public record Figures(int replicas, int tickets, double seconds, double perSecond,
      double p50Ms, double p99Ms, long decidedOnce) {}

  /** Where the database is. */
  public record Database(String url, String user, String password) {}

  public static Figures run(Database database, int replicas, int tickets, long decideMs)
      throws Exception {
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
          queues.get(i % replicas).submit(new SubmitRequest(prefix + i, "My bin was not "
              + "emptied on collection day " + i, null), "benchmark");
        }
        DecisionView decision = new DecisionView("HAND_OFF", "low_confidence", "", null, null,
            0.25, 0.95, null, null, "handed off: confidence below the threshold", null, false,
            "benchmark", List.of(), null);
        ExecutorService threads = Executors.newFixedThreadPool(replicas);
        List<Future<long[]>> each = new ArrayList<>();
        long start = System.nanoTime();
        for (TicketQueue q : queues) {
          each.add(threads.submit(() -> drain(q, decision, decideMs, tickets)));
        }
        long[] all = new long[0];
        for (Future<long[]> f : each) {
          long[] mine = f.get();
          long[] both = Arrays.copyOf(all, all.length + mine.length);
          System.arraycopy(mine, 0, both, all.length, mine.length);
          all = both;
        }
        double seconds = (System.nanoTime() - start) / 1e9;
        threads.shutdown();
        Arrays.sort(all);
        Long once = db.queryForObject("SELECT COUNT(DISTINCT d.ticket_id) FROM ticket_decision d "
            + "JOIN queue_ticket q ON q.ticket_id = d.ticket_id WHERE q.status = 'DECIDED' AND "
            + "d.ticket_id LIKE ?", Long.class, prefix + "%");
        return new Figures(replicas, tickets, seconds, all.length / seconds,
            percentile(all, 0.50) / 1e6, percentile(all, 0.99) / 1e6, once == null ? 0 : once);
      } finally {
        db.update("DELETE FROM ticket_decision WHERE ticket_id LIKE ?", prefix + "%");
        db.update("DELETE FROM queue_ticket WHERE ticket_id LIKE ?", prefix + "%");
      }
    } finally {
      pools.forEach(HikariDataSource::close);
    }
  }

  private static long[] drain(TicketQueue q, DecisionView decision, long decideMs, int max)
      throws InterruptedException {
    long[] nanos = new long[max];
    int n = 0;
    while (true) {
      long claimed = System.nanoTime();
      List<TicketQueue.Claimed> batch = q.claimBatch(8);
      if (batch.isEmpty()) {
        return Arrays.copyOf(nanos, n);
      }
      for (TicketQueue.Claimed c : batch) {
        if (decideMs > 0) {
          Thread.sleep(decideMs);
        }
        if (q.decided(c, decision)) {
          nanos[n++] = System.nanoTime() - claimed;
        }
      }
    }
  }

  /** Nearest-rank percentile of sorted values. */
  private static double percentile(long[] sorted, double p) {
    if (sorted.length == 0) {
      return 0;
    }
    return sorted[Math.max(0, (int) Math.ceil(p * sorted.length) - 1)];
  }
}
