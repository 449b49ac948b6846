package org.precedent.knowledge.embed;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.ticket.Ticket;

/**
 * A re-ingest embeds only what changed: a ticket whose question is the same as the previous
 * generation's keeps its stored vector, one whose question changed is embedded again.
 */
class QuestionVectorsTest {
  @Test
  void unchangedQuestionsKeepTheirVectorsAndChangedOnesAreEmbeddedAgain() {
    try (SentenceEncoder encoder = SentenceEncoder.open()) {
      // A marker vector no model would give: if it comes back, it was taken over, not recomputed.
      float[] marker = new float[encoder.dimension()];
      Arrays.fill(marker, 1f / (float) Math.sqrt(encoder.dimension()));
      Map<String, QuestionVectors.Stored> previous = Map.of(
          "same", new QuestionVectors.Stored("my bin was not emptied", marker),
          "changed", new QuestionVectors.Stored("an older wording", marker),
          "short", new QuestionVectors.Stored("how do I pay", new float[3]));
      List<Ticket> tickets = List.of(
          new Ticket("same", "my bin was not emptied", "reply", null, null, null),
          new Ticket("changed", "my meter reading is wrong", "reply", null, null, null),
          new Ticket("short", "how do I pay", "reply", null, null, null),
          new Ticket("new", "there is a leak in the street", "reply", null, null, null));
      Map<String, float[]> out = QuestionVectors.of(tickets, encoder, previous,
          Progress.silent());
      assertEquals(4, out.size());
      assertArrayEquals(marker, out.get("same"), "same question: the stored vector is reused");
      assertArrayEquals(encoder.embed("my meter reading is wrong"), out.get("changed"), 0f);
      // A stored vector of the wrong length (another encoder's) is never reused.
      assertEquals(encoder.dimension(), out.get("short").length);
      assertArrayEquals(encoder.embed("there is a leak in the street"), out.get("new"), 0f);
      assertNotEquals(marker[0], out.get("changed")[0]);
    }
  }
}
