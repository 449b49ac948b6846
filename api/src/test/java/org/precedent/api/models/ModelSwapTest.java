package org.precedent.api.models;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.RegisterExtension;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.Http.Reply;
import org.precedent.api.testing.ServiceForClass;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.rerank.RerankerConfig;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/** Switching model versions: audited, persisted, and invisible to requests in flight. */
class ModelSwapTest {
  @RegisterExtension
  static final ServiceForClass service = new ServiceForClass();

  private static Http http() {
    return service.http();
  }

  private static String active() {
    return http().get("/api/v1/models", Caller.MANAGER).json().get("active").asText();
  }

  @Test
  void swapsUnderConcurrentRequestsFailNone() throws Exception {
    String[] questions = {"My green bin was not emptied", "How do I send a meter reading?",
        "Can I pay my bill in instalments?", "The water pressure is low today"};
    AtomicBoolean stop = new AtomicBoolean();
    AtomicInteger ok = new AtomicInteger();
    List<String> failures = new CopyOnWriteArrayList<>();
    Set<String> versionsSeen = ConcurrentHashMap.newKeySet();
    ExecutorService callers = Executors.newFixedThreadPool(4);
    for (int t = 0; t < 4; t++) {
      int first = t;
      callers.submit(() -> {
        for (int i = first; !stop.get(); i++) {
          Reply r = http().post("/api/v1/decisions", Map.of("question",
              questions[i % questions.length]), Caller.AGENT);
          if (r.status() == 200) {
            ok.incrementAndGet();
            versionsSeen.add(r.json().get("modelVersion").asText());
          } else {
            failures.add(r.status() + " " + r.raw().body());
          }
        }
      });
    }
    for (int swap = 0; swap < 6; swap++) {
      String to = swap % 2 == 0 ? "v-0002" : "v-0001";
      // Two copies of one version, never compared with each other: acknowledged.
      Reply r = http().post("/api/v1/models/" + to + "/activation",
          Map.of("reason", "swap " + swap + " under load", "acknowledged", true), Caller.MANAGER);
      assertEquals(200, r.status(), r.raw().body());
      Thread.sleep(300);
    }
    stop.set(true);
    callers.shutdown();
    assertTrue(callers.awaitTermination(60, TimeUnit.SECONDS));
    assertEquals(List.of(), failures);
    assertTrue(ok.get() > 20, "requests answered during the swaps: " + ok.get());
    assertEquals(Set.of("v-0001", "v-0002"), versionsSeen);
  }

  @Test
  void rollbackReturnsToThePreviousVersionAndBothAreAudited() throws Exception {
    String start = active();
    String other = start.equals("v-0001") ? "v-0002" : "v-0001";
    assertEquals(200, http().post("/api/v1/models/" + other + "/activation",
        Map.of("reason", "try the other one", "acknowledged", true), Caller.MANAGER).status());
    assertEquals(other, active());
    assertEquals(other, Files.readString(service.data().resolve("models/ACTIVE")).strip());
    Reply back = http().post("/api/v1/models/rollback", Map.of("reason", "worse"), Caller.MANAGER);
    assertEquals(200, back.status(), back.raw().body());
    assertEquals(start, back.json().get("active").asText());
    assertEquals(start, active());
    var activations = http().get("/api/v1/models", Caller.MANAGER).json().get("activations");
    assertEquals("worse", activations.get(0).get("reason").asText());
    assertEquals("manager-key", activations.get(0).get("activatedBy").asText());
  }

  @Test
  void anUnknownOrDamagedVersionLeavesTheActiveOneInForce() throws Exception {
    String before = active();
    Reply unknown = http().post("/api/v1/models/v-0042/activation", Map.of("reason", "x"),
        Caller.MANAGER);
    assertEquals(404, unknown.status());
    TestCopies.damagedVersion(service.data(), "v-0003");
    Reply damaged = http().post("/api/v1/models/v-0003/activation", Map.of("reason", "x"),
        Caller.MANAGER);
    assertEquals(422, damaged.status(), damaged.raw().body());
    assertTrue(damaged.json().get("detail").asText().contains("corrupt"),
        damaged.json().toString());
    assertEquals(before, active());
    assertEquals(before, Files.readString(service.data().resolve("models/ACTIVE")).strip());
    assertEquals(200, http().post("/api/v1/decisions", Map.of("question", "bin"), Caller.AGENT)
        .status());
  }

