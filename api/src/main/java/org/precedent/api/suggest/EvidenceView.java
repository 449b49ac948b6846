package org.precedent.api.suggest;

import java.util.List;
import org.precedent.knowledge.retrieve.Evidence;

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

  static EvidenceView of(Evidence e) {
    return new EvidenceView(e.ticketId(), e.score(), e.question(), e.category(),
        e.matches().stream().map(m -> new Span(m.start(), m.end(), m.term())).toList());
  }
}
