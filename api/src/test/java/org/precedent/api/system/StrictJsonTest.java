package org.precedent.api.system;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;

/**
 * Every JSON endpoint reads its body strictly: a field given twice, anything after the object,
 * a number or true/false where text belongs, and a field the request does not have are each
 * refused with a 400 that names the field, in words that name no class of the service.
 */
class StrictJsonTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  private static Http http() {
    return service.http();
  }

  /**
   * An endpoint with a body it would accept, one of its text fields, and a misspelling of one of
   * its fields (as a client might send it).
   */
  record Endpoint(String method, String path, Caller caller, Map<String, Object> body,
      String textField, String misspelt) {
    @Override
    public String toString() {
      return method + " " + path;
    }

    Map<String, Object> with(String field, Object value) {
      Map<String, Object> copy = new LinkedHashMap<>(body);
      copy.put(field, value);
      return copy;
    }

    String json() {
      return write(body);
    }
  }

  static Stream<Endpoint> endpoints() {
    Map<String, Object> question = ordered("question", "My green bin was not emptied this week",
        "category", "bins", "limit", 2);
    return Stream.of(
        new Endpoint("POST", "/api/v1/suggestions", Caller.AGENT, question, "question",
            "categroy"),
        new Endpoint("POST", "/api/v1/decisions", Caller.QUEUE, question, "question", "categroy"),
        new Endpoint("POST", "/api/v1/queue/tickets", Caller.QUEUE, ordered("ticketId",
            "T-strict-1", "question", "My green bin was not emptied", "category", "bins"),
            "ticketId", "ticketID"),
        new Endpoint("POST", "/api/v1/feedback", Caller.AGENT, ordered("question",
            "My green bin was not emptied", "answerGroup", "g-1", "verdict", "ACCEPTED"),
            "answerGroup", "answer_group"),
        new Endpoint("PUT", "/api/v1/threshold", Caller.MANAGER, ordered("global", 0.9,
            "perCategory", Map.of("bins", 0.95), "reason", "stricter for bins"), "reason",
            "percategory"),
        new Endpoint("POST", "/api/v1/models/v-0001/activation", Caller.MANAGER,
            ordered("reason", "back to the first"), "reason", "reasons"),
        new Endpoint("POST", "/api/v1/models/rollback", Caller.MANAGER,
            ordered("reason", "back to the one before"), "reason", "raeson"));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void aFieldGivenTwiceIsRefused(Endpoint e) {
    // The first value would be silently replaced by the second: a question swapped in one body.
    String body = "{\"" + e.textField() + "\": \"the first one\", " + e.json().substring(1);
    Reply r = http().send(e.method(), e.path(), body, e.caller());
    assertFieldError(r, e.textField(), "twice");
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void anythingAfterTheObjectIsRefused(Endpoint e) {
    for (String tail : List.of(" {\"" + e.textField() + "\": \"another\"}", " trailing", " 7")) {
      Reply r = http().send(e.method(), e.path(), e.json() + tail, e.caller());
      assertProblem(r, e + " with" + tail);
      assertTrue(r.json().get("detail").asText().contains("line 1"), r.raw().body());
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void aNumberOrBooleanWhereTextBelongsIsRefused(Endpoint e) {
    for (Object notText : List.of(42, 4.5, true, false)) {
      Reply r = http().send(e.method(), e.path(), write(e.with(e.textField(), notText)),
          e.caller());
      assertFieldError(r, e.textField(), "text");
    }
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("endpoints")
  void aFieldTheRequestDoesNotHaveIsRefused(Endpoint e) {
    Reply r = http().send(e.method(), e.path(), write(e.with(e.misspelt(), "bins")), e.caller());
    JsonNode error = assertFieldError(r, e.misspelt(), "not a field");
    // The message lists the fields there are, so the client sees what was meant.
    for (String field : e.body().keySet()) {
      assertTrue(error.get("message").asText().contains(field), error.toString());
    }
  }

  @Test
  void textOrAFractionWhereAWholeNumberBelongsIsRefused() {
    for (Object notWhole : List.of("2", 2.5, true)) {
      Reply r = http().post("/api/v1/suggestions", Map.of("question", "bin", "limit", notWhole),
          Caller.AGENT);
      assertFieldError(r, "limit", "whole number");
    }
  }

  @Test
  void textWhereANumberBelongsIsRefused() {
    Reply r = http().put("/api/v1/threshold", Map.of("global", "0.9", "reason", "as text"),
        Caller.MANAGER);
    assertFieldError(r, "global", "number");
    r = http().put("/api/v1/threshold", Map.of("global", 0.9, "perCategory", Map.of("bins", "1"),
        "reason", "as text"), Caller.MANAGER);
    assertFieldError(r, "perCategory.bins", "number");
  }

  @Test
  void aFieldGivenTwiceInsideAnObjectIsNamedWithItsPath() {
    Reply r = http().put("/api/v1/threshold", "{\"global\": 0.9, \"perCategory\": {\"bins\": 0.95, "
        + "\"bins\": 0.1}, \"reason\": \"twice\"}", Caller.MANAGER);
    assertFieldError(r, "perCategory.bins", "twice");
  }

  @Test
  void aVerdictMustBeOneOfItsNamesNotANumber() {
    for (Object verdict : List.of(0, "MAYBE", true)) {
      Reply r = http().post("/api/v1/feedback", Map.of("question", "bin", "answerGroup", "g-1",
          "verdict", verdict), Caller.AGENT);
      JsonNode error = assertFieldError(r, "verdict", "one of");
      assertTrue(error.get("message").asText().contains("ACCEPTED, EDITED, REJECTED"),
          error.toString());
    }
  }

  @Test
  void aBodyThatIsNotAnObjectSaysSo() {
    for (String body : List.of("[]", "\"bin\"", "42")) {
      Reply r = http().send("POST", "/api/v1/decisions", body, Caller.AGENT);
      assertProblem(r, body);
      assertTrue(r.json().get("detail").asText().contains("JSON object"), r.raw().body());
    }
  }

  private static JsonNode assertFieldError(Reply r, String field, String says) {
    assertProblem(r, field);
    JsonNode errors = r.json().get("errors");
    assertTrue(errors != null && errors.size() == 1, r.raw().body());
    JsonNode error = errors.get(0);
    assertEquals(field, error.get("field").asText(), r.raw().body());
    assertTrue(error.get("message").asText().contains(says), r.raw().body());
    assertTrue(r.json().get("detail").asText().startsWith(field + ": "), r.raw().body());
    return error;
  }

  /** A 400 problem detail whose words name no Java type. */
  private static void assertProblem(Reply r, String what) {
    assertEquals(400, r.status(), what + ": " + r.raw().body());
    assertEquals("application/problem+json", r.header("Content-Type"), what);
    String body = r.raw().body();
    for (String internal : List.of("org.precedent", "java.", "com.fasterxml", "jackson",
        "Jackson", "QuestionRequest", "SubmitRequest", "FeedbackRequest", "ThresholdChange",
        "ActivationRequest", "Verdict", "LinkedHashMap", "`", "FEATURE", "Feature")) {
      assertFalse(body.contains(internal), what + " names " + internal + ": " + body);
    }
  }

  private static Map<String, Object> ordered(Object... pairs) {
    Map<String, Object> m = new LinkedHashMap<>();
    for (int i = 0; i < pairs.length; i += 2) {
      m.put((String) pairs[i], pairs[i + 1]);
    }
    return m;
  }

  private static String write(Object body) {
    try {
      return Http.JSON.writeValueAsString(body);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException(e);
    }
  }
}
