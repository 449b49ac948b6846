package org.precedent.api.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.api.suggest.FeedbackTraining;
import org.precedent.api.testing.ChildJvm;
import org.precedent.api.testing.Http;
import org.precedent.api.testing.Http.Caller;
import org.precedent.api.testing.RunningService;
import org.precedent.api.testing.TrainedData;
import org.precedent.engine.learn.TeamModelTrainer;
import org.precedent.engine.rerank.TrainingPair;
import org.precedent.knowledge.store.DataDir;
import org.precedent.knowledge.store.Knowledge;

/**
 * {@code train} learns from what agents sent: on the trained demo data, feedback recorded through
 * the service is added to the reranker's pairs once the service has stopped, and not read (with
 * training going on) while the service holds its database.
 */
class TrainFeedbackTest {
  static final Pattern PAIRS = Pattern.compile("reranker: (\\d+) pairs trained, (\\d+) validation");

  @TempDir
  Path tmp;

  private Path data;

  @AfterEach
  void removeData() {
    TrainedData.delete(data);
  }

  private ChildJvm startTraining(Path log) throws Exception {
    return ChildJvm.start(log, "--data", data.toString(), "train", "--epochs", "1",
        "--hidden", "16", "--embedding", "16", "--vocabulary", "500", "--answer-tokens", "16");
  }

  private static int pairs(String out) {
    Matcher m = PAIRS.matcher(out);
    assertTrue(m.find(), out);
    return Integer.parseInt(m.group(1)) + Integer.parseInt(m.group(2));
  }

  private static void feedback(Http http, Map<String, Object> body) {
    assertEquals(201, http.post("/api/v1/feedback", body, Caller.AGENT).status(), body.toString());
  }

  @Test
  void acceptedAndEditedAnswersAreAddedOnceTheServiceStopsAndSkippedWhileItRuns()
      throws Exception {
    String edited = "Hello Sam,\n\nA crew will collect the bin tomorrow before noon.\n\n"
        + "Kind regards,\nRiverside Council";
    data = TrainedData.copy();
    Knowledge knowledge = Knowledge.open(new DataDir(data)).orElseThrow();
    String storedTicket = knowledge.tickets().keySet().iterator().next();
    try (RunningService service = RunningService.startKeeping(data)) {
      Http http = service.http();
      JsonNode best = http.post("/api/v1/suggestions", Map.of("question",
          "my green bin was not emptied this week", "limit", 3), Caller.AGENT).json()
          .get("candidates").get(0);
      String group = best.get("answerGroup").asText();
      String shown = best.get("answer").asText();
      feedback(http, Map.of("question", "my green bin was not emptied this week",
          "answerGroup", group, "verdict", "ACCEPTED", "suggestedText", shown));
      feedback(http, Map.of("question", "my green bin was not emptied this week",
          "answerGroup", group, "verdict", "ACCEPTED", "suggestedText", shown));
      feedback(http, Map.of("question", "the bin lorry missed our street", "answerGroup", group,
          "verdict", "EDITED", "finalText", edited, "suggestedText", shown, "propose", true));
      feedback(http, Map.of("question", "can I have a bigger bin", "answerGroup", group,
          "verdict", "REJECTED", "suggestedText", shown));
      feedback(http, Map.of("ticketId", storedTicket, "question", "bin not emptied again",
          "answerGroup", group, "verdict", "ACCEPTED", "suggestedText", shown));
      feedback(http, Map.of("question", "which day is my bin day", "answerGroup", group,
          "verdict", "ACCEPTED", "suggestedText", "Your day is \u27e6slot:day\u27e7."));
      // The running service holds its database: train says so and goes on training without
      // the feedback (stopped once its first epoch runs: the full run is the one below).
      try (ChildJvm child = startTraining(tmp.resolve("while-serving.log"))) {
        String why = child.await(Pattern.compile("agents' feedback: not read: (.*)"),
            Duration.ofMinutes(3));
        assertTrue(why.startsWith("the service is running on " + data + " and holds its "
            + "database"), why);
        child.await(Pattern.compile("reranker epoch 1/"), Duration.ofMinutes(3));
      }
    }
    FeedbackTraining.Read read = FeedbackTraining.read(new DataDir(data), knowledge);
    assertEquals(null, read.unavailable());
    assertEquals(Map.of(FeedbackTraining.REJECTED, 1, FeedbackTraining.DUPLICATE, 1,
        FeedbackTraining.STORED, 1, FeedbackTraining.SLOTS, 1), read.skipped());
    List<TrainingPair> added = read.pairs();
    assertEquals(2, added.size(), added.toString());
    assertEquals("my green bin was not emptied this week", added.get(0).question());
    // Cleaned as an ingested reply: greeting and sign-off gone, the answer kept.
    String sent = added.get(1).answer();
    assertTrue(sent.contains("A crew will collect the bin tomorrow before noon."), sent);
    assertFalse(sent.contains("Hello Sam") || sent.contains("regards"), sent);
    Path log = tmp.resolve("stopped.log");
    try (ChildJvm child = startTraining(log)) {
      assertEquals(0, child.waitFor(), child.tail());
    }
    String out = Files.readString(log);
    assertTrue(out.contains("agents' feedback: 2 added, 4 skipped (1 " + FeedbackTraining.SLOTS
        + "; 1 " + FeedbackTraining.STORED + "; 1 " + FeedbackTraining.REJECTED + "; 1 "
        + FeedbackTraining.DUPLICATE + ")"), out);
    assertEquals(TeamModelTrainer.rerankerPairs(knowledge).size() + 2, pairs(out), out);
  }
}