  @Test
  void aHandEditedFusionModelIsRefusedAndTheOldOneStays() throws Exception {
    String before = active();
    Map<String, String> question = Map.of("question", "The recycling lorry skipped our street");
    double confidence = http().post("/api/v1/decisions", question, Caller.AGENT).json()
        .get("confidence").asDouble();
    assertTrue(confidence < 0.99, "the trained model is not that sure: " + confidence);
    TestCopies.overconfidentVersion(service.data(), "v-0005");
    Reply r = http().post("/api/v1/models/v-0005/activation", Map.of("reason", "try it"),
        Caller.MANAGER);
    assertEquals(422, r.status(), r.raw().body());
    String detail = r.json().get("detail").asText();
    assertTrue(detail.contains("v-0005/fusion.json"), detail);
    assertTrue(detail.contains("the model in force is unchanged"), detail);
    assertEquals(before, active());
    assertEquals(before, Files.readString(service.data().resolve("models/ACTIVE")).strip());
    var d = http().post("/api/v1/decisions", question, Caller.AGENT).json();
    assertEquals(before, d.get("modelVersion").asText());
    assertEquals(confidence, d.get("confidence").asDouble(), 1e-9);
  }

  @Test
  void aVersionMadeByAnEarlierReleaseIsRefusedWithAdviceToTrainAgain() throws Exception {
    String before = active();
    TestCopies.earlierReleaseVersion(service.data(), "v-0006");
    Reply r = http().post("/api/v1/models/v-0006/activation", Map.of("reason", "old one"),
        Caller.MANAGER);
    assertEquals(422, r.status(), r.raw().body());
    String detail = r.json().get("detail").asText();
    assertTrue(detail.contains("v-0006/fusion.json") && detail.contains("not in the checksum "
        + "manifest") && detail.contains("precedent train"), detail);
    assertEquals(before, active());
  }

  @Test
  void aReasonLongerThanTheAuditKeepsIs400AndChangesNothing() throws Exception {
    String before = active();
    int audited = http().get("/api/v1/models", Caller.MANAGER).json().get("activations").size();
    String other = before.equals("v-0001") ? "v-0002" : "v-0001";
    // model_activation.reason is VARCHAR(2000) in V1__init.sql.
    String tooLong = "because ".repeat(250) + "x";
    for (String path : List.of("/api/v1/models/" + other + "/activation",
        "/api/v1/models/rollback")) {
      Reply r = http().post(path, Map.of("reason", tooLong), Caller.MANAGER);
      assertEquals(400, r.status(), path + ": " + r.raw().body());
      assertEquals("reason", r.json().get("errors").get(0).get("field").asText());
      assertTrue(r.json().get("detail").asText().contains("2000"), r.raw().body());
    }
    assertEquals(before, active());
    assertEquals(audited,
        http().get("/api/v1/models", Caller.MANAGER).json().get("activations").size());
  }

  @Test
  void aVersionFromAnEarlierReleaseIsNotTakenAsAlreadyTrained() throws Exception {
    Path data = TrainedData.copy();
    try {
      var dir = new DataDir(data);
      var trainer = new TeamModelTrainer(dir,
          RerankerConfig.defaults());
      Knowledge knowledge = Knowledge.open(dir).orElseThrow();
      assertEquals(Optional.of("v-0001"), trainer.currentVersion(knowledge));
      TestCopies.earlierReleaseVersion(data, "v-0009");
      TrainedData.delete(data.resolve("models/v-0001"));
      Files.move(data.resolve("models/v-0009"), data.resolve("models/v-0001"));
      assertEquals(Optional.empty(), trainer.currentVersion(knowledge));
    } finally {
      TrainedData.delete(data);
    }
  }
}
