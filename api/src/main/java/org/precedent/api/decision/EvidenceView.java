package org.precedent.api.decision;

import java.util.List;
import org.precedent.knowledge.retrieve.Evidence;
import org.precedent.knowledge.retrieve.Match;

/**
 * A past ticket behind a proposed answer.
 *
 * @param ticketId its id
 * @param score    how well its question matches the new one (BM25)
 * @param question its question, cleaned and redacted
 * @param category its category, if any
 * @param spans    the stretches of {@code question} that match words of the new question
 */
public record EvidenceView(String ticketId, double score, String question, String category,
    List<Span> spans) {

  /**
   * A matching stretch: characters {@code start} (inclusive) to {@code end} (exclusive).
   *
   * @param term the shared word, as the index stores it (lower case, stemmed)
   */
  public record Span(int start, int end, String term) {}

  /** The question with each matching span wrapped in {@code open} and {@code close}. */
  public String highlighted(String open, String close) {
    return new Evidence(ticketId, score, question, category,
        spans.stream().map(s -> new Match(s.start(), s.end(), s.term())).toList())
        .highlighted(open, close);
  }

  static EvidenceView of(Evidence e) {
    return new EvidenceView(e.ticketId(), e.score(), e.question(), e.category(),
        e.matches().stream().map(m -> new Span(m.start(), m.end(), m.term())).toList());
  }
}
