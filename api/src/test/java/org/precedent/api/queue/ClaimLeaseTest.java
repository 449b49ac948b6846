package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import javax.sql.DataSource;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.precedent.api.decision.DecisionView;
import org.precedent.api.system.ServiceSchema;
import org.precedent.api.testing.PostgresForClass;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.datasource.DataSourceTransactionManager;
import org.springframework.jdbc.datasource.DriverManagerDataSource;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Claims with leases, on H2 (one service) and on a real PostgreSQL server (replicas): each test
 * runs the queue's own SQL through two {@link TicketQueue}s with different replica ids over one
 * database, as two replicas would.
 */
class ClaimLeaseTest {
  @RegisterExtension
  static final PostgresForClass postgres = new PostgresForClass();

  static DataSource database(String kind) {
    if (kind.equals("h2")) {
      return new DriverManagerDataSource("jdbc:h2:mem:claims" + System.nanoTime()
          + ";DB_CLOSE_DELAY=-1", "sa", "");
    }
    return emptied(postgres);
  }

  /** The server's database, migrated and emptied. */
  static DataSource emptied(PostgresForClass server) {
    ServiceSchema.migrate(server.dataSource());
    server.reset();
    return server.dataSource();
  }

  static TicketQueue replica(DataSource db, String id, Duration lease) {
    ServiceSchema.migrate(db);
    return new TicketQueue(new JdbcTemplate(db),
        new TransactionTemplate(new DataSourceTransactionManager(db)), new ObjectMapper(), id,
        lease);
  }

  static DecisionView decision(String question) {
    return new DecisionView("HAND_OFF", "low_confidence", question, null, null, 0.25, 0.95, null,
        null, "handed off: confidence below the threshold", null, false, "v-0001", List.of(),
        null);
  }

  static SubmitRequest ticket(String id) {
    return new SubmitRequest(id, "My bin was not emptied on " + id, null);
  }

  static Map<String, Object> row(DataSource db, String id) {
    return new JdbcTemplate(db).queryForMap("SELECT status, claim_owner, attempts, lease_until "
        + "FROM queue_ticket WHERE ticket_id = ?", id);
  }

