package org.precedent.knowledge.retrieve;

import java.util.LinkedHashSet;
import java.util.List;

/**
 * A past ticket that supports a candidate answer.
 *
 * @param ticketId the past ticket
 * @param score    its BM25 score for the new question
 * @param question its cleaned question
 * @param category its category, or null
 * @param matches  where it matches terms of the new question, in order
 */
public record Evidence(String ticketId, double score, String question, String category,
    List<Match> matches) {
  public Evidence {
    matches = List.copyOf(matches);
  }

  /** The distinct terms this ticket shares with the new question. */
  public List<String> matchedTerms() {
    LinkedHashSet<String> terms = new LinkedHashSet<>();
    matches.forEach(m -> terms.add(m.term()));
    return List.copyOf(terms);
  }

  /** The question with each matching span wrapped in {@code open} and {@code close}. */
  public String highlighted(String open, String close) {
    StringBuilder out = new StringBuilder();
    int at = 0;
    for (Match m : matches) {
      out.append(question, at, m.start()).append(open).append(question, m.start(), m.end())
          .append(close);
      at = m.end();
    }
    return out.append(question.substring(at)).toString();
  }
}
