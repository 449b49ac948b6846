package org.precedent.api.threshold;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.ServiceForClass;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.decide.InForce;
import org.precedent.knowledge.store.DataDir;

/** Threshold changes: applied to the next decision, written to the data directory, audited. */
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class ThresholdServiceTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  private static Http http() {
    return service.http();
  }

  @Test
  @Order(1) // first: it starts from the default threshold
  void aChangeIsAppliedWrittenAndAudited() throws Exception {
    assertEquals(0.95, http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble(), 1e-9);
    Reply r = http().put("/api/v1/threshold", Map.of("global", 0.7, "perCategory",
        Map.of("billing", 0.99), "reason", "pilot week: answer more routine questions"),
        Caller.MANAGER);
    assertEquals(200, r.status(), r.raw().body());
    assertEquals("global=0.9500", r.json().get("old").asText());
    assertEquals("global=0.7000; billing=0.9900", r.json().get("new").asText());

    JsonNode d = http().post("/api/v1/decisions", Map.of("question", "bin not emptied"),
        Caller.AGENT).json();
    assertEquals(0.7, d.get("threshold").asDouble(), 1e-9);
    JsonNode billing = http().post("/api/v1/decisions", Map.of("question", "bin not emptied",
        "category", "billing"), Caller.AGENT).json();
    assertEquals(0.99, billing.get("threshold").asDouble(), 1e-9);

    String file = thresholdsFile();
    assertTrue(file.contains("global=0.7000") && file.contains("category.billing=0.9900"), file);

    JsonNode audit = http().get("/api/v1/threshold/changes", Caller.MANAGER).json().get(0);
    assertEquals("manager-key", audit.get("changedBy").asText());
    assertEquals("global=0.9500", audit.get("old").asText());
    assertEquals("pilot week: answer more routine questions", audit.get("reason").asText());
    assertTrue(audit.get("changedAt").asText().startsWith("20"));
  }

  @Test
  void aChangeWithoutAReasonOrOutOfRangeIsRefusedAndChangesNothing() {
    double before = http().get("/api/v1/threshold", Caller.MANAGER).json().get("global").asDouble();
    int audited = http().get("/api/v1/threshold/changes", Caller.MANAGER).json().size();
    Reply noReason = http().put("/api/v1/threshold", Map.of("global", 0.5), Caller.MANAGER);
    assertEquals(400, noReason.status());
    assertEquals("reason", noReason.json().get("errors").get(0).get("field").asText());
    Reply tooHigh = http().put("/api/v1/threshold", Map.of("global", 1.5, "reason", "x"),
        Caller.MANAGER);
    assertEquals(400, tooHigh.status());
    assertEquals("global", tooHigh.json().get("errors").get(0).get("field").asText());
    Reply badCategory = http().put("/api/v1/threshold", Map.of("global", 0.5, "reason", "x",
        "perCategory", Map.of("water", -0.1)), Caller.MANAGER);
    assertEquals(400, badCategory.status());
    assertEquals("perCategory.water",
        badCategory.json().get("errors").get(0).get("field").asText());
    Reply twoNames = http().put("/api/v1/threshold", Map.of("global", 0.5, "reason", "x",
        "perCategory", Map.of("Water", 0.8, "water", 0.9)), Caller.MANAGER);
    assertEquals(400, twoNames.status());
    assertEquals("perCategory", twoNames.json().get("errors").get(0).get("field").asText());
    assertTrue(twoNames.json().get("errors").get(0).get("message").asText()
        .contains("differ only in case"), twoNames.json().toString());
    assertEquals(before, http().get("/api/v1/threshold", Caller.MANAGER).json().get("global")
        .asDouble());
    assertEquals(audited, http().get("/api/v1/threshold/changes", Caller.MANAGER).json().size());
  }

  @Test
  void withoutAnEvaluationTheReportIs404() {
    Reply r = http().get("/api/v1/threshold/evaluation", Caller.MANAGER);
    assertEquals(404, r.status());
    assertTrue(r.json().get("detail").asText().contains("precedent evaluate"));
  }

  /** Category names a help desk may use that are awkward in a properties file. */
  static final List<String> AWKWARD = List.of("green bins", "Água e esgoto", "請求書",
      "rate=band", "billing: arrears", "#urgent", "!important", "C:\\shares\\billing", "a\\u12",
      "trailing\\", "emoji 🚰 leak");

  @Test
  void awkwardCategoryNamesAreKeptExactlyAndSurviveARestart() throws Exception {
    Map<String, Double> perCategory = new TreeMap<>();
    for (int i = 0; i < AWKWARD.size(); i++) {
      perCategory.put(AWKWARD.get(i), (50 + i) / 100.0);
    }
    Reply r = http().put("/api/v1/threshold", Map.of("global", 0.9, "perCategory", perCategory,
        "reason", "categories as the help desk names them"), Caller.MANAGER);
    assertEquals(200, r.status(), r.raw().body());
    assertEquals(perCategory, perCategory(http()));
    assertEquals(perCategory, InForce.readThresholds(new DataDir(service.data()))
        .perCategory());
    JsonNode d = http().post("/api/v1/decisions", Map.of("question", "bin not emptied",
        "category", "a\\u12"), Caller.AGENT).json();
    assertEquals(perCategory.get("a\\u12"), d.get("threshold").asDouble(), 1e-9);

    Path copy = Files.createTempDirectory("precedent-restart-");
    TrainedData.copyTree(service.data(), copy);
    // A fresh service database: only the thresholds file is carried over.
    TrainedData.delete(copy.resolve("service"));
    try (RunningService again = RunningService.startOn(copy)) {
      assertEquals(perCategory, perCategory(again.http()));
    }
  }

  private static String thresholdsFile() throws java.io.IOException {
    Path file = service.data().resolve("thresholds.properties");
    return Files.exists(file) ? Files.readString(file) : "(none)";
  }

  private static Map<String, Double> perCategory(Http on) {
    Map<String, Double> out = new TreeMap<>();
    on.get("/api/v1/threshold", Caller.MANAGER).json().get("perCategory").fields()
        .forEachRemaining(e -> out.put(e.getKey(), e.getValue().asDouble()));
    return out;
  }

  @Test
  void unusableCategoryNamesAreRefusedNamingTheField() throws Exception {
    String file = thresholdsFile();
    for (String bad : List.of(" bins", "line\nbreak", "zero\u200bwidth", "x".repeat(201))) {
      Reply r = http().put("/api/v1/threshold", Map.of("global", 0.5, "reason", "x",
          "perCategory", Map.of(bad, 0.5)), Caller.MANAGER);
      assertEquals(400, r.status(), r.raw().body());
      assertEquals("perCategory", r.json().get("errors").get(0).get("field").asText());
    }
    assertEquals(file, thresholdsFile());
  }

  @Test
  void moreCategoriesThanTheAuditRecordHoldsIs400AndChangesNothing() throws Exception {
    String file = thresholdsFile();
    int audited = http().get("/api/v1/threshold/changes", Caller.MANAGER).json().size();
    // threshold_change.new_value is VARCHAR(4000) in V1__init.sql: 30 names of 150 characters
    // do not fit.
    Map<String, Double> perCategory = new TreeMap<>();
    for (int i = 0; i < 30; i++) {
      perCategory.put(String.format("%03d", i) + "c".repeat(147), 0.9);
    }
    Reply r = http().put("/api/v1/threshold", Map.of("global", 0.5, "reason", "many",
        "perCategory", perCategory), Caller.MANAGER);
    assertEquals(400, r.status(), r.raw().body());
    assertEquals("perCategory", r.json().get("errors").get(0).get("field").asText());
    assertTrue(r.json().get("detail").asText().contains("4000"), r.raw().body());
    Reply longReason = http().put("/api/v1/threshold", Map.of("global", 0.5,
        "reason", "because ".repeat(250) + "x"), Caller.MANAGER);
    assertEquals(400, longReason.status(), longReason.raw().body());
    assertEquals("reason", longReason.json().get("errors").get(0).get("field").asText());
    assertTrue(longReason.json().get("detail").asText().contains("2000"), longReason.raw().body());
    assertEquals(file, thresholdsFile());
    assertEquals(audited, http().get("/api/v1/threshold/changes", Caller.MANAGER).json().size());
  }
}