  static int decisions(DataSource db, String id) {
    return new JdbcTemplate(db).queryForObject("SELECT COUNT(*) FROM ticket_decision "
        + "WHERE ticket_id = ?", Integer.class, id);
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aClaimNamesItsReplicaAndHoldsTheTicketFromTheOthers(String kind) {
    DataSource db = database(kind);
    TicketQueue a = replica(db, "replica-a", Duration.ofSeconds(30));
    TicketQueue b = replica(db, "replica-b", Duration.ofSeconds(30));
    for (int i = 1; i <= 3; i++) {
      a.submit(ticket("T-" + i), "queue");
    }
    List<TicketQueue.Claimed> first = a.claimBatch(2);
    assertEquals(List.of("T-1", "T-2"), first.stream().map(TicketQueue.Claimed::ticketId).toList());
    assertEquals("replica-a", row(db, "T-1").get("claim_owner"));
    assertEquals("DECIDING", row(db, "T-1").get("status"));
    assertTrue(row(db, "T-1").get("lease_until") != null);
    List<TicketQueue.Claimed> second = b.claimBatch(8);
    assertEquals(List.of("T-3"), second.stream().map(TicketQueue.Claimed::ticketId).toList());
    assertTrue(b.claimBatch(8).isEmpty(), "every ticket is held by a live lease");
    // A replica cannot store a decision on another's claim.
    assertFalse(b.decided(first.get(0), decision("q")));
    assertTrue(a.decided(first.get(0), decision("q")));
    assertEquals(1, decisions(db, "T-1"));
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aLeaseThatEndsMidDecisionPassesTheTicketOnAndTheLateWriteIsRefused(String kind)
      throws InterruptedException {
    DataSource db = database(kind);
    TicketQueue slow = replica(db, "replica-slow", Duration.ofMillis(300));
    TicketQueue other = replica(db, "replica-other", Duration.ofSeconds(30));
    slow.submit(ticket("L-1"), "queue");
    TicketQueue.Claimed late = slow.claimBatch(8).get(0);
    assertTrue(other.claimBatch(8).isEmpty(), "the lease is still running");
    Thread.sleep(600);
    assertFalse(late.leaseLeft(Duration.ZERO));
    TicketQueue.Claimed taken = other.claimBatch(8).get(0);
    assertEquals(2, taken.attempt(), "the second claim counts a second try");
    assertFalse(slow.decided(late, decision("late")), "the late replica's write is refused");
    assertFalse(slow.failed(late, "late failure"), "so is its failure");
    assertTrue(other.decided(taken, decision("on time")));
    assertEquals(1, decisions(db, "L-1"));
    assertEquals("DECIDED", row(db, "L-1").get("status"));
    assertEquals("replica-other", row(db, "L-1").get("claim_owner"));
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void anEndedLeaseNobodyTookStillStoresItsDecision(String kind) throws InterruptedException {
    DataSource db = database(kind);
    TicketQueue slow = replica(db, "replica-slow", Duration.ofMillis(200));
    slow.submit(ticket("E-1"), "queue");
    TicketQueue.Claimed c = slow.claimBatch(8).get(0);
    Thread.sleep(400);
    assertTrue(slow.decided(c, decision("q")));
    assertEquals(1, decisions(db, "E-1"));
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aClaimWhoseReplicaStoppedOnItsLastTryFails(String kind) throws InterruptedException {
    DataSource db = database(kind);
    TicketQueue dying = replica(db, "replica-dying", Duration.ofMillis(100));
    dying.submit(ticket("F-1"), "queue");
    for (int i = 0; i < TicketQueue.MAX_ATTEMPTS; i++) {
      assertEquals(1, dying.claimBatch(8).size(), "try " + (i + 1));
      Thread.sleep(200);
    }
    assertTrue(dying.claimBatch(8).isEmpty());
    assertEquals("FAILED", row(db, "F-1").get("status"));
    assertEquals(TicketQueue.MAX_ATTEMPTS, ((Number) row(db, "F-1").get("attempts")).intValue());
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aGivenBackClaimIsQueuedAtOnceWithItsTryUncounted(String kind) {
    DataSource db = database(kind);
    TicketQueue a = replica(db, "replica-a", Duration.ofSeconds(30));
    TicketQueue b = replica(db, "replica-b", Duration.ofSeconds(30));
    a.submit(ticket("G-1"), "queue");
    a.giveBack(a.claimBatch(8).get(0));
    assertEquals("QUEUED", row(db, "G-1").get("status"));
    assertEquals(0, ((Number) row(db, "G-1").get("attempts")).intValue());
    assertEquals(1, b.claimBatch(8).get(0).attempt());
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aStartReleasesOnlyClaimsKnownDead(String kind) {
    DataSource db = database(kind);
    TicketQueue a = replica(db, "replica-a", Duration.ofSeconds(30));
    a.submit(ticket("R-1"), "queue");
    a.claimBatch(8);
    TicketQueue.Released byOther = replica(db, "replica-b", Duration.ofSeconds(30))
        .releaseClaims();
    if (kind.equals("h2")) {
      // One process holds an H2 file: any claim in it was left by a run that stopped.
      assertEquals(1, byOther.queued());
    } else {
      // Replica a may be alive: its claim waits for its lease.
      assertEquals(0, byOther.queued());
      assertEquals("DECIDING", row(db, "R-1").get("status"));
      TicketQueue.Released byItself = replica(db, "replica-a", Duration.ofSeconds(30))
          .releaseClaims();
      assertEquals(1, byItself.queued());
    }
    assertEquals("QUEUED", row(db, "R-1").get("status"));
  }

  @ParameterizedTest
  @ValueSource(strings = {"h2", "postgres"})
  void aDuplicateIdIsStoredOnceAcrossReplicas(String kind) {
    DataSource db = database(kind);
    TicketQueue a = replica(db, "replica-a", Duration.ofSeconds(30));
    TicketQueue b = replica(db, "replica-b", Duration.ofSeconds(30));
    assertTrue(a.submit(ticket("D-1"), "queue").created());
    assertFalse(b.submit(ticket("D-1"), "queue").created());
    assertThrows(TicketQueue.Conflict.class,
        () -> b.submit(new SubmitRequest("D-1", "another question", null), "queue"));
    assertEquals(1, new JdbcTemplate(db).queryForObject("SELECT COUNT(*) FROM queue_ticket",
        Integer.class));
  }

  /**
   * Two replicas failing ended last-try claims at once, from two connections, each holding a row
   * the other's step reaches: with {@code FOR UPDATE SKIP LOCKED} neither waits on the other, and
   * between them every such claim is failed once. (A plain {@code UPDATE} here waits on the held
   * row until the other transaction ends, and once the other's step reaches the first's rows
   * each waits on the other: PostgreSQL reports a deadlock.)
   */
  @org.junit.jupiter.api.Test
  void twoReplicasFailingEndedClaimsAtOnceNeitherWaitNorDeadlock() throws Exception {
    DataSource db = emptied(postgres);
    TicketQueue setup = replica(db, "replica-setup", Duration.ofSeconds(30));
    int rows = 40;
    for (int i = 0; i < rows; i++) {
      setup.submit(ticket(String.format("X-%03d", i)), "queue");
    }
    // Every ticket claimed for the last time by a replica that stopped a minute ago.
    new JdbcTemplate(db).update("UPDATE queue_ticket SET status = 'DECIDING', attempts = ?, "
        + "claim_owner = 'replica-gone', lease_until = CURRENT_TIMESTAMP - INTERVAL '1 minute'",
        TicketQueue.MAX_ATTEMPTS);
    java.util.concurrent.ExecutorService threads =
        java.util.concurrent.Executors.newFixedThreadPool(2);
    try (java.sql.Connection first = db.getConnection();
        java.sql.Connection second = db.getConnection()) {
      first.setAutoCommit(false);
      second.setAutoCommit(false);
      TicketQueue one = onConnection(first, "replica-one");
      TicketQueue two = onConnection(second, "replica-two");
      // The second replica's transaction already holds the newest of those rows.
      new JdbcTemplate(new org.springframework.jdbc.datasource.SingleConnectionDataSource(second,
          true)).queryForList("SELECT seq FROM queue_ticket WHERE ticket_id = ? FOR UPDATE",
          Long.class, String.format("X-%03d", rows - 1));
      long start = System.nanoTime();
      var byOne = threads.submit(() -> one.failEndedLastTries(one.databaseNow()));
      // The first step has the other rows locked (or is waiting on the held one) before the
      // second begins.
      int firstFailed = byOne.get(10, java.util.concurrent.TimeUnit.SECONDS);
      long firstMs = (System.nanoTime() - start) / 1_000_000;
      var byTwo = threads.submit(() -> two.failEndedLastTries(two.databaseNow()));
      int secondFailed = byTwo.get(10, java.util.concurrent.TimeUnit.SECONDS);
      first.commit();
      second.commit();
      assertEquals(rows - 1, firstFailed, "all but the row the other replica holds");
      assertEquals(1, secondFailed, "the row it held; the rest were the first's");
      // PostgreSQL's deadlock_timeout is 1 s (its documented default): a wait on the held row
      // would last at least that long.
      assertTrue(firstMs < 1000, "the first step waited " + firstMs + " ms on a held row");
    } finally {
      threads.shutdownNow();
    }
    assertEquals(rows, new JdbcTemplate(db).queryForObject("SELECT COUNT(*) FROM queue_ticket "
        + "WHERE status = 'FAILED' AND lease_until IS NULL", Integer.class));
    // And at once, from two connections started together, over rows neither holds.
    new JdbcTemplate(db).update("UPDATE queue_ticket SET status = 'DECIDING', "
        + "lease_until = CURRENT_TIMESTAMP - INTERVAL '1 minute'");
    java.util.concurrent.CountDownLatch go = new java.util.concurrent.CountDownLatch(1);
    java.util.concurrent.ExecutorService both =
        java.util.concurrent.Executors.newFixedThreadPool(2);
    List<java.util.concurrent.Future<Integer>> steps = new java.util.ArrayList<>();
    for (String id : List.of("replica-one", "replica-two")) {
      TicketQueue q = replica(db, id, Duration.ofSeconds(30));
      steps.add(both.submit(() -> {
        go.await();
        // Through claimBatch, as the worker runs it: the step, then the claim, one transaction.
        assertTrue(q.claimBatch(8).isEmpty(), "nothing left to claim");
        return 0;
      }));
    }
    go.countDown();
    for (var f : steps) {
      f.get(10, java.util.concurrent.TimeUnit.SECONDS);
    }
    both.shutdown();
    assertEquals(rows, new JdbcTemplate(db).queryForObject("SELECT COUNT(*) FROM queue_ticket "
        + "WHERE status = 'FAILED' AND lease_until IS NULL", Integer.class));
  }

  /** A replica's queue over one connection, whose transaction the test commits. */
  private static TicketQueue onConnection(java.sql.Connection c, String id) {
    var single = new org.springframework.jdbc.datasource.SingleConnectionDataSource(c, true);
    return new TicketQueue(new JdbcTemplate(single),
        new TransactionTemplate(new DataSourceTransactionManager(single)), new ObjectMapper(), id,
        Duration.ofSeconds(30));
  }

  @org.junit.jupiter.api.Test
  void aReplicaIdIsCheckedOrGenerated() {
    assertEquals("replica-1", ReplicaId.orGenerated(" replica-1 "));
    String generated = ReplicaId.orGenerated("");
    assertTrue(generated.length() <= ReplicaId.MAX_CHARS && !generated.isBlank(), generated);
    assertFalse(generated.equals(ReplicaId.orGenerated("")), "two starts, two ids");
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
        () -> ReplicaId.orGenerated("two words"));
    assertTrue(e.getMessage().contains("precedent.replica.id"), e.getMessage());
  }
}
