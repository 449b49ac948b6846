package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;

/**
 * A ticket whose decision throws, even a {@link StackOverflowError}, fails alone: it is tried a
 * few times, then marked failed with its reason, and the tickets behind it are decided.
 *
 * <p>The fault is a real one ({@link TrainedData#copyWithOverflowingRule}): the data directory's
 * safety policy holds a rule with a repeated group, which java.util.regex matches by recursing
 * once per repetition, and a question with thousands of repetitions overflows the stack.
 */
class QueueFailureTest {
  static final String HOSTILE = TrainedData.OVERFLOWING_QUESTION;
  static RunningService service;
  static Http http;

  @BeforeAll
  static void start() {
    service = RunningService.startOn(TrainedData.copyWithOverflowingRule(),
        "--precedent.queue.poll-ms=100");
    http = service.http();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  static JsonNode awaitState(String id, String state) throws InterruptedException {
    for (int i = 0; i < 600; i++) {
      Reply r = http.get("/api/v1/queue/tickets/" + id, Caller.QUEUE);
      assertEquals(200, r.status(), r.raw().body());
      if (r.json().get("status").asText().equals(state)) {
        return r.json();
      }
      Thread.sleep(50);
    }
    throw new AssertionError("ticket " + id + " did not become " + state + " within 30 s");
  }

  @Test
  void aTicketThatCannotBeDecidedFailsWithItsReasonAndTheQueueGoesOn() throws Exception {
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "H-1", "question",
        HOSTILE), Caller.QUEUE).status());
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "N-1", "question",
        "How do I read my water meter?"), Caller.QUEUE).status());
    JsonNode failed = awaitState("H-1", "FAILED");
    assertEquals(TicketQueue.MAX_ATTEMPTS, failed.get("attempts").asInt());
    assertTrue(failed.get("failure").asText().contains("ran out of stack"), failed.toString());
    assertTrue(failed.get("decision") == null, "a failed ticket carries no decision");
    // The agents' list shows it among the failed, with its reason.
    JsonNode listed = http.get("/api/v1/queue/tickets?state=failed&search=H-1", Caller.AGENT)
        .json().get("tickets").get(0);
    assertEquals("H-1", listed.get("ticketId").asText());
    assertEquals("FAILED", listed.get("state").asText());
    assertEquals(failed.get("failure").asText(), listed.get("failure").asText());
    JsonNode decided = awaitState("N-1", "DECIDED");
    assertEquals(1, decided.get("attempts").asInt());
    assertTrue(decided.get("failure") == null, decided.toString());
    Reply health = http.get("/actuator/health", Caller.NOBODY);
    assertEquals(200, health.status(), health.raw().body());
    assertEquals("UP", health.json().get("status").asText());
  }

  @Test
  void theDecisionEndpointAnswersWithAProblemDetailAndNoTrace() {
    Reply r = http.post("/api/v1/decisions", Map.of("question", HOSTILE), Caller.QUEUE);
    assertEquals(422, r.status(), r.raw().body());
    assertEquals("application/problem+json", r.header("Content-Type"));
    assertEquals("Question cannot be decided", r.json().get("title").asText());
    assertTrue(r.json().get("detail").asText().contains("a person must answer it"));
    assertTrue(r.raw().body().length() < 1000, r.raw().body());
    assertFalse(r.raw().body().contains("java."), r.raw().body());
    // The service goes on answering.
    assertEquals(200, http.post("/api/v1/decisions", Map.of("question", "When is my bin day?"),
        Caller.QUEUE).status());
  }

  @Test
  void healthIsDownWhileTheWorkerIsNotRunning() {
    QueueWorker worker = service.bean(QueueWorker.class);
    worker.stop();
    try {
      Reply down = http.get("/actuator/health", Caller.MANAGER);
      assertEquals(503, down.status(), down.raw().body());
      assertEquals("DOWN", down.json().get("status").asText());
      assertEquals("DOWN", down.json().get("components").get("queue").get("status").asText());
    } finally {
      worker.start();
    }
    Reply up = http.get("/actuator/health", Caller.MANAGER);
    assertEquals(200, up.status(), up.raw().body());
    assertEquals("UP", up.json().get("components").get("queue").get("status").asText());
  }

  @Test
  void everyStateHasItsGauge() throws Exception {
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "G-1", "question",
        "Can I get a bigger recycling box?"), Caller.QUEUE).status());
    awaitState("G-1", "DECIDED");
    Set<String> states = new HashSet<>();
    for (TicketState s : TicketState.values()) {
      String tag = s.name().toLowerCase(java.util.Locale.ROOT);
      Reply r = http.get("/actuator/metrics/precedent.queue.tickets?tag=state:" + tag,
          Caller.MANAGER);
      assertEquals(200, r.status(), r.raw().body());
      double value = r.json().get("measurements").get(0).get("value").asDouble();
      long stored = service.bean(org.springframework.jdbc.core.JdbcTemplate.class).queryForObject(
          "SELECT COUNT(*) FROM queue_ticket WHERE status = ?", Long.class, s.name());
      assertEquals(stored, (long) value, tag);
      states.add(tag);
    }
    assertEquals(Set.of("queued", "deciding", "decided", "failed"), states);
    Reply decided = http.get("/actuator/metrics/precedent.queue.tickets?tag=state:decided",
        Caller.MANAGER);
    assertTrue(decided.json().get("measurements").get(0).get("value").asDouble() >= 1);
  }
}
