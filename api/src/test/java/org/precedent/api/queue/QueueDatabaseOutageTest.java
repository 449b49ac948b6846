package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.read.ListAppender;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.PostgresForClass;
import org.precedent.api.testing.RunningService;
import org.slf4j.LoggerFactory;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The real service on a real PostgreSQL server that is stopped while the queue worker holds a
 * batch of claims and is deciding them, and started again a few seconds later on the same data
 * directory and port. Meanwhile health reports the database DOWN and a submission is answered
 * 503 saying to send it again; afterwards, without a restart of the service, every accepted
 * ticket is stored once and decided once, and the outage cost no ticket a try.
 */
class QueueDatabaseOutageTest {
  @RegisterExtension
  static final PostgresForClass postgres = PostgresForClass.restartable();
  static final int TICKETS = 40;

  @Test
  void anOutageMidBatchLosesNoTicketDecidesNoneTwiceAndTheWorkerRecoversByItself()
      throws Exception {
    ListAppender<ILoggingEvent> log = new ListAppender<>();
    List<String> accepted = new ArrayList<>();
    try (RunningService service = RunningService.start("--spring.datasource.url="
        + postgres.url(), "--spring.datasource.username=postgres",
        "--precedent.replica.id=replica-outage", "--precedent.queue.poll-ms=100")) {
      // Attached once the service has started: its start configures logging afresh.
      Logger worker = (Logger) LoggerFactory.getLogger(QueueWorker.class);
      log.start();
      worker.addAppender(log);
      Http http = service.http();
      for (int i = 0; i < TICKETS; i++) {
        submit(http, "O-" + i, accepted);
      }
      JdbcTemplate db = new JdbcTemplate(postgres.dataSource());
      long until = System.nanoTime() + 60_000_000_000L;
      while (System.nanoTime() < until && !(count(db, "DECIDED") >= 8
          && count(db, "DECIDING") > 0)) {
        Thread.sleep(5);
      }
      assertTrue(count(db, "DECIDING") > 0 && count(db, "DECIDED") < TICKETS,
          "the worker holds claims when the database stops");

      postgres.stop();
      long stopped = System.nanoTime();
      Reply health = http.get("/actuator/health", Caller.MANAGER);
      assertEquals(503, health.status(), health.raw().body());
      assertEquals("DOWN", health.json().get("components").get("db").get("status").asText());
      assertEquals("UP", health.json().get("components").get("queue").get("status").asText(),
          "the worker is alive, waiting for the database");
      long asked = System.nanoTime();
      Reply refused = http.post("/api/v1/queue/tickets", Map.of("ticketId", "O-during",
          "question", "My bin was not emptied during the outage"), Caller.QUEUE);
      long answeredMs = (System.nanoTime() - asked) / 1_000_000;
      assertEquals(503, refused.status(), refused.raw().body());
      assertEquals("Storage unavailable", refused.json().get("title").asText());
      assertTrue(refused.json().get("detail").asText().contains("send it again later"),
          refused.raw().body());
      assertNotNull(refused.header("Retry-After"));
      assertFalse(refused.raw().body().contains("\tat "), refused.raw().body());
      // The pool waits spring.datasource.hikari.connection-timeout (3 s) for a connection; the
      // 2 s more are an allowance for a loaded machine (common practice, no source).
      assertTrue(answeredMs < 5000, "the refusal took " + answeredMs + " ms");
      // Down long enough for the worker to fail and wait more than once.
      Thread.sleep(Math.max(0, 4000 - (System.nanoTime() - stopped) / 1_000_000));
      postgres.start();
      long restarted = System.nanoTime();

      http.awaitHealthy("the database was back");
      System.out.printf("database outage: healthy %d ms after the database was back%n",
          (System.nanoTime() - restarted) / 1_000_000);
      // The refused ticket, sent again, is accepted; so is a new one.
      submit(http, "O-during", accepted);
      submit(http, "O-after", accepted);
      assertEquals(TICKETS + 2, accepted.size(), "accepted: " + accepted);
      until = System.nanoTime() + 120_000_000_000L;
      while (System.nanoTime() < until && count(db, "DECIDED") < accepted.size()) {
        Thread.sleep(50);
      }
      assertEquals(accepted.size(), db.queryForObject("SELECT COUNT(*) FROM queue_ticket",
          Integer.class), "each accepted ticket stored once");
      assertEquals(accepted.size(), count(db, "DECIDED"), "each decided");
      assertEquals(accepted.size(), db.queryForObject("SELECT COUNT(*) FROM ticket_decision d "
          + "JOIN queue_ticket q ON q.ticket_id = d.ticket_id", Integer.class), "decided once");
      assertEquals(0, count(db, "FAILED"));
      // The outage was the database's, not a ticket's: it cost no ticket a try.
      assertEquals(List.of(), db.queryForList("SELECT ticket_id, attempts, failure, claimed_at, "
          + "submitted_at FROM queue_ticket WHERE attempts <> 1"));
    } finally {
      ((Logger) LoggerFactory.getLogger(QueueWorker.class)).detachAppender(log);
    }
    List<String> lines = log.list.stream().map(ILoggingEvent::getFormattedMessage).toList();
    assertTrue(lines.stream().anyMatch(l -> l.startsWith("queue worker: storage failed")
        && l.contains("less and less often")), String.join("\n", lines));
    String back = lines.stream().filter(l -> l.startsWith("queue worker: the database works "
        + "again after")).findFirst().orElseThrow(() -> new AssertionError(String.join("\n",
        lines)));
    System.out.println("database outage: " + back);
  }

  private static void submit(Http http, String id, List<String> accepted) {
    Reply r = http.post("/api/v1/queue/tickets", Map.of("ticketId", id, "question",
        "My green bin was not emptied this week, ticket " + id), Caller.QUEUE);
    assertEquals(202, r.status(), r.raw().body());
    accepted.add(id);
  }

  private static int count(JdbcTemplate db, String status) {
    return db.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE status = ?",
        Integer.class, status);
  }
}
