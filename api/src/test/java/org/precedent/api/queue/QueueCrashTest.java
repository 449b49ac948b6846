package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.time.Duration;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.ChildJvm;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.TrainedData;

/**
 * Kill -9 the service while tickets are being submitted and decided; after a restart on the same
 * data directory every acknowledged ticket is there and decided exactly once.
 */
class QueueCrashTest {
  static final Pattern URL = Pattern.compile("at http://localhost:(\\d+)/");
  static final String[] QUESTIONS = {"My green bin was not emptied", "How do I send a meter "
      + "reading?", "Can I pay my bill in instalments?", "Low water pressure in the shower",
      "I am moving house, how do I close my account?", "The water from my tap is brown"};
  static final int TICKETS = 300;
  Path data;

  @AfterEach
  void clean() {
    TrainedData.delete(data);
  }

  private static ChildJvm serve(Path data, Path log) throws Exception {
    return ChildJvm.start(log, "serve", "--port", "0", "--data", data.toString(), "--",
        "--precedent.queue.poll-ms=100");
  }

  @Test
  void everyAcknowledgedTicketIsDecidedExactlyOnceAfterAKill() throws Exception {
    data = TrainedData.copy();
    Set<String> acknowledged = ConcurrentHashMap.newKeySet();
    try (ChildJvm first = serve(data, data.resolve("first.log"))) {
      Http http = new Http(Integer.parseInt(first.await(URL, Duration.ofSeconds(120))));
      // First a few tickets, until the worker has decided some: the kill then finds decided,
      // claimed and pending tickets, with submissions still arriving.
      for (int i = 0; i < 10; i++) {
        String id = String.format("K-%04d", i);
        assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", id, "question",
            QUESTIONS[i % QUESTIONS.length]), Caller.QUEUE).status());
        acknowledged.add(id);
      }
      long until = System.nanoTime() + Duration.ofSeconds(60).toNanos();
      while (System.nanoTime() < until && decidedCount(http) < 3) {
        Thread.sleep(20);
      }
      ExecutorService submitters = Executors.newFixedThreadPool(6);
      for (int i = 10; i < TICKETS; i++) {
        String id = String.format("K-%04d", i);
        String question = QUESTIONS[i % QUESTIONS.length] + " (ticket " + i + ")";
        submitters.submit(() -> {
          try {
            Thread.sleep(10);
            Reply r = http.post("/api/v1/queue/tickets", Map.of("ticketId", id, "question",
                question), Caller.QUEUE);
            if (r.status() == 202 || r.status() == 200) {
              acknowledged.add(id);
            }
          } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
          } catch (RuntimeException refusedAfterTheKill) {
            // Not acknowledged: the caller would submit it again.
          }
        });
      }
      while (acknowledged.size() < 80) {
        Thread.sleep(5);
      }
      first.kill();
      submitters.shutdown();
      assertTrue(submitters.awaitTermination(60, TimeUnit.SECONDS));
    }
    assertTrue(acknowledged.size() >= 80 && acknowledged.size() < TICKETS,
        "the kill came mid-batch: " + acknowledged.size() + " of " + TICKETS + " acknowledged");

    Map<String, String> decidedAt = new HashMap<>();
    try (ChildJvm second = serve(data, data.resolve("second.log"))) {
      Http http = new Http(Integer.parseInt(second.await(URL, Duration.ofSeconds(120))));
      for (String id : acknowledged) {
        decidedAt.put(id, awaitDecided(http, id));
      }
      // A resubmission of an acknowledged ticket returns its one decision.
      for (String id : List.copyOf(acknowledged).subList(0, 10)) {
        Reply r = http.get("/api/v1/queue/tickets/" + id, Caller.QUEUE);
        assertEquals(decidedAt.get(id), r.json().get("decidedAt").asText());
      }
      second.stop();
    }

    // Read the database itself: one decision row per stored ticket, every ticket decided.
    String url = "jdbc:h2:file:" + data.resolve("service/precedent").toAbsolutePath();
    try (Connection c = DriverManager.getConnection(url, "sa", "")) {
      Set<String> stored = ids(c, "SELECT ticket_id FROM queue_ticket");
      assertTrue(stored.containsAll(acknowledged), "no acknowledged ticket is lost");
      assertEquals(stored.size(), count(c, "SELECT COUNT(*) FROM ticket_decision"));
      assertEquals(0, count(c, "SELECT COUNT(*) FROM (SELECT ticket_id FROM ticket_decision "
          + "GROUP BY ticket_id HAVING COUNT(*) > 1) d"));
      assertEquals(stored.size(), count(c, "SELECT COUNT(*) FROM queue_ticket t JOIN "
          + "ticket_decision d ON d.ticket_id = t.ticket_id WHERE t.status = 'DECIDED'"));
    }
  }

  private static int decidedCount(Http http) {
    int n = 0;
    for (int i = 0; i < 10; i++) {
      Reply r = http.get(String.format("/api/v1/queue/tickets/K-%04d", i), Caller.QUEUE);
      n += r.json().get("status").asText().equals("DECIDED") ? 1 : 0;
    }
    return n;
  }

  private static String awaitDecided(Http http, String id) throws InterruptedException {
    for (int i = 0; i < 1200; i++) {
      Reply r = http.get("/api/v1/queue/tickets/" + id, Caller.QUEUE);
      assertEquals(200, r.status(), id + " is stored: " + r.raw().body());
      if (r.json().get("status").asText().equals("DECIDED")) {
        return r.json().get("decidedAt").asText();
      }
      Thread.sleep(50);
    }
    throw new AssertionError(id + " was not decided after the restart");
  }

  private static Set<String> ids(Connection c, String sql) throws Exception {
    Set<String> out = new HashSet<>();
    try (ResultSet rs = c.createStatement().executeQuery(sql)) {
      while (rs.next()) {
        out.add(rs.getString(1));
      }
    }
    return out;
  }

  private static long count(Connection c, String sql) throws Exception {
    try (ResultSet rs = c.createStatement().executeQuery(sql)) {
      rs.next();
      return rs.getLong(1);
    }
  }
}
