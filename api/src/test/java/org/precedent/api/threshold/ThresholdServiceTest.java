package org.precedent.api.threshold;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;

/** Threshold changes: applied to the next decision, written to the data directory, audited. */
class ThresholdServiceTest {
  static RunningService service;
  static Http http;

  @BeforeAll
  static void start() {
    service = RunningService.start();
    http = service.http();
  }

  @AfterAll
  static void stop() {
    service.close();
  }

  @Test
  void aChangeIsAppliedWrittenAndAudited() throws Exception {
    assertEquals(0.95, http.get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble(), 1e-9);
    Reply r = http.put("/api/v1/threshold", Map.of("global", 0.7, "perCategory",
        Map.of("billing", 0.99), "reason", "pilot week: answer more routine questions"),
        Caller.MANAGER);
    assertEquals(200, r.status(), r.raw().body());
    assertEquals("global=0.9500", r.json().get("old").asText());
    assertEquals("global=0.7000; billing=0.9900", r.json().get("new").asText());

    JsonNode d = http.post("/api/v1/decisions", Map.of("question", "bin not emptied"),
        Caller.AGENT).json();
    assertEquals(0.7, d.get("threshold").asDouble(), 1e-9);
    JsonNode billing = http.post("/api/v1/decisions", Map.of("question", "bin not emptied",
        "category", "billing"), Caller.AGENT).json();
    assertEquals(0.99, billing.get("threshold").asDouble(), 1e-9);

    String file = Files.readString(service.data().resolve("thresholds.properties"));
    assertTrue(file.contains("global=0.7000") && file.contains("category.billing=0.9900"), file);

    JsonNode audit = http.get("/api/v1/threshold/changes", Caller.MANAGER).json().get(0);
    assertEquals("manager-key", audit.get("changedBy").asText());
    assertEquals("global=0.9500", audit.get("old").asText());
    assertEquals("pilot week: answer more routine questions", audit.get("reason").asText());
    assertTrue(audit.get("changedAt").asText().startsWith("20"));
  }

  @Test
  void aChangeWithoutAReasonOrOutOfRangeIsRefusedAndChangesNothing() {
    double before = http.get("/api/v1/threshold", Caller.MANAGER).json().get("global").asDouble();
    int audited = http.get("/api/v1/threshold/changes", Caller.MANAGER).json().size();
    Reply noReason = http.put("/api/v1/threshold", Map.of("global", 0.5), Caller.MANAGER);
    assertEquals(400, noReason.status());
    assertEquals("reason", noReason.json().get("errors").get(0).get("field").asText());
    Reply tooHigh = http.put("/api/v1/threshold", Map.of("global", 1.5, "reason", "x"),
        Caller.MANAGER);
    assertEquals(400, tooHigh.status());
    assertEquals("global", tooHigh.json().get("errors").get(0).get("field").asText());
    Reply badCategory = http.put("/api/v1/threshold", Map.of("global", 0.5, "reason", "x",
        "perCategory", Map.of("water", -0.1)), Caller.MANAGER);
    assertEquals(400, badCategory.status());
    assertEquals("perCategory.water",
        badCategory.json().get("errors").get(0).get("field").asText());
    assertEquals(before, http.get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble());
    assertEquals(audited, http.get("/api/v1/threshold/changes", Caller.MANAGER).json().size());
  }

  @Test
  void withoutAnEvaluationTheReportIs404() {
    Reply r = http.get("/api/v1/threshold/evaluation", Caller.MANAGER);
    assertEquals(404, r.status());
    assertTrue(r.json().get("detail").asText().contains("precedent evaluate"));
  }
}
