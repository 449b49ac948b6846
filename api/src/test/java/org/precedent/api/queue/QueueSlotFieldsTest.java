package org.precedent.api.queue;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.InForce;
import org.precedent.engine.decide.Thresholds;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Slots;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * A queued ticket whose best answer has a slot the data directory maps to one of the ticket's
 * fields is replied to with the slot filled; without the field it is handed off as before. On the
 * demo's trained data: its collection-day answer's replies differ in the day alone.
 */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class QueueSlotFieldsTest {
  static RunningService service;
  static Http http;
  static AnswerGroup dayAnswer;
  static String question;

  @BeforeAll
  static void start() throws IOException {
    Path data = TrainedData.copy();
    DataDir dir = new DataDir(data);
    Knowledge knowledge = Knowledge.open(dir).orElseThrow();
    dayAnswer = knowledge.grouping().groups().stream()
        .filter(g -> Slots.names(g.template()).equals(List.of("day"))).findFirst()
        .orElseThrow(() -> new AssertionError("no answer with a day slot alone"));
    question = knowledge.tickets().get(dayAnswer.ticketIds().get(0)).question();
    Files.writeString(dir.slotFields(), "# the ticket system sends the customer's day\n"
        + "day = collection_day\n");
    // Every confidence replies, and drafted answers are sent: what is measured is the slot.
    InForce.writeThresholds(dir, Thresholds.global(0));
    service = RunningService.startOn(data, "--precedent.queue.poll-ms=100",
        "--precedent.answers.approval-required=false");
    http = service.http();
  }

  @AfterAll
  static void stop() {
    if (service != null) {
      service.close();
    }
  }

  private static JsonNode decided(String id) throws InterruptedException {
    for (int i = 0; i < 600; i++) {
      JsonNode t = http.get("/api/v1/queue/tickets/" + id, Caller.QUEUE).json();
      if (t.get("status").asText().equals("DECIDED")) {
        return t.get("decision");
      }
      Thread.sleep(50);
    }
    throw new AssertionError("ticket " + id + " was not decided within 30 s");
  }

  @Test
  @Order(1)
  void theDayComesFromTheTicketsFieldOrAPersonFillsItIn() throws Exception {
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "S-1", "question",
        question, "fields", Map.of("collection_day", "Thursday")), Caller.QUEUE).status());
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "S-2", "question",
        question), Caller.QUEUE).status());
    JsonNode filled = decided("S-1");
    assertEquals(dayAnswer.id(), filled.get("answerGroup").asText(), filled.toString());
    assertEquals("REPLY", filled.get("outcome").asText(), filled.toString());
    assertEquals(dayAnswer.template().replace(Slots.OPEN + "day" + Slots.CLOSE, "Thursday"),
        filled.get("reply").asText());
    assertTrue(filled.get("explanation").asText().contains("slots filled from the ticket's"),
        filled.get("explanation").asText());
    JsonNode without = decided("S-2");
    assertEquals("HAND_OFF", without.get("outcome").asText());
    assertEquals("needs_customer_details", without.get("reason").asText());
  }

  /** The library's approved text, edited by a manager, has its slot filled the same way. */
  @Test
  @Order(2) // after the group's own text was sent
  void anApprovedTextsSlotIsFilledFromTheTicketToo() throws Exception {
    String id = dayAnswer.id();
    int version = http.get("/api/v1/answers/" + id, Caller.AGENT).json().get("answer")
        .get("version").asInt();
    Reply edit = http.put("/api/v1/answers/" + id, Map.of("version", version, "title",
        "Collection day", "text", "Collection day: " + Slots.OPEN + "day" + Slots.CLOSE
            + ". Bins out by 6:30am.", "reason", "shorter"), Caller.MANAGER);
    assertEquals(200, edit.status(), edit.raw().body());
    assertEquals(200, http.post("/api/v1/answers/" + id + "/approval", Map.of("version",
        version + 1, "reason", "checked"), Caller.MANAGER).status());
    assertEquals(202, http.post("/api/v1/queue/tickets", Map.of("ticketId", "S-5", "question",
        question, "fields", Map.of("collection_day", "Monday")), Caller.QUEUE).status());
    JsonNode d = decided("S-5");
    assertEquals("REPLY", d.get("outcome").asText(), d.toString());
    assertEquals("Collection day: Monday. Bins out by 6:30am.", d.get("reply").asText());
  }

  @Test
  void aBadFieldIsAFieldProblem() {
    Reply badName = http.post("/api/v1/queue/tickets", Map.of("ticketId", "S-3", "question",
        question, "fields", Map.of("collection day", "Thursday")), Caller.QUEUE);
    assertEquals(400, badName.status());
    assertEquals("fields", badName.json().get("errors").get(0).get("field").asText());
    Reply tooLong = http.post("/api/v1/queue/tickets", Map.of("ticketId", "S-4", "question",
        question, "fields", Map.of("collection_day", "x".repeat(1001))), Caller.QUEUE);
    assertEquals(400, tooLong.status());
    assertEquals("fields.collection_day", tooLong.json().get("errors").get(0).get("field")
        .asText());
  }
}
