package org.precedent.api.answers;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;

/** The library over HTTP, and its gate on what the queue sends, on the demo's trained service. */
class AnswersServiceTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass("--precedent.queue.poll-ms=100");

  private static Http http() {
    return service.http();
  }

  private static JsonNode answers() {
    Reply r = http().get("/api/v1/answers", Caller.AGENT);
    assertEquals(200, r.status(), r.raw().body());
    return r.json().get("answers");
  }

  private static JsonNode one(String id) {
    return http().get("/api/v1/answers/" + id, Caller.AGENT).json().get("answer");
  }

  @Test
  void everyGroupIsADraftThatAgentsReadAndOnlyManagersChange() {
    JsonNode all = answers();
    assertTrue(all.size() > 10, all.toString());
    JsonNode first = all.get(0);
    assertEquals("DRAFTED", first.get("state").asText());
    assertFalse(first.get("sources").isEmpty());
    String id = first.get("groupId").asText();
    Reply agentEdit = http().put("/api/v1/answers/" + id, Map.of("version", 1, "title", "t",
        "text", "x", "reason", "r"), Caller.AGENT);
    assertEquals(403, agentEdit.status());
    assertEquals("application/problem+json", agentEdit.header("Content-Type"));
    assertEquals(403, http().post("/api/v1/answers/" + id + "/approval",
        Map.of("version", 1, "reason", "r"), Caller.QUEUE).status());
    assertEquals(401, http().get("/api/v1/answers", Caller.NOBODY).status());
    JsonNode paths = http().get("/api/v1/openapi", Caller.NOBODY).json().get("paths");
    assertTrue(paths.has("/api/v1/answers/{id}") && paths.has("/api/v1/answers/{id}/approval"),
        paths.toString());
  }

  @Test
  void hostilePathsAreProblemsThatChangeNothing() {
    JsonNode a = answers().get(1);
    String id = a.get("groupId").asText();
    int version = a.get("version").asInt();
    Reply unknown = http().put("/api/v1/answers/a-nothing", Map.of("version", 1, "title", "t",
        "text", "x", "reason", "r"), Caller.MANAGER);
    assertEquals(404, unknown.status());
    assertEquals("application/problem+json", unknown.header("Content-Type"));
    Reply noReason = http().post("/api/v1/answers/" + id + "/approval",
        Map.of("version", version, "reason", "  "), Caller.MANAGER);
    assertEquals(400, noReason.status());
    assertEquals("reason", noReason.json().get("errors").get(0).get("field").asText());
    Reply stale = http().post("/api/v1/answers/" + id + "/retirement",
        Map.of("version", version + 5, "reason", "old page"), Caller.MANAGER);
    assertEquals(409, stale.status());
    assertTrue(stale.json().get("detail").asText().contains("version " + version), stale.json()
        .toString());
    Reply control = http().put("/api/v1/answers/" + id, Map.of("version", version, "title", "t",
        "text", "pay here\u202Eereh yap", "reason", "r"), Caller.MANAGER);
    assertEquals(400, control.status());
    assertEquals("text", control.json().get("errors").get(0).get("field").asText());
    assertEquals(400, http().get("/api/v1/answers?state=lost", Caller.AGENT).status());
    assertEquals(version, one(id).get("version").asInt());
  }

  @Test
  void markupIsKeptAsTextAndEveryChangeIsAudited() {
    JsonNode a = answers().get(2);
    String id = a.get("groupId").asText();
    String hostile = "<script>alert(1)</script><img src=x onerror=alert(2)> & more";
    Reply edit = http().put("/api/v1/answers/" + id, Map.of("version", a.get("version").asInt(),
        "title", "<b>bold</b>", "text", hostile, "reason", "testing markup"), Caller.MANAGER);
    assertEquals(200, edit.status(), edit.raw().body());
    JsonNode got = http().get("/api/v1/answers/" + id, Caller.AGENT).json();
    assertEquals(hostile, got.get("answer").get("text").asText());
    JsonNode change = got.get("changes").get(0);
    assertEquals("EDITED", change.get("action").asText());
    assertEquals("manager-key", change.get("changedBy").asText());
    assertEquals(a.get("text").asText(), change.get("oldText").asText());
    assertEquals(hostile, change.get("newText").asText());
    assertEquals("testing markup", change.get("reason").asText());
  }

  /** A question of the demo data whose best answer the pipeline sends at threshold 0. */
  private static String[] replied() throws Exception {
    Path tickets;
    try (Stream<Path> s = Files.walk(service.data().resolve("knowledge"))) {
      tickets = s.filter(p -> p.getFileName().toString().equals("tickets.jsonl")).findFirst()
          .orElseThrow();
    }
    Map<String, String> questions = new HashMap<>();
    for (String line : Files.readAllLines(tickets)) {
      JsonNode t = Http.JSON.readTree(line);
      questions.put(t.get("id").asText(), t.get("question").asText());
    }
    for (JsonNode a : answers()) {
      if (!a.get("slots").isEmpty() || a.get("text").asText().contains("[")) {
        continue;
      }
      for (JsonNode source : a.get("sources")) {
        String q = questions.get(source.asText());
        JsonNode d = http().post("/api/v1/decisions", Map.of("question", q), Caller.AGENT).json();
        if (d.get("outcome").asText().equals("REPLY")) {
          return new String[] {q, d.get("answerGroup").asText()};
        }
      }
    }
    throw new AssertionError("no demo question replied at threshold 0");
  }

  private static JsonNode queued(String ticket, String question) throws Exception {
    assertEquals(202, http().post("/api/v1/queue/tickets", Map.of("ticketId", ticket,
        "question", question), Caller.QUEUE).status());
    for (int i = 0; i < 600; i++) {
      JsonNode t = http().get("/api/v1/queue/tickets/" + ticket, Caller.QUEUE).json();
      if (t.get("status").asText().equals("DECIDED")) {
        return t.get("decision");
      }
      Thread.sleep(50);
    }
    throw new AssertionError(ticket + " not decided");
  }

  @Test
  void theQueueSendsOnlyApprovedAnswersInTheirApprovedTextAndNeverRetiredOnes()
      throws Exception {
    assertEquals(200, http().put("/api/v1/threshold", Map.of("global", 0.0, "reason",
        "every confident answer replies, to test the library's gate"), Caller.MANAGER).status());
    String[] qa = replied();
    String question = qa[0];
    String id = qa[1];

    JsonNode drafted = queued("L-1", question);
    assertEquals("HAND_OFF", drafted.get("outcome").asText());
    assertEquals("answer_not_approved", drafted.get("reason").asText());
    assertNotNull(drafted.get("why").get("parts").get(0).get("detail"));

    int version = one(id).get("version").asInt();
    String text = "Thank you for asking. " + one(id).get("text").asText();
    assertEquals(200, http().put("/api/v1/answers/" + id, Map.of("version", version, "title",
        "Checked answer", "text", text, "reason", "warmer opening"), Caller.MANAGER).status());
    assertEquals(200, http().post("/api/v1/answers/" + id + "/approval", Map.of("version",
        version + 1, "reason", "checked"), Caller.MANAGER).status());
    JsonNode approved = queued("L-2", question);
    assertEquals("REPLY", approved.get("outcome").asText(), approved.toString());
    assertEquals(text, approved.get("reply").asText());
    assertEquals(1, one(id).get("uses").asInt());

    assertEquals(200, http().post("/api/v1/answers/" + id + "/retirement", Map.of("version",
        version + 2, "reason", "policy changed"), Caller.MANAGER).status());
    JsonNode retired = queued("L-3", question);
    assertEquals("answer_retired", retired.get("reason").asText());
    assertEquals(List.of("RETIRED", "APPROVED", "EDITED", "CREATED"),
        http().get("/api/v1/answers/" + id, Caller.AGENT).json().get("changes").findValues(
            "action").stream().map(JsonNode::asText).toList());
  }

  @Test
  void agentsFeedbackLandsOnTheAnswersCounts() {
    JsonNode a = answers().get(3);
    String id = a.get("groupId").asText();
    for (String verdict : List.of("ACCEPTED", "ACCEPTED", "REJECTED")) {
      assertEquals(201, http().post("/api/v1/feedback", Map.of("question", "q", "answerGroup", id,
          "verdict", verdict), Caller.AGENT).status());
    }
    assertEquals(201, http().post("/api/v1/feedback", Map.of("question", "q", "answerGroup", id,
        "verdict", "EDITED", "finalText", "My own words <i>here</i>"), Caller.AGENT).status());
    JsonNode got = http().get("/api/v1/answers/" + id, Caller.AGENT).json();
    assertEquals(2, got.get("answer").get("accepted").asInt());
    assertEquals(1, got.get("answer").get("editedByAgents").asInt());
    assertEquals(1, got.get("answer").get("rejected").asInt());
    assertEquals("My own words <i>here</i>", got.get("recentEdits").get(0).get("text").asText());
  }
}
