package org.precedent.api.suggest;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;

/** Suggestions, decisions and feedback over HTTP, on a real server and a real trained model. */
class SuggestServiceTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  private static Http http() {
    return service.http();
  }

  @Test
  void suggestionsRankAnswersWithEvidenceAndMatchedSpans() {
    Reply r = http().post("/api/v1/suggestions", Map.of("question",
        "My green bin was not emptied this week, can someone come back?", "limit", 4),
        Caller.AGENT);
    assertEquals(200, r.status(), r.raw().body());
    JsonNode s = r.json();
    assertEquals("v-0001", s.get("modelVersion").asText());
    JsonNode candidates = s.get("candidates");
    assertTrue(candidates.size() >= 1 && candidates.size() <= 4, s.toString());
    assertEquals(1, candidates.get(0).get("rank").asInt());
    assertEquals(candidates.get(0).get("answerGroup").asText(), s.get("answerGroup").asText());
    JsonNode evidence = candidates.get(0).get("evidence");
    assertTrue(evidence.size() >= 1);
    int spans = 0;
    for (JsonNode e : evidence) {
      String q = e.get("question").asText();
      for (JsonNode span : e.get("spans")) {
        int start = span.get("start").asInt();
        int end = span.get("end").asInt();
        assertTrue(0 <= start && start < end && end <= q.length(), span.toString());
        // The span covers the shared word; the term is its stem, so the span starts with it.
        String word = q.substring(start, end).toLowerCase(java.util.Locale.ROOT);
        String term = span.get("term").asText();
        assertTrue(word.startsWith(term.substring(0, Math.min(3, term.length()))),
            word + " vs " + term);
        spans++;
      }
    }
    assertTrue(spans > 0, "the best answer's evidence shares words with the question");
    double confidence = s.get("confidence").asDouble();
    assertTrue(confidence >= 0 && confidence <= 1);
  }

  @Test
  void aSafetyQuestionIsHandedOffWithACaution() {
    Reply r = http().post("/api/v1/decisions", Map.of("question",
        "The water from my kitchen tap is brown. Is it safe to drink?"), Caller.QUEUE);
    assertEquals(200, r.status(), r.raw().body());
    assertEquals("HAND_OFF", r.json().get("outcome").asText());
    assertEquals("safety_rule", r.json().get("reason").asText());
    assertFalse(r.json().get("caution").asText().isBlank());
    assertTrue(r.json().get("reply") == null, "a hand-off carries no automatic reply");
    // The explanation comes as a sentence and as the tree it is the root of.
    var why = r.json().get("why");
    assertEquals(r.json().get("explanation").asText(), why.get("detail").asText());
    assertEquals("safety rule", why.get("parts").get(0).get("name").asText());
    var confidence = why.get("parts").get(1);
    assertEquals("confidence", confidence.get("name").asText());
    assertEquals(r.json().get("confidence").asDouble(), confidence.get("value").asDouble(), 1e-12);
    assertEquals("logit", confidence.get("parts").get(0).get("name").asText());
  }

  @Test
  void personalDataInTheQuestionIsRedactedInTheAnswer() {
    Reply r = http().post("/api/v1/decisions", Map.of("question",
        "Bill query from jo.bloggs@example.org about my meter reading"), Caller.AGENT);
    assertEquals(200, r.status());
    String q = r.json().get("question").asText();
    assertFalse(q.contains("jo.bloggs"), q);
    assertTrue(q.contains("[EMAIL]"), q);
  }

  @Test
  void anEmptyQuestionIsAFieldError() {
    Reply r = http().post("/api/v1/suggestions", Map.of("question", "  "), Caller.AGENT);
    assertEquals(400, r.status());
    assertEquals("application/problem+json", r.header("Content-Type"));
    assertEquals("question", r.json().get("errors").get(0).get("field").asText());
  }

  @Test
  void aQuestionOverTheLengthLimitIsAFieldError() {
    Reply r = http().post("/api/v1/decisions", Map.of("question", "a".repeat(20_001)),
        Caller.AGENT);
    assertEquals(400, r.status());
    JsonNode error = r.json().get("errors").get(0);
    assertEquals("question", error.get("field").asText());
    assertTrue(error.get("message").asText().contains("20000"), error.toString());
  }

  @Test
  void aLimitOutOfRangeIsAFieldError() {
    Reply r = http().post("/api/v1/suggestions", Map.of("question", "bin", "limit", 0),
        Caller.AGENT);
    assertEquals(400, r.status());
    assertEquals("limit", r.json().get("errors").get(0).get("field").asText());
  }

  @Test
  void brokenJsonSaysWhere() {
    Reply r = http().post("/api/v1/decisions", "{\"question\": \"bin\",\n \"limit\": }",
        Caller.AGENT);
    assertEquals(400, r.status());
    assertTrue(r.json().get("detail").asText().contains("line 2"), r.json().toString());
  }

  @Test
  void aWrongTypeNamesTheField() {
    Reply r = http().post("/api/v1/decisions", "{\"question\": \"bin\", \"limit\": \"many\"}",
        Caller.AGENT);
    assertEquals(400, r.status());
    assertEquals("limit", r.json().get("errors").get(0).get("field").asText());
  }

  @Test
  void aBodyOverTheSizeLimitIs413() {
    Reply r = http().post("/api/v1/decisions", Map.of("question", "x".repeat(300_000)),
        Caller.AGENT);
    assertEquals(413, r.status());
    assertNotNull(r.json().get("detail"));
  }

  @Test
  void feedbackIsRecordedAndAnEditNeedsItsText() {
    Reply accepted = http().post("/api/v1/feedback", Map.of("question", "bin not emptied",
        "answerGroup", "g-1", "verdict", "ACCEPTED"), Caller.AGENT);
    assertEquals(201, accepted.status(), accepted.raw().body());
    assertTrue(accepted.json().get("id").asLong() > 0);
    Reply edited = http().post("/api/v1/feedback", Map.of("question", "bin not emptied",
        "answerGroup", "g-1", "verdict", "EDITED"), Caller.AGENT);
    assertEquals(400, edited.status());
    assertEquals("finalText", edited.json().get("errors").get(0).get("field").asText());
    Reply unknown = http().post("/api/v1/feedback", Map.of("question", "bin not emptied",
        "answerGroup", "g-1", "verdict", "MAYBE"), Caller.AGENT);
    assertEquals(400, unknown.status());
    assertEquals("verdict", unknown.json().get("errors").get(0).get("field").asText());
  }

  @Test
  void healthAndTheApiDescriptionAreOpen() {
    Reply health = http().get("/actuator/health", Caller.NOBODY);
    assertEquals(200, health.status());
    assertEquals("UP", health.json().get("status").asText());
    Reply api = http().get("/api/v1/openapi", Caller.NOBODY);
    assertEquals(200, api.status());
    assertTrue(api.json().get("paths").has("/api/v1/suggestions"));
  }

  @Test
  void decisionsAreCountedInTheMetrics() {
    http().post("/api/v1/decisions", Map.of("question", "meter reading"), Caller.AGENT);
    Reply m = http().get("/actuator/metrics/precedent.decisions", Caller.MANAGER);
    assertEquals(200, m.status(), m.raw().body());
    assertTrue(m.json().get("measurements").get(0).get("value").asDouble() >= 1);
  }
}
