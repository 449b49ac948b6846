package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.PostgresForClass;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Two replicas' queues on one real PostgreSQL server, at once: 1,000 tickets submitted across
 * both, 200 of them twice, while both claim and decide; one replica stops dead after a few batches
 * with a batch claimed and undecided, the other takes its claims when their leases end and
 * finishes. Every accepted ticket is stored once and decided once, and the dead replica's writes,
 * made late, are all refused.
 */
class ReplicasOnPostgresTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();
  static final int TICKETS = 1000;
  static final int TWICE = 200;
  static final Duration LEASE = Duration.ofSeconds(1);

  @Test
  void everyTicketIsStoredOnceAndDecidedOnceWhenAReplicaDiesMidBatch() throws Exception {
    DataSource db = ClaimLeaseTest.emptied(postgres);
    TicketQueue survivor = ClaimLeaseTest.replica(db, "replica-survivor", LEASE);
    TicketQueue doomed = ClaimLeaseTest.replica(db, "replica-doomed", LEASE);
    ExecutorService pool = Executors.newFixedThreadPool(4);
    AtomicInteger created = new AtomicInteger();
    List<Future<?>> submitters = new ArrayList<>();
    for (int part = 0; part < 2; part++) {
      TicketQueue door = part == 0 ? survivor : doomed;
      int first = part;
      submitters.add(pool.submit(() -> {
        // Each door takes every other ticket, and the first TWICE ids again through the other.
        for (int i = first; i < TICKETS; i += 2) {
          if (door.submit(ClaimLeaseTest.ticket("R-" + i), "queue").created()) {
            created.incrementAndGet();
          }
        }
        for (int i = 1 - first; i < TWICE; i += 2) {
          if (door.submit(ClaimLeaseTest.ticket("R-" + i), "queue").created()) {
            created.incrementAndGet();
          }
        }
        return null;
      }));
    }
    // The doomed replica decides three batches, then claims a fourth and stops dead.
    AtomicInteger byDoomed = new AtomicInteger();
    Future<List<TicketQueue.Claimed>> abandoned = pool.submit(() -> {
      int batches = 0;
      while (true) {
        List<TicketQueue.Claimed> batch = doomed.claimBatch(8);
        if (batch.isEmpty()) {
          Thread.sleep(5);
          continue;
        }
        if (++batches == 4) {
          return batch;
        }
        for (TicketQueue.Claimed c : batch) {
          assertTrue(doomed.decided(c, ClaimLeaseTest.decision(c.question())));
          byDoomed.incrementAndGet();
        }
      }
    });
    Future<Integer> survived = pool.submit(() -> {
      int decided = 0;
      long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
      while (System.nanoTime() < end) {
        List<TicketQueue.Claimed> batch = survivor.claimBatch(8);
        for (TicketQueue.Claimed c : batch) {
          if (survivor.decided(c, ClaimLeaseTest.decision(c.question()))) {
            decided++;
          }
        }
        if (batch.isEmpty()) {
          if (submittersDone(submitters) && survivor.count(TicketState.QUEUED) == 0
              && survivor.count(TicketState.DECIDING) == 0) {
            return decided;
          }
          Thread.sleep(20);
        }
      }
      throw new AssertionError("the surviving replica did not finish within 60 s");
    });
    for (Future<?> f : submitters) {
      f.get(60, TimeUnit.SECONDS);
    }
    List<TicketQueue.Claimed> left = abandoned.get(60, TimeUnit.SECONDS);
    int bySurvivor = survived.get(90, TimeUnit.SECONDS);
    pool.shutdown();

    // The dead replica's late writes: each refused, none doubles a decision.
    for (TicketQueue.Claimed c : left) {
      assertFalse(doomed.decided(c, ClaimLeaseTest.decision("late")), c.ticketId());
    }
    JdbcTemplate t = new JdbcTemplate(db);
    assertEquals(TICKETS, created.get(), "each id accepted as new once");
    assertEquals(TICKETS, t.queryForObject("SELECT COUNT(*) FROM queue_ticket", Integer.class));
    assertEquals(TICKETS, t.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE status = "
        + "'DECIDED'", Integer.class));
    assertEquals(TICKETS, t.queryForObject("SELECT COUNT(*) FROM ticket_decision",
        Integer.class));
    assertEquals(TICKETS, t.queryForObject("SELECT COUNT(*) FROM queue_ticket q JOIN "
        + "ticket_decision d ON d.ticket_id = q.ticket_id", Integer.class));
    assertEquals(TICKETS - byDoomed.get(), bySurvivor, "the survivor decided all but the "
        + "doomed's three batches");
    assertFalse(left.isEmpty());
    for (TicketQueue.Claimed c : left) {
      assertEquals("replica-survivor", t.queryForObject("SELECT claim_owner FROM queue_ticket "
          + "WHERE ticket_id = ?", String.class, c.ticketId()));
      assertEquals(2, t.queryForObject("SELECT attempts FROM queue_ticket WHERE ticket_id = ?",
          Integer.class, c.ticketId()), "taken over after the lease: a second try");
    }
  }

  private static boolean submittersDone(List<Future<?>> submitters) {
    return submitters.stream().allMatch(Future::isDone);
  }
}
