package org.precedent.knowledge.retrieve;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.precedent.knowledge.group.AnswerGroup;
import org.precedent.knowledge.group.Grouping;
import org.precedent.knowledge.io.Progress;
import org.precedent.knowledge.ticket.Ticket;

/**
 * The BM25 scores reported for evidence tickets equal the formula computed by hand.
 *
 * <p>Source: Robertson and Zaragoza 2009, "The Probabilistic Relevance Framework: BM25 and Beyond",
 * eq. 3.15, with Lucene's idf and without the constant (k1 + 1) factor, as Lucene's BM25Similarity
 * documentation (9.x) gives it: idf(t) = ln(1 + (N - n(t) + 0.5) / (n(t) + 0.5)), and
 * score(q, d) = sum over t in q of idf(t) * tf / (tf + k1 * (1 - b + b * |d| / avgdl)).
 * The documents are short, so Lucene's one-byte length norm stores |d| exactly.
 */
class Bm25ScoreTest {
  @TempDir
  Path dir;

  // Words chosen to be no English stop words and to stem to themselves or to an obvious stem.
  private static final List<String> QUESTIONS = List.of(
      "meter meter leak",            // meter x2, leak
      "leak pipe garden",            // leak, pipe, garden
      "bill payment",                // bill, payment
      "meter bill garden pipe leak"  // meter, bill, garden, pipe, leak
  );

  @Test
  void reportedScoresEqualTheFormulaByHand() throws Exception {
    List<Ticket> tickets = new java.util.ArrayList<>();
    for (int i = 0; i < QUESTIONS.size(); i++) {
      tickets.add(new Ticket("t" + i, QUESTIONS.get(i), "answer " + i, "g" + i, null, null));
    }
    List<AnswerGroup> groups = tickets.stream()
        .map(t -> new AnswerGroup(t.label(), t.reply(), t.label(), null, List.of(t.id()))).toList();
    Grouping grouping = new Grouping(groups, List.of(), "test");
    Path index = Files.createDirectory(dir.resolve("index"));
    TicketIndex.build(index, tickets, grouping.groupOfTicket(), Map.of(), Progress.silent());

    try (Retriever retriever = Retriever.open(index, grouping)) {
      Retrieval r = retriever.retrieve("meter leak", RetrievalSettings.standard());
      Map<String, Double> reported = r.candidates().stream()
          .flatMap(c -> c.evidence().stream())
          .collect(Collectors.toMap(Evidence::ticketId, Evidence::score));

      double k1 = 1.2;
      double b = 0.75;
      double n = 4;                          // documents
      double avgdl = (3 + 3 + 2 + 5) / n;    // field lengths in terms
      double idfMeter = Math.log(1 + (n - 2 + 0.5) / (2 + 0.5));  // "meter" in t0, t3
      double idfLeak = Math.log(1 + (n - 3 + 0.5) / (3 + 0.5));   // "leak" in t0, t1, t3

      double t0 = idfMeter * tf(2, 3, avgdl, k1, b) + idfLeak * tf(1, 3, avgdl, k1, b);
      double t1 = idfLeak * tf(1, 3, avgdl, k1, b);
      double t3 = idfMeter * tf(1, 5, avgdl, k1, b) + idfLeak * tf(1, 5, avgdl, k1, b);

      assertEquals(3, reported.size(), "t2 shares no term and must not be retrieved");
      assertEquals(t0, reported.get("t0"), 1e-5);
      assertEquals(t1, reported.get("t1"), 1e-5);
      assertEquals(t3, reported.get("t3"), 1e-5);
      assertEquals(List.of("meter", "leak"), r.queryTerms());
    }
  }

  private static double tf(double freq, double dl, double avgdl, double k1, double b) {
    return freq / (freq + k1 * (1 - b + b * dl / avgdl));
  }
}
