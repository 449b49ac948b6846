package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;
import org.springframework.jdbc.core.JdbcTemplate;

/** The ticket queue: stored before acknowledged, decided once, resubmission idempotent. */
class QueueServiceTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass("--precedent.queue.poll-ms=100");

  private static Http http() {
    return service.http();
  }

  static JsonNode decided(String id) throws InterruptedException {
    for (int i = 0; i < 600; i++) {
      Reply r = http().get("/api/v1/queue/tickets/" + id, Caller.QUEUE);
      assertEquals(200, r.status(), r.raw().body());
      if (r.json().get("status").asText().equals("DECIDED")) {
        return r.json();
      }
      Thread.sleep(50);
    }
    throw new AssertionError("ticket " + id + " was not decided within 30 s");
  }

  @Test
  void aSubmittedTicketIsStoredRedactedThenDecided() throws Exception {
    Reply r = http().post("/api/v1/queue/tickets", Map.of("ticketId", "Q-1", "question",
        "My bin was not collected, call me on 07700 900123", "category", "waste"), Caller.QUEUE);
    assertEquals(202, r.status(), r.raw().body());
    assertEquals("/api/v1/queue/tickets/Q-1", r.header("Location"));
    String stored = service.bean(JdbcTemplate.class).queryForObject(
        "SELECT question FROM queue_ticket WHERE ticket_id = 'Q-1'", String.class);
    assertFalse(stored.contains("07700"), stored);
    assertTrue(stored.contains("[PHONE]"), stored);
    JsonNode t = decided("Q-1");
    assertEquals("waste", t.get("category").asText());
    assertTrue(Set.of("REPLY", "HAND_OFF").contains(t.get("decision").get("outcome").asText()));
    assertFalse(t.get("decision").get("candidates").isEmpty());
  }

  @Test
  void aResubmissionReturnsTheFirstDecision() throws Exception {
    Map<String, String> ticket = Map.of("ticketId", "Q-2", "question", "How do I read my meter?");
    assertEquals(202, http().post("/api/v1/queue/tickets", ticket, Caller.QUEUE).status());
    JsonNode first = decided("Q-2");
    Reply again = http().post("/api/v1/queue/tickets", ticket, Caller.QUEUE);
    assertEquals(200, again.status());
    assertEquals(first.get("decidedAt").asText(), again.json().get("decidedAt").asText());
    assertEquals(first.get("decision"), again.json().get("decision"));
  }

  @Test
  void theSameIdWithAnotherQuestionIsAConflict() {
    assertEquals(202, http().post("/api/v1/queue/tickets", Map.of("ticketId", "Q-3",
        "question", "Missed bin collection"), Caller.QUEUE).status());
    Reply r = http().post("/api/v1/queue/tickets", Map.of("ticketId", "Q-3",
        "question", "Something else entirely"), Caller.QUEUE);
    assertEquals(409, r.status());
    assertTrue(r.json().get("detail").asText().contains("Q-3"));
  }

  @Test
  void concurrentSubmissionsOfOneIdStoreAndDecideItOnce() throws Exception {
    Map<String, String> ticket = Map.of("ticketId", "Q-4", "question", "Where do I pay my bill?");
    ExecutorService pool = Executors.newFixedThreadPool(8);
    List<Future<Integer>> statuses = new ArrayList<>();
    for (int i = 0; i < 16; i++) {
      statuses.add(pool.submit(() -> http().post("/api/v1/queue/tickets", ticket, Caller.QUEUE)
          .status()));
    }
    int accepted = 0;
    for (Future<Integer> f : statuses) {
      int s = f.get();
      assertTrue(s == 202 || s == 200, "status " + s);
      accepted += s == 202 ? 1 : 0;
    }
    pool.shutdown();
    assertEquals(1, accepted, "exactly one submission creates the ticket");
    decided("Q-4");
    JdbcTemplate db = service.bean(JdbcTemplate.class);
    assertEquals(1, db.queryForObject("SELECT COUNT(*) FROM queue_ticket WHERE ticket_id = 'Q-4'",
        Integer.class));
    assertEquals(1, db.queryForObject(
        "SELECT COUNT(*) FROM ticket_decision WHERE ticket_id = 'Q-4'", Integer.class));
  }

  /** Ten thousand characters of apostrophe-joined letters: one long word, decided as any other. */
  @Test
  void aTicketOfApostropheJoinedLettersIsDecidedAndTheNextOneToo() throws Exception {
    String hostile = "my bin was not emptied " + "a'".repeat(5000);
    assertEquals(202, http().post("/api/v1/queue/tickets", Map.of("ticketId", "Q-5", "question",
        hostile), Caller.QUEUE).status());
    assertEquals(202, http().post("/api/v1/queue/tickets", Map.of("ticketId", "Q-6", "question",
        "Where do I pay my bill?"), Caller.QUEUE).status());
    assertEquals(1, decided("Q-5").get("attempts").asInt());
    decided("Q-6");
    Reply direct = http().post("/api/v1/decisions", Map.of("question", hostile), Caller.QUEUE);
    assertEquals(200, direct.status(), direct.raw().body());
  }

  @Test
  void anUnknownTicketIs404AndABadIdIsAFieldError() {
    Reply missing = http().get("/api/v1/queue/tickets/NOPE-9", Caller.AGENT);
    assertEquals(404, missing.status());
    assertTrue(missing.json().get("detail").asText().contains("NOPE-9"));
    Reply bad = http().post("/api/v1/queue/tickets", Map.of("ticketId", "a b/c", "question", "x"),
        Caller.QUEUE);
    assertEquals(400, bad.status());
    assertEquals("ticketId", bad.json().get("errors").get(0).get("field").asText());
  }

  /** The list agents read: newest first, paged, filtered by state, reason and text; agents only. */
  @Test
  void agentsListTheQueueNewestFirstFilteredAndPaged() throws Exception {
    for (int i = 1; i <= 3; i++) {
      assertEquals(202, http().post("/api/v1/queue/tickets", Map.of("ticketId", "L-" + i,
          "question", "Where do I pay my bill, listwordqx " + i + "?"), Caller.QUEUE).status());
    }
    String reason = null;
    for (int i = 1; i <= 3; i++) {
      JsonNode d = decided("L-" + i).get("decision");
      reason = d.get("outcome").asText().equals("HAND_OFF") ? d.get("reason").asText() : reason;
    }
    Reply all = http().get("/api/v1/queue/tickets?search=LISTWORDQX", Caller.AGENT);
    assertEquals(200, all.status(), all.raw().body());
    assertEquals(3, all.json().get("total").asInt());
    List<String> ids = new ArrayList<>();
    all.json().get("tickets").forEach(t -> ids.add(t.get("ticketId").asText()));
    assertEquals(List.of("L-3", "L-2", "L-1"), ids);
    JsonNode first = all.json().get("tickets").get(0);
    assertTrue(Set.of("REPLIED", "HANDED_OFF").contains(first.get("state").asText()));
    assertTrue(first.get("confidence").isNumber() && first.get("threshold").isNumber(),
        first.toString());
    Reply second = http().get("/api/v1/queue/tickets?search=listwordqx&size=2&page=2",
        Caller.MANAGER);
    assertEquals(200, second.status());
    assertEquals(3, second.json().get("total").asInt());
    assertEquals(1, second.json().get("tickets").size());
    assertEquals("L-1", second.json().get("tickets").get(0).get("ticketId").asText());
    // Nothing is approved in the library, so the queue hands every ticket off (api.answers).
    assertTrue(reason != null, "no hand-off among the three");
    {
      Reply byReason = http().get("/api/v1/queue/tickets?search=listwordqx&state=handed_off"
          + "&reason=" + reason, Caller.AGENT);
      assertFalse(byReason.json().get("tickets").isEmpty());
      byReason.json().get("tickets").forEach(t -> {
        assertEquals("HANDED_OFF", t.get("state").asText());
        assertEquals(http().get("/api/v1/queue/tickets/" + t.get("ticketId").asText(),
            Caller.AGENT).json().get("decision").get("reason").asText(), t.get("reason").asText());
      });
    }
    assertEquals(0, http().get("/api/v1/queue/tickets?search=listwordqx&state=failed",
        Caller.AGENT).json().get("total").asInt());
    // The wild cards of LIKE are searched as typed characters.
    assertEquals(0, http().get("/api/v1/queue/tickets?search=listword%25", Caller.AGENT).json()
        .get("total").asInt());
    assertEquals(403, http().get("/api/v1/queue/tickets", Caller.QUEUE).status());
    assertEquals(401, http().get("/api/v1/queue/tickets", Caller.NOBODY).status());
    for (String[] bad : new String[][] {{"state=lost", "state"}, {"reason=tired", "reason"},
        {"size=0", "size"}, {"size=101", "size"}, {"page=x", "page"},
        {"search=" + "a".repeat(201), "search"}}) {
      Reply r = http().get("/api/v1/queue/tickets?" + bad[0], Caller.AGENT);
      assertEquals(400, r.status(), bad[0]);
      assertEquals("application/problem+json", r.header("Content-Type"));
      assertEquals(bad[1], r.json().get("errors").get(0).get("field").asText(), bad[0]);
    }
    JsonNode paths = http().get("/api/v1/openapi", Caller.NOBODY).json().get("paths");
    assertTrue(paths.get("/api/v1/queue/tickets").has("get"), paths.toString());
  }
}
